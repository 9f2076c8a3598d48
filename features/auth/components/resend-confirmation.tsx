import { StyleSheet, View } from 'react-native';
import { Button, Text, space } from '@/features/ui';
import { useResendVerificationMutation } from '../queries';
import { FormError } from './auth-card';

/**
 * "Send a new confirmation e-mail" for the signed-in account, with what happened after: the API
 * mails a fresh link (the one sent before stops working) and answers the same when the address
 * is confirmed already.
 */
export function ResendConfirmation({ email, kind = 'secondary' }: { email: string; kind?: 'primary' | 'secondary' }) {
  const resend = useResendVerificationMutation();
  return (
    <View style={styles.column}>
      {resend.isSuccess ? (
        <Text tone="ok" role="status" testID="confirmation-sent">
          A new confirmation link is on its way to {email}; the one sent before no longer works.
        </Text>
      ) : null}
      <FormError message={resend.isError ? resend.error.message : null} />
      <View style={styles.row}>
        <Button
          kind={kind}
          label={resend.isPending ? 'Sending…' : 'Send a new confirmation e-mail'}
          onPress={() => resend.mutate()}
          disabled={resend.isPending}
          testID="send-confirmation"
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
