import { useLocalSearchParams, type Href } from 'expo-router';
import { passwordResetRequestSchema } from '@/shared/auth';
import { Button, Text, useDocumentTitle } from '@/features/ui';
import { useApiForm } from '../hooks/use-api-form';
import { useRequestResetMutation } from '../queries';
import { AuthCard, FormError } from './auth-card';
import { FormField } from './form-field';
import { TextLink } from './text-link';

export function ForgotPasswordScreen() {
  // Sign-in passes on the address typed there.
  const { email = '' } = useLocalSearchParams<{ email?: string }>();
  const request = useRequestResetMutation();
  const { form, formError, setFormError, showServerError } = useApiForm(passwordResetRequestSchema, { email });
  useDocumentTitle('Reset your password');

  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await request.mutateAsync(values);
    } catch (error) {
      showServerError(error);
    }
  });

  return (
    <AuthCard
      title="Reset your password"
      lead="We mail a link that lets you choose a new password. It works once, for 30 minutes."
      footer={<TextLink href={'/sign-in' as Href} label="Back to sign-in" />}
    >
      {request.isSuccess ? (
        <Text testID="reset-sent">{request.data.message}</Text>
      ) : (
        <>
          <FormField control={form.control} name="email" label="E-mail" autoComplete="email" inputMode="email" autoCapitalize="none" testID="email" onSubmitEditing={submit} />
          <FormError message={formError} />
          <Button label={request.isPending ? 'Sending…' : 'Send the link'} onPress={submit} disabled={request.isPending} testID="reset-submit" />
        </>
      )}
    </AuthCard>
  );
}
