import { Redirect, useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { View } from 'react-native';
import { signInRequestSchema } from '@/shared/auth';
import { Button, Text, space } from '@/features/ui';
import { useApiForm } from '../hooks/use-api-form';
import { safeNextPath } from '../next-path';
import { useSessionQuery, useSignInMutation } from '../queries';
import { AuthCard, FormError } from './auth-card';
import { FormField } from './form-field';
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

  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signIn.mutateAsync(values);
      router.replace(next as Href);
    } catch (error) {
      showServerError(error);
    }
  });

  // Someone already signed in has nothing to do here: on to where they were going.
  if (session.data?.user && !signIn.isPending) return <Redirect href={next as Href} />;

  const withNext = (path: string) => (params.next ? `${path}?next=${encodeURIComponent(next)}` : path) as Href;

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
          <TextLink href={'/forgot-password' as Href} label="Forgot your password?" />
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
