/**
 * Account hooks: who is signed in, sign in/up/out, password reset and
 * invitations. Components use these; none of them calls fetch.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest, isApiStatus } from './client';
import { queryKeys } from './keys';
import type { User } from './types';

/** The signed-in user, or `null` when there is no session (401 is not an error here). */
export function useMe() {
  return useQuery({
    queryKey: queryKeys.me,
    queryFn: async ({ signal }) => {
      try {
        const data = await apiRequest<{ user: User }>('/me', { signal });
        return data.user;
      } catch (err) {
        if (isApiStatus(err, 401)) return null;
        throw err;
      }
    },
    staleTime: 60_000,
    retry: (count, err) => !isApiStatus(err, 401) && count < 1,
  });
}

/** Sign in with e-mail and password; on success the session cookie is set and `me` is primed. */
export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { email: string; password: string }) =>
      apiRequest<{ user: User; token: string }>('/auth/login', { body: input }),
    onSuccess: (data) => {
      qc.clear();
      qc.setQueryData(queryKeys.me, data.user);
    },
  });
}

/** Create an account (and a session). */
export function useSignUp() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { email: string; password: string; name: string }) =>
      apiRequest<{ user: User }>('/auth/register', { body: input }),
    onSuccess: (data) => {
      qc.clear();
      qc.setQueryData(queryKeys.me, data.user);
    },
  });
}

/** End the session and forget every cached answer (they belonged to that person). */
export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<null>('/auth/logout', { method: 'POST' }),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(queryKeys.me, null);
    },
  });
}

/** Change the display name; the header and every `me` reader show the new name at once. */
export function useRename() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { name: string }) => apiRequest<{ user: User }>('/me', { method: 'PATCH', body: input }),
    onSuccess: (data) => {
      qc.setQueryData(queryKeys.me, data.user);
      // Author names in pattern lists, revisions and comments come from the server: fetch them again.
      void qc.invalidateQueries({ queryKey: queryKeys.patterns });
    },
  });
}

/**
 * Change the password with the current one. The server signs out every
 * other session and sets a fresh cookie for this one, so `me` stays valid.
 * A wrong current password fails with 403 `wrong-password`.
 */
export function useChangePassword() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { currentPassword: string; newPassword: string }) =>
      apiRequest<{ user: User; token: string }>('/me/password', { body: input }),
    onSuccess: (data) => qc.setQueryData(queryKeys.me, data.user),
  });
}

/** Ask for a reset link by e-mail. The server answers 202 whether or not the address is known. */
export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (input: { email: string }) => apiRequest<null>('/auth/password-reset', { body: input }),
  });
}

/** Set a new password with the token from the mailed link. */
export function useSetNewPassword() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) =>
      apiRequest<null>(`/auth/password-reset/${encodeURIComponent(input.token)}`, { body: { password: input.password } }),
  });
}

/** What an invitation link offers, shown before accepting (404 unknown, 410 used or expired). */
export interface InvitationInfo {
  email: string;
  role: string;
  patternTitle: string;
  invitedBy: string;
  /** Whether the invited e-mail already has an account (then sign in; else choose name and password). */
  accountExists: boolean;
  expiresAt: string;
}

/** The invitation behind a mailed token. */
export function useInvitation(token: string) {
  return useQuery({
    queryKey: ['invitation', token],
    queryFn: async ({ signal }) =>
      (await apiRequest<{ invitation: InvitationInfo }>(`/invitations/${encodeURIComponent(token)}`, { signal })).invitation,
    retry: false,
  });
}

/**
 * Accept an invitation. With `name` and `password` it also creates the
 * account (the server then signs the new person in).
 */
export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { token: string; name?: string; password?: string }) =>
      apiRequest<{ user: User; patternId: number | string; role: string; signedIn?: boolean }>(
        `/invitations/${encodeURIComponent(input.token)}/accept`,
        { body: { name: input.name, password: input.password } },
      ),
    onSuccess: () => qc.invalidateQueries(),
  });
}
