import { useRouter, type Href } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { createTeamRequestSchema, roleLabels } from '@/shared/teams';
import { FormError, FormField, useApiForm, useSessionQuery, useSignOutMutation } from '@/features/auth';
import { Button, Card, Heading, Screen, Text, colors, radius, space } from '@/features/ui';
import { useCreateTeamMutation, useTeamsQuery } from '../queries';

function CreateTeamForm() {
  const router = useRouter();
  const create = useCreateTeamMutation();
  const { form, formError, setFormError, showServerError } = useApiForm(createTeamRequestSchema, { name: '' });
  const submit = form.handleSubmit(async ({ name }) => {
    setFormError(null);
    try {
      const { team } = await create.mutateAsync(name);
      router.push(`/teams/${team.id}/members` as Href);
    } catch (error) {
      showServerError(error);
    }
  });
  return (
    <Card title="Start a team">
      <FormField control={form.control} name="name" label="Team name" hint="For example your lab, course or instrument project." testID="team-name-input" onSubmitEditing={submit} />
      <FormError message={formError} />
      <View style={styles.row}>
        <Button label={create.isPending ? 'Creating…' : 'Create team'} onPress={submit} disabled={create.isPending} testID="create-team" />
      </View>
    </Card>
  );
}

/** Where a signed-in person lands: their teams (the team switcher's home) and their account. */
export function TeamsScreen() {
  const router = useRouter();
  const session = useSessionQuery();
  const teams = useTeamsQuery();
  const signOut = useSignOutMutation();
  const user = session.data?.user;

  const doSignOut = async (everywhere: boolean) => {
    await signOut.mutateAsync(everywhere);
    router.replace('/sign-in' as Href);
  };

  return (
    <Screen>
      <Heading level={1}>Your teams</Heading>
      <View style={styles.list} role="list">
        {teams.data?.map((team) => (
          <Pressable
            key={team.id}
            role="link"
            accessibilityLabel={`${team.personal ? 'Personal workspace' : team.name}, ${roleLabels[team.role]}, ${team.memberCount} ${team.memberCount === 1 ? 'member' : 'members'}`}
            onPress={() => router.push(`/teams/${team.id}/members` as Href)}
            style={({ hovered }: { pressed: boolean; hovered?: boolean }) => [styles.team, hovered && styles.teamHovered]}
            testID={`team-${team.name}`}
          >
            <Text weight="semibold">{team.personal ? 'Personal workspace' : team.name}</Text>
            <Text variant="small" tone="muted">
              {roleLabels[team.role]} · {team.memberCount} {team.memberCount === 1 ? 'member' : 'members'}
            </Text>
          </Pressable>
        ))}
        {teams.isPending ? <Text tone="muted">Loading your teams…</Text> : null}
        {teams.isError ? <Text tone="danger">{teams.error.message}</Text> : null}
      </View>

      <CreateTeamForm />

      {user ? (
        <Card title="Your account">
          <Text>
            Signed in as <Text weight="semibold">{user.displayName}</Text> ({user.email})
          </Text>
          {!user.emailVerified ? (
            <Text variant="small" tone="warning">
              Your e-mail address is not confirmed yet: follow the link we sent you.
            </Text>
          ) : null}
          <View style={[styles.row, styles.wrap]}>
            <Button kind="secondary" label="Sign out" onPress={() => void doSignOut(false)} disabled={signOut.isPending} testID="sign-out" />
            <Button kind="quiet" label="Sign out on every device" onPress={() => void doSignOut(true)} disabled={signOut.isPending} />
          </View>
        </Card>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  team: {
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.lg,
    padding: space.lg,
    gap: space.xxs,
  },
  teamHovered: { borderColor: colors.primary },
  row: { flexDirection: 'row', gap: space.sm },
  wrap: { flexWrap: 'wrap' },
});
