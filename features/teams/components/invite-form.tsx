import { Controller } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { inviteRequestSchema } from '@/shared/teams';
import { FormError, FormField, useApiForm } from '@/features/auth';
import { Button, Text, space } from '@/features/ui';
import { useInviteMutation } from '../queries';
import { RolePicker } from './role-picker';

/** Owners invite by e-mail with a role; the link arrives by mail (or in the dev outbox). */
export function InviteForm({ teamId }: { teamId: string }) {
  const invite = useInviteMutation(teamId);
  const { form, formError, setFormError, showServerError } = useApiForm(inviteRequestSchema, { email: '', role: 'reviewer' });

  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await invite.mutateAsync(values);
      form.reset({ email: '', role: values.role });
    } catch (error) {
      showServerError(error);
    }
  });

  return (
    <View style={styles.form} testID="invite-form">
      <FormField control={form.control} name="email" label="Colleague’s e-mail" inputMode="email" autoCapitalize="none" autoComplete="off" testID="invite-email" onSubmitEditing={submit} />
      <View style={styles.role}>
        <Text variant="small" weight="semibold">
          Role
        </Text>
        <Controller
          control={form.control}
          name="role"
          render={({ field }) => <RolePicker value={field.value} onChange={field.onChange} label="Role of the invited colleague" testID="invite-role" />}
        />
        <Text variant="caption" tone="muted">
          Owners edit designs and members. Reviewers read, comment and record reviews. Viewers read and clone.
        </Text>
      </View>
      <FormError message={formError} />
      {invite.isSuccess && !formError ? (
        <Text tone="ok" testID="invite-sent">
          Invitation sent to {invite.data.invitation.email}.
        </Text>
      ) : null}
      <View style={styles.actions}>
        <Button label={invite.isPending ? 'Sending…' : 'Send invitation'} onPress={submit} disabled={invite.isPending} testID="invite-submit" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  role: { gap: space.xs },
  actions: { flexDirection: 'row' },
});
