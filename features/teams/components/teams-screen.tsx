import { useRouter, type Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { createTeamRequestSchema, roleLabels } from '@/shared/teams';
import { FormError, FormField, ResendConfirmation, useApiForm, useSessionQuery, useSignOutMutation } from '@/features/auth';
import { Button, Card, Heading, Screen, Text, colors, radius, space, useDocumentTitle } from '@/features/ui';
import { useCreateTeamMutation, useTeamsQuery } from '../queries';
import { TeamLink } from './team-link';

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
  useDocumentTitle('Your teams');

  const doSignOut = async (everywhere: boolean) => {
    await signOut.mutateAsync(everywhere);
    router.replace('/sign-in' as Href);
  };

  return (
    <Screen>
      <Heading level={1}>Your teams</Heading>
      <View style={styles.list} role="list">
        {teams.data?.map((team) => {
          const name = team.personal ? 'Personal workspace' : team.name;
          const members = `${team.memberCount} ${team.memberCount === 1 ? 'member' : 'members'}`;
          return (
            <View key={team.id} role="listitem" style={styles.team} testID={`team-row-${team.name}`}>
              <View style={styles.teamText}>
                <Text weight="semibold">{name}</Text>
                <Text variant="small" tone="muted">
                  {roleLabels[team.role]} · {members}
                </Text>
              </View>
              <View style={[styles.row, styles.wrap]}>
                <TeamLink href={`/teams/${team.id}/notebooks`} label="Designs" accessibilityLabel={`Designs of ${name}`} primary testID={`team-designs-${team.name}`} />
                <TeamLink href={`/teams/${team.id}/members`} label="Members" accessibilityLabel={`Members of ${name}, ${members}`} testID={`team-${team.name}`} />
              </View>
            </View>
          );
        })}
      </View>
      {teams.isPending ? <Text tone="muted">Loading your teams…</Text> : null}
      {teams.isError ? <Text tone="danger">{teams.error.message}</Text> : null}

      <CreateTeamForm />

      {user ? (
        <Card title="Your account">
          <Text>
            Signed in as <Text weight="semibold">{user.displayName}</Text> ({user.email})
          </Text>
          {!user.emailVerified ? (
            <>
              <Text variant="small" tone="warning">
                Your e-mail address is not confirmed yet: follow the link we sent you.
              </Text>
              <ResendConfirmation email={user.email} />
            </>
          ) : null}
          <View style={[styles.row, styles.wrap]}>
            <TeamLink href="/settings" label="Settings" accessibilityLabel="Settings: which review e-mails you get" testID="account-settings" />
          </View>
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
    gap: space.md,
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
  },
  teamText: { gap: space.xxs, flexShrink: 1, minWidth: 160 },
  row: { flexDirection: 'row', gap: space.sm },
  wrap: { flexWrap: 'wrap' },
});
