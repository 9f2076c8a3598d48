import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { confirmEmailFirstMessage } from '@/shared/auth';
import { roleLabels } from '@/shared/teams';
import { ApiError } from '@/features/api';
import { AuthCard, FormError, ResendConfirmation, TextLink, useSessionQuery, useSignOutMutation } from '@/features/auth';
import { Button, Text, space, useDocumentTitle } from '@/features/ui';
import { useAcceptInvitationMutation, useInvitationPreviewQuery } from '../queries';

/** The page an invitation e-mail links to: accept it signed in, or sign in / sign up first. */
export function InvitationScreen() {
  const { token = '' } = useLocalSearchParams<{ token: string }>();
  const router = useRouter();
  const preview = useInvitationPreviewQuery(token);
  // An invitee who has not confirmed the address does so from the e-mail, often in another tab or
  // on another device: read the session afresh on coming back here, so the Accept button appears.
  const session = useSessionQuery({
    refetchOnMount: 'always',
    refetchOnWindowFocus: (query) => query.state.data?.user?.emailVerified === false,
  });
  const accept = useAcceptInvitationMutation(token);
  const signOut = useSignOutMutation();
  const here = `/invitations/${token}`;
  useDocumentTitle(preview.data ? `Join ${preview.data.teamName}` : 'Invitation');

  if (preview.isPending || session.isPending) {
    return (
      <AuthCard title="Invitation">
        <Text tone="muted">Opening the invitation…</Text>
      </AuthCard>
    );
  }
  if (preview.isError) {
    return (
      <AuthCard title="Invitation" footer={<TextLink href={'/' as Href} label="Go to Blazebook" />}>
        <Text testID="invitation-invalid">{preview.error.message}</Text>
      </AuthCard>
    );
  }

  const invite = preview.data;
  const user = session.data?.user ?? null;
  const forYou = user?.email === invite.email;
  const query = `next=${encodeURIComponent(here)}&email=${encodeURIComponent(invite.email)}`;

  const onAccept = async () => {
    try {
      const { team } = await accept.mutateAsync();
      // A new member came for the team's designs: land on them (members are one tab away).
      router.replace(`/teams/${team.id}/notebooks` as Href);
    } catch (error) {
      // The address lost its confirmation elsewhere, or this page's session is old: show why.
      if (error instanceof ApiError && error.code === 'email_unverified') void session.refetch();
    }
  };

  return (
    <AuthCard
      title={`Join ${invite.teamName}`}
      lead={`${invite.invitedBy ?? 'An owner'} invited ${invite.email} to this team as ${roleLabels[invite.role].toLowerCase()}.`}
    >
      {user && forYou && !user.emailVerified ? (
        <>
          <Text testID="invitation-confirm-first">{confirmEmailFirstMessage(user.email)}</Text>
          <ResendConfirmation email={user.email} />
        </>
      ) : user && forYou ? (
        <>
          <FormError message={accept.isError ? accept.error.message : null} />
          <Button label={accept.isPending ? 'Joining…' : 'Accept the invitation'} onPress={() => void onAccept()} disabled={accept.isPending} testID="accept-invitation" />
        </>
      ) : user ? (
        <>
          <Text>
            You are signed in as {user.email}. This invitation is for {invite.email}: sign out, then sign in with that address.
          </Text>
          <View style={styles.row}>
            <Button kind="secondary" label="Sign out" onPress={() => void signOut.mutateAsync(false)} />
          </View>
        </>
      ) : invite.accountExists ? (
        <View style={styles.row}>
          <Button label="Sign in to accept" onPress={() => router.push(`/sign-in?${query}` as Href)} testID="invitation-sign-in" />
        </View>
      ) : (
        <>
          <Text>Create your account with {invite.email} to join. It takes a minute.</Text>
          <View style={[styles.row, styles.wrap]}>
            <Button label="Create an account" onPress={() => router.push(`/sign-up?${query}` as Href)} testID="invitation-sign-up" />
            <Button kind="quiet" label="I already have one" onPress={() => router.push(`/sign-in?${query}` as Href)} />
          </View>
        </>
      )}
    </AuthCard>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: space.sm },
  wrap: { flexWrap: 'wrap' },
});
