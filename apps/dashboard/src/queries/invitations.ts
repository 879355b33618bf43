import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationPreviewSchema, meResponseSchema } from '@wickstone/contracts';
import { apiFetch } from '../lib/api';
import { sessionChanged } from './session';

/** What an invitation link offers: public, 404 once it is used, revoked or expired. */
export const invitationPreviewQuery = (token: string) =>
  queryOptions({
    queryKey: ['invitations', token],
    queryFn: async () =>
      invitationPreviewSchema.parse(await apiFetch(`/invitations/${encodeURIComponent(token)}`)),
    staleTime: Infinity,
    meta: { public: true },
  });

export function useAcceptInvitation(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: { name?: string; password?: string }) =>
      meResponseSchema.parse(
        await apiFetch(`/invitations/${encodeURIComponent(token)}/accept`, { method: 'POST', json: body }),
      ),
    onSuccess: (me) => sessionChanged(client, me),
    meta: { public: true },
  });
}
