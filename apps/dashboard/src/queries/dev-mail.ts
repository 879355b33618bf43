import { queryOptions } from '@tanstack/react-query';
import { devMailResponseSchema, emailSchema } from '@wickstone/contracts';
import { apiFetch } from '../lib/api';

/**
 * The fake SMTP server's kept messages; the route only exists while that fake is configured.
 * A complete address is asked of the server (which keeps many messages), anything shorter is
 * filtered by the page.
 */
export const devMailQuery = (recipient = '') => {
  const to = emailSchema.safeParse(recipient);
  const exact = to.success ? to.data : null;
  return queryOptions({
    queryKey: ['dev-mail', exact],
    queryFn: async () =>
      devMailResponseSchema.parse(
        await apiFetch(exact ? `/dev/mail?to=${encodeURIComponent(exact)}` : '/dev/mail'),
      ),
    refetchInterval: (query) => (query.state.status === 'error' ? false : 5_000),
    staleTime: 5_000,
    retry: false,
    meta: { public: true },
  });
};
