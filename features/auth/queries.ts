import { useMutation, useQuery, useQueryClient, type UseQueryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import {
  acceptedResponseSchema,
  sessionResponseSchema,
  signedInResponseSchema,
  type PasswordResetConfirm,
  type PasswordResetRequest,
  type SignInRequest,
  type SessionResponse,
  type SignUpRequest,
} from '@/shared/auth';
import { api, staleTime } from '@/features/api';

export const authKeys = {
  all: ['auth'] as const,
  session: () => [...authKeys.all, 'session'] as const,
};

/** When to read the session again besides going stale; for screens waiting on something done elsewhere. */
type SessionRefetch = Pick<UseQueryOptions<SessionResponse>, 'refetchOnMount' | 'refetchOnWindowFocus'>;

export function useSessionQuery(refetch: SessionRefetch = {}) {
  return useQuery({
    queryKey: authKeys.session(),
    queryFn: ({ signal }) => api('/auth/session', sessionResponseSchema, { signal }),
    staleTime: staleTime.live,
    ...refetch,
  });
}

/** After anything that changes who is signed in, every cached answer may be someone else's. */
function useSessionChanged() {
  const queryClient = useQueryClient();
  return async (user: z.infer<typeof signedInResponseSchema>['user'] | null) => {
    queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
    queryClient.setQueryData(authKeys.session(), { user });
  };
}

export function useSignInMutation() {
  const changed = useSessionChanged();
  return useMutation({
    mutationFn: (body: SignInRequest) => api('/auth/sign-in', signedInResponseSchema, { method: 'POST', body }),
    onSuccess: ({ user }) => changed(user),
  });
}

export function useSignUpMutation() {
  const changed = useSessionChanged();
  return useMutation({
    mutationFn: (body: SignUpRequest) => api('/auth/sign-up', signedInResponseSchema, { method: 'POST', body }),
    onSuccess: ({ user }) => changed(user),
  });
}

export function useSignOutMutation() {
  const changed = useSessionChanged();
  return useMutation({
    mutationFn: (everywhere: boolean = false) =>
      api(everywhere ? '/auth/sign-out-everywhere' : '/auth/sign-out', z.unknown(), { method: 'POST' }),
    onSuccess: () => changed(null),
  });
}

export function useRequestResetMutation() {
  return useMutation({
    mutationFn: (body: PasswordResetRequest) => api('/auth/password-reset', acceptedResponseSchema, { method: 'POST', body }),
  });
}

export function useResetPasswordMutation() {
  const changed = useSessionChanged();
  return useMutation({
    mutationFn: (body: PasswordResetConfirm) => api('/auth/password-reset/confirm', signedInResponseSchema, { method: 'POST', body }),
    onSuccess: ({ user }) => changed(user),
  });
}

/** Mails a new confirmation link to the signed-in account (nothing when it is confirmed already). */
export function useResendVerificationMutation() {
  return useMutation({
    mutationFn: () => api('/auth/verify-email/resend', acceptedResponseSchema, { method: 'POST' }),
  });
}

export function useVerifyEmailMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => api('/auth/verify-email', signedInResponseSchema, { method: 'POST', body: { token } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: authKeys.session() }),
  });
}
