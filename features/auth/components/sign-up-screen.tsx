import { Redirect, useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { View } from 'react-native';
import { minPasswordLength, signUpRequestSchema } from '@/shared/auth';
import { Button, Text, space, useDocumentTitle } from '@/features/ui';
import { useApiForm } from '../hooks/use-api-form';
import { safeNextPath } from '../next-path';
import { useSessionQuery, useSignUpMutation } from '../queries';
import { AuthCard, FormError } from './auth-card';
import { FormField } from './form-field';
import { TextLink } from './text-link';

export function SignUpScreen() {
  const params = useLocalSearchParams<{ next?: string; email?: string }>();
  const router = useRouter();
  const next = safeNextPath(params.next);
  const session = useSessionQuery();
  const signUp = useSignUpMutation();
  useDocumentTitle('Create your account');
  const { form, formError, setFormError, showServerError } = useApiForm(signUpRequestSchema, {
    email: params.email ?? '',
    displayName: '',
    password: '',
  });

  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signUp.mutateAsync(values);
      router.replace(next as Href);
    } catch (error) {
      showServerError(error);
    }
  });

  // Someone already signed in has nothing to do here: on to where they were going.
  if (session.data?.user && !signUp.isPending) return <Redirect href={next as Href} />;

  const signInHref = (params.next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in') as Href;

  return (
    <AuthCard
      title="Create your account"
      lead="You get a personal workspace for your own designs; teams you create or join sit beside it."
      footer={
        <View style={{ flexDirection: 'row', gap: space.xs, flexWrap: 'wrap', justifyContent: 'center' }}>
          <Text tone="muted">Already have an account?</Text>
          <TextLink href={signInHref} label="Sign in" testID="to-sign-in" />
        </View>
      }
    >
      <FormField control={form.control} name="displayName" label="Your name" autoComplete="name" testID="display-name" hint="Shown to your team next to your versions and reviews." />
      <FormField control={form.control} name="email" label="E-mail" autoComplete="email" inputMode="email" autoCapitalize="none" testID="email" />
      <FormField
        control={form.control}
        name="password"
        label="Password"
        autoComplete="new-password"
        secureTextEntry
        testID="password"
        hint={`At least ${minPasswordLength} characters. A short sentence is easy to remember and hard to guess.`}
        onSubmitEditing={submit}
      />
      <FormError message={formError} />
      <Button label={signUp.isPending ? 'Creating your account…' : 'Create account'} onPress={submit} disabled={signUp.isPending} testID="sign-up-submit" />
    </AuthCard>
  );
}
