import { Slot } from 'expo-router';
import { RequireSignIn } from '@/features/auth';

/** Pages for signed-in people only; others are sent to sign-in and brought back afterwards. */
export default function WorkspaceLayout() {
  return (
    <RequireSignIn>
      <Slot />
    </RequireSignIn>
  );
}
