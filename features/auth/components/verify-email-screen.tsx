import { useLocalSearchParams, type Href } from 'expo-router';
import { useEffect, useRef } from 'react';
import { Text } from '@/features/ui';
import { useVerifyEmailMutation } from '../queries';
import { AuthCard } from './auth-card';
import { TextLink } from './text-link';

export function VerifyEmailScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  const verify = useVerifyEmailMutation();
  const sent = useRef(false);
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
    </AuthCard>
  );
}
