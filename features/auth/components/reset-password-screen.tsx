import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { z } from 'zod';
import { minPasswordLength, passwordSchema } from '@/shared/auth';
import { Button, Text, useDocumentTitle } from '@/features/ui';
import { useApiForm } from '../hooks/use-api-form';
import { useResetPasswordMutation } from '../queries';
import { AuthCard, FormError } from './auth-card';
import { FormField } from './form-field';
import { TextLink } from './text-link';

const formSchema = z.object({ password: passwordSchema });

export function ResetPasswordScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  const router = useRouter();
  const reset = useResetPasswordMutation();
  useDocumentTitle('Choose a new password');
  const { form, formError, setFormError, showServerError } = useApiForm(formSchema, { password: '' });

  const submit = form.handleSubmit(async ({ password }) => {
    setFormError(null);
    try {
      await reset.mutateAsync({ token: token ?? '', password });
      router.replace('/teams' as Href);
    } catch (error) {
      showServerError(error);
    }
  });

  if (!token) {
    return (
      <AuthCard title="Choose a new password" footer={<TextLink href={'/forgot-password' as Href} label="Ask for a new link" />}>
        <Text>This page needs the link from the e-mail we sent you.</Text>
      </AuthCard>
    );
  }

  return (
    <AuthCard
      title="Choose a new password"
      lead="Every other browser signed in to your account is signed out when you save it."
      footer={<TextLink href={'/forgot-password' as Href} label="Ask for a new link" />}
    >
      <FormField
        control={form.control}
        name="password"
        label="New password"
        autoComplete="new-password"
        secureTextEntry
        hint={`At least ${minPasswordLength} characters.`}
        testID="password"
        onSubmitEditing={submit}
      />
      <FormError message={formError} />
      <Button label={reset.isPending ? 'Saving…' : 'Save the new password'} onPress={submit} disabled={reset.isPending} testID="reset-confirm" />
    </AuthCard>
  );
}
