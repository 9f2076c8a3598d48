import { Redirect, useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { View } from 'react-native';
import { signInRequestSchema } from '@/shared/auth';
import { Button, Text, space, useDocumentTitle } from '@/features/ui';
import { useApiForm } from '../hooks/use-api-form';
import { safeNextPath } from '../next-path';
import { useSessionQuery, useSignInMutation } from '../queries';
import { AuthCard, FormError } from './auth-card';
import { FormField } from './form-field';
import { ResendConfirmation } from './resend-confirmation';
import { TextLink } from './text-link';

export function SignInScreen() {
  const params = useLocalSearchParams<{ next?: string; email?: string }>();
  const router = useRouter();
  const next = safeNextPath(params.next);
  const session = useSessionQuery();
  const signIn = useSignInMutation();
  const { form, formError, setFormError, showServerError } = useApiForm(signInRequestSchema, {
    email: params.email ?? '',
    password: '',
  });

  // The address typed so far goes along to "Forgot your password?", so it need not be typed twice.
  const typedEmail = form.watch('email').trim();
  useDocumentTitle('Sign in');

  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      const { user } = await signIn.mutateAsync(values);
      // An unconfirmed address stays here a moment, to be offered a new confirmation e-mail.
      if (user.emailVerified) router.replace(next as Href);
    } catch (error) {
      showServerError(error);
    }
  });

  const signedIn = signIn.data?.user;
  if (signedIn && !signedIn.emailVerified) {
    return (
      <AuthCard title="You are signed in" lead={`${signedIn.email} is not confirmed yet.`}>
        <Text testID="sign-in-unconfirmed">
          You can work on your own designs now. To join a team you are invited to, open the link we e-mailed
          you when you signed up; if it has expired or gone missing, ask for a new one here.
        </Text>
        <ResendConfirmation email={signedIn.email} />
        <Button label="Continue" onPress={() => router.replace(next as Href)} testID="sign-in-continue" />
      </AuthCard>
    );
  }

  // Someone already signed in has nothing to do here: on to where they were going.
  if (session.data?.user && !signIn.isPending) return <Redirect href={next as Href} />;

  const withNext = (path: string) => (params.next ? `${path}?next=${encodeURIComponent(next)}` : path) as Href;
  const forgotHref = (typedEmail ? `/forgot-password?email=${encodeURIComponent(typedEmail)}` : '/forgot-password') as Href;

  return (
    <AuthCard
      title="Sign in"
      lead="Your team’s design notebooks are waiting. The workbench works without an account."
      footer={
        <>
          <View style={{ flexDirection: 'row', gap: space.xs, flexWrap: 'wrap', justifyContent: 'center' }}>
            <Text tone="muted">New here?</Text>
            <TextLink href={withNext('/sign-up')} label="Create an account" testID="to-sign-up" />
          </View>
          <TextLink href={forgotHref} label="Forgot your password?" testID="to-forgot-password" />
        </>
      }
    >
      <FormField
        control={form.control}
        name="email"
        label="E-mail"
        autoComplete="email"
        inputMode="email"
        autoCapitalize="none"
        testID="email"
        onSubmitEditing={submit}
      />
      <FormField
        control={form.control}
        name="password"
        label="Password"
        autoComplete="current-password"
        secureTextEntry
        testID="password"
        onSubmitEditing={submit}
      />
      <FormError message={formError} />
      <Button label={signIn.isPending ? 'Signing in…' : 'Sign in'} onPress={submit} disabled={signIn.isPending} testID="sign-in-submit" />
    </AuthCard>
  );
}
