import { Slot } from 'expo-router';

/** Account pages: reachable signed out (sign-in, sign-up, reset, invitations, the dev outbox). */
export default function AuthLayout() {
  return <Slot />;
}
