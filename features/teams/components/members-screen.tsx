import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { formatDay } from '@/shared/format';
import { can, roleLabels, type Member, type Role } from '@/shared/teams';
import { ApiError } from '@/features/api';
import { useSessionQuery } from '@/features/auth';
import { Button, Card, Heading, Screen, Text, space, useDocumentTitle } from '@/features/ui';
import {
  useChangeRoleMutation,
  useInvitationsQuery,
  useMembersQuery,
  useRemoveMemberMutation,
  useRevokeInvitationMutation,
  useTeamQuery,
} from '../queries';
import { InviteForm } from './invite-form';
import { MembersTable } from './members-table';
import { TeamLink } from './team-link';
import { TeamSwitcher } from './team-switcher';

export function MembersScreen() {
  const { teamId = '' } = useLocalSearchParams<{ teamId: string }>();
  const router = useRouter();
  const session = useSessionQuery();
  const team = useTeamQuery(teamId);
  const members = useMembersQuery(teamId);
  const role = team.data?.role;
  const manage = can(role, 'members.manage');
  const invitations = useInvitationsQuery(teamId, can(role, 'invitations.manage'));
  const changeRole = useChangeRoleMutation(teamId);
  const remove = useRemoveMemberMutation(teamId);
  const revoke = useRevokeInvitationMutation(teamId);
  const [actionError, setActionError] = useState<string | null>(null);
  const userId = session.data?.user?.id ?? '';
  const teamName = team.data ? (team.data.personal ? 'Personal workspace' : team.data.name) : null;
  useDocumentTitle(team.isError ? 'No such team' : teamName ? `Members of ${teamName}` : 'Team members');

  if (team.isError) {
    const gone = team.error instanceof ApiError && team.error.status === 404;
    return (
      <Screen>
        <TeamSwitcher />
        <Heading level={1}>{gone ? 'No such team' : 'The team could not be loaded'}</Heading>
        <Text tone="muted">{gone ? 'It does not exist, or you are not in it.' : team.error.message}</Text>
      </Screen>
    );
  }

  const act = (work: Promise<unknown>) => {
    setActionError(null);
    work.catch((error: unknown) => setActionError(error instanceof Error ? error.message : 'That did not work.'));
  };
  const onChangeRole = (member: Member, next: Role) => act(changeRole.mutateAsync({ userId: member.userId, role: next }));
  const onRemove = (member: Member) => act(remove.mutateAsync(member.userId));
  const leave = () =>
    act(
      remove.mutateAsync(userId).then(() => {
        router.replace('/teams' as Href);
      }),
    );

  return (
    <Screen wide style={styles.page}>
      <TeamSwitcher currentTeamId={teamId} />
      <View style={styles.title}>
        <Heading level={1} testID="team-name">
          {teamName ?? 'Loading…'}
        </Heading>
        {role ? (
          <Text tone="muted" testID="my-role">
            You are {/^[aeiou]/i.test(roleLabels[role]) ? 'an' : 'a'} {roleLabels[role].toLowerCase()} of this {team.data?.personal ? 'workspace' : 'team'}.
          </Text>
        ) : null}
        {teamName ? (
          <View style={styles.links}>
            <TeamLink href={`/teams/${teamId}/notebooks`} label="Designs" accessibilityLabel={`Designs of ${teamName}`} primary testID="members-to-designs" />
          </View>
        ) : null}
      </View>

      <Card title="Members">
        {members.data ? (
          <MembersTable
            members={members.data}
            currentUserId={userId}
            canManage={manage && !team.data?.personal}
            busy={changeRole.isPending || remove.isPending}
            onChangeRole={onChangeRole}
            onRemove={onRemove}
          />
        ) : (
          <Text tone="muted">{members.isError ? members.error.message : 'Loading members…'}</Text>
        )}
        {actionError ? (
          <Text role="alert" tone="danger" weight="semibold" testID="members-error">
            {actionError}
          </Text>
        ) : null}
        {team.data && !team.data.personal ? (
          <View style={styles.leave}>
            <Button kind="secondary" label="Leave this team" onPress={leave} disabled={remove.isPending} testID="leave-team" />
          </View>
        ) : null}
      </Card>

      {manage && team.data && !team.data.personal ? (
        <Card title="Invite a colleague">
          <InviteForm teamId={teamId} />
        </Card>
      ) : null}
      {team.data?.personal ? (
        <Card>
          <Text tone="muted">Your personal workspace is yours alone. Create a team on the teams page to work with colleagues.</Text>
        </Card>
      ) : null}

      {invitations.data && invitations.data.length > 0 ? (
        <Card title="Waiting for an answer">
          {invitations.data.map((invitation) => (
            <View key={invitation.id} style={styles.invitation} testID={`invitation-${invitation.email}`}>
              <View style={styles.invitationText}>
                <Text weight="semibold">{invitation.email}</Text>
                <Text variant="small" tone="muted">
                  {roleLabels[invitation.role]} · sent {formatDay(invitation.createdAt)} · valid until {formatDay(invitation.expiresAt)}
                </Text>
              </View>
              <Button kind="quiet" label="Revoke" accessibilityLabel={`Revoke the invitation for ${invitation.email}`} onPress={() => act(revoke.mutateAsync(invitation.id))} />
            </View>
          ))}
        </Card>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  // Wider than a text page: the members table needs room for four columns.
  page: { maxWidth: 1040 },
  title: { gap: space.xs },
  links: { flexDirection: 'row', paddingTop: space.xs },
  leave: { flexDirection: 'row', paddingTop: space.sm },
  invitation: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md, flexWrap: 'wrap' },
  invitationText: { flexShrink: 1, minWidth: 0, gap: space.xxs },
});
