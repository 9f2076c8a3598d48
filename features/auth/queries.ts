import { useMutation, useQuery, useQueryClient, type UseQueryOptions } from '@tanstack/react-query';
import type { PasswordResetConfirm, PasswordResetRequest, SessionResponse, SignInRequest, SignUpRequest, User } from '@/shared/auth';
import { apiContract } from '@/shared/contract';
import { call, routeKey, staleTime } from '@/features/api';

const routes = apiContract.accounts;
const sessionKey = routeKey(routes.session, {});

/** When to read the session again besides going stale; for screens waiting on something done elsewhere. */
type SessionRefetch = Pick<UseQueryOptions<SessionResponse>, 'refetchOnMount' | 'refetchOnWindowFocus'>;

export function useSessionQuery(refetch: SessionRefetch = {}) {
  return useQuery({
    queryKey: sessionKey,
    queryFn: ({ signal }) => call(routes.session, {}, { signal }),
    staleTime: staleTime.live,
    ...refetch,
  });
}

/** After anything that changes who is signed in, every cached answer may be someone else's. */
function useSessionChanged() {
  const queryClient = useQueryClient();
  return async (user: User | null) => {
    queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKey[0] });
    queryClient.setQueryData(sessionKey, { user });
  };
}

export function useSignInMutation() {
  const changed = useSessionChanged();
  return useMutation({
    mutationFn: (body: SignInRequest) => call(routes.signIn, { body }),
    onSuccess: ({ user }) => changed(user),
  });
}

export function useSignUpMutation() {
  const changed = useSessionChanged();
  return useMutation({
    mutationFn: (body: SignUpRequest) => call(routes.signUp, { body }),
    onSuccess: ({ user }) => changed(user),
  });
}

export function useSignOutMutation() {
  const changed = useSessionChanged();
  return useMutation({
    mutationFn: (everywhere: boolean = false) => call(everywhere ? routes.signOutEverywhere : routes.signOut, {}),
    onSuccess: () => changed(null),
  });
}

export function useRequestResetMutation() {
  return useMutation({
    mutationFn: (body: PasswordResetRequest) => call(routes.requestPasswordReset, { body }),
  });
}

export function useResetPasswordMutation() {
  const changed = useSessionChanged();
  return useMutation({
    mutationFn: (body: PasswordResetConfirm) => call(routes.confirmPasswordReset, { body }),
    onSuccess: ({ user }) => changed(user),
  });
}

/** Mails a new confirmation link to the signed-in account (nothing when it is confirmed already). */
export function useResendVerificationMutation() {
  return useMutation({
    mutationFn: () => call(routes.resendVerification, {}),
  });
}

export function useVerifyEmailMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => call(routes.verifyEmail, { body: { token } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionKey }),
  });
}
