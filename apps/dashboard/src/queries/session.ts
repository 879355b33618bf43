import { queryOptions, useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { meResponseSchema, type LoginBody, type MeResponse, type SignupBody } from '@wickstone/contracts';
import { apiFetch, isApiError, refreshCsrf } from '../lib/api';

export const meKey = ['me'] as const;

/** The signed-in person and their memberships, or null when signed out (a 401 is an answer here). */
export const meQuery = () =>
  queryOptions({
    queryKey: meKey,
    queryFn: async (): Promise<MeResponse | null> => {
      try {
        return meResponseSchema.parse(await apiFetch('/auth/me'));
      } catch (error) {
        if (isApiError(error, 401)) return null;
        throw error;
      }
    },
    staleTime: 60_000,
    meta: { public: true },
  });

/** After the session changed: the new person, a fresh CSRF token, and nothing cached from before. */
export async function sessionChanged(client: QueryClient, me: MeResponse | null) {
  client.removeQueries({ predicate: (q) => q.queryKey[0] === 'orgs' || q.queryKey[0] === 'invitations' });
  client.setQueryData(meKey, me);
  await refreshCsrf();
}

export function useSignup() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: SignupBody) =>
      meResponseSchema.parse(await apiFetch('/auth/signup', { method: 'POST', json: body })),
    onSuccess: (me) => sessionChanged(client, me),
    meta: { public: true },
  });
}

export function useLogin() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: LoginBody) =>
      meResponseSchema.parse(await apiFetch('/auth/login', { method: 'POST', json: body })),
    onSuccess: (me) => sessionChanged(client, me),
    meta: { public: true },
  });
}

export function useLogout() {
  return useMutation({
    mutationFn: () => apiFetch<null>('/auth/logout', { method: 'POST' }),
    meta: { public: true },
  });
}

export interface AccountChange {
  name?: string;
  currentPassword?: string;
  newPassword?: string;
}

export function useUpdateAccount() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: AccountChange) =>
      meResponseSchema.parse(await apiFetch('/auth/me', { method: 'PATCH', json: body })),
    onSuccess: async (me, body) => {
      client.setQueryData(meKey, me);
      // A new password revokes older sessions; the server re-issues ours, and may rotate the token.
      if (body.newPassword !== undefined) await refreshCsrf();
      // Member lists show the name.
      if (body.name !== undefined) await client.invalidateQueries({ queryKey: ['orgs'] });
    },
  });
}

export function useForgotPassword() {
  return useMutation({
    mutationFn: (body: { email: string }) =>
      apiFetch<{ ok: true }>('/auth/password/forgot', { method: 'POST', json: body }),
    meta: { public: true },
  });
}

export function useResetPassword() {
  return useMutation({
    mutationFn: (body: { token: string; password: string }) =>
      apiFetch<null>('/auth/password/reset', { method: 'POST', json: body }),
    meta: { public: true },
  });
}
