import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { useEffect, useRef } from 'react';
import { View } from 'react-native';
import { Button, Text, space, useDocumentTitle } from '@/features/ui';
import { useSessionQuery, useVerifyEmailMutation } from '../queries';
import { AuthCard } from './auth-card';
import { ResendConfirmation } from './resend-confirmation';
import { TextLink } from './text-link';

/** What a link that did not work can lead to: a new one for whoever is (or will be) signed in. */
function AskForANewLink() {
  const router = useRouter();
  const session = useSessionQuery();
  const user = session.data?.user;
  if (session.isPending) return null;
  if (user?.emailVerified) {
    return <Text testID="verify-already">{user.email} is confirmed already: there is nothing more to do.</Text>;
  }
  if (user) return <ResendConfirmation email={user.email} kind="primary" />;
  // A new link goes to the signed-in account; sign-in offers it to an unconfirmed address.
  return (
    <View style={{ gap: space.sm }}>
      <Text tone="muted">Sign in first: we send the new link to your account’s address.</Text>
      <View style={{ flexDirection: 'row' }}>
        <Button label="Send a new confirmation e-mail" onPress={() => router.push('/sign-in' as Href)} testID="send-confirmation" />
      </View>
    </View>
  );
}

export function VerifyEmailScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  const verify = useVerifyEmailMutation();
  const sent = useRef(false);
  useDocumentTitle('Confirm your e-mail');
  useEffect(() => {
    // Once: the token is single use, and a second call would report it as spent.
    if (token && !sent.current) {
      sent.current = true;
      verify.mutate(token);
    }
  }, [token, verify]);

  const message = !token
    ? 'This page needs the link from the e-mail we sent you.'
    : verify.isSuccess
      ? `Thank you: ${verify.data.user.email} is confirmed.`
      : verify.isError
        ? verify.error.message
        : 'Confirming your address…';
  return (
    <AuthCard title="Confirm your e-mail" footer={<TextLink href={'/teams' as Href} label="Go to your teams" />}>
      <Text tone={verify.isError ? 'danger' : 'default'} testID="verify-result">
        {message}
      </Text>
      {!token || verify.isError ? <AskForANewLink /> : null}
    </AuthCard>
  );
}
