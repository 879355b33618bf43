import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationSchema, memberSchema, membersResponseSchema, type Role } from '@wickstone/contracts';
import { apiFetch } from '../lib/api';
import { meKey } from './session';

export const membersKey = (orgId: number) => ['orgs', orgId, 'members'] as const;

export const membersQuery = (orgId: number) =>
  queryOptions({
    queryKey: membersKey(orgId),
    queryFn: async () => membersResponseSchema.parse(await apiFetch(`/orgs/${orgId}/members`)),
  });

/*
 * Every team change also lands in the audit log, so the audit pages are invalidated with the list.
 */
function useTeamMutation<V, R>(orgId: number, mutationFn: (vars: V) => Promise<R>, alsoMe = false) {
  const client = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: async () => {
      await Promise.all([
        client.invalidateQueries({ queryKey: membersKey(orgId) }),
        client.invalidateQueries({ queryKey: ['orgs', orgId, 'audit'] }),
        alsoMe ? client.invalidateQueries({ queryKey: meKey }) : null,
      ]);
    },
  });
}

export function useInvite(orgId: number) {
  return useTeamMutation(orgId, async (body: { email: string; role: Role }) =>
    invitationSchema.parse(await apiFetch(`/orgs/${orgId}/invitations`, { method: 'POST', json: body })),
  );
}

export function useRevokeInvitation(orgId: number) {
  return useTeamMutation(orgId, (invitationId: number) =>
    apiFetch<null>(`/orgs/${orgId}/invitations/${invitationId}`, { method: 'DELETE' }),
  );
}

/** `self`: the change touches the signed-in person's own membership, so "me" is re-read too. */
export function useChangeRole(orgId: number, self: boolean) {
  return useTeamMutation(
    orgId,
    async ({ userId, role }: { userId: number; role: Role }) =>
      memberSchema.parse(
        await apiFetch(`/orgs/${orgId}/members/${userId}`, { method: 'PATCH', json: { role } }),
      ),
    self,
  );
}

export function useRemoveMember(orgId: number) {
  return useTeamMutation(orgId, (userId: number) =>
    apiFetch<null>(`/orgs/${orgId}/members/${userId}`, { method: 'DELETE' }),
  );
}

/** A fresh link for a pending invitation (the old one stops working) and a new expiry. */
export function useResendInvitation(orgId: number) {
  return useTeamMutation(orgId, async (invitationId: number) =>
    invitationSchema.parse(
      await apiFetch(`/orgs/${orgId}/invitations/${invitationId}/resend`, { method: 'POST' }),
    ),
  );
}
