import type { ReactNode } from 'react';
import type { RouteObject } from 'react-router';
import type { Permission } from '@wickstone/contracts';
import { RequirePermission } from '../components/guard';

const guarded = (permission: Permission, screen: ReactNode) => (
  <RequirePermission permission={permission}>{screen}</RequirePermission>
);

/* The analysts' screens under /orgs/:orgId, loaded on first visit. */
export const usageRoutes: RouteObject[] = [
  {
    path: 'usage',
    lazy: async () => {
      const { UsagePage } = await import('./usage');
      return { element: guarded('usage:read', <UsagePage />) };
    },
  },
  {
    path: 'usage/runs/:runId',
    lazy: async () => {
      const { RunPage } = await import('./usage-run');
      return { element: guarded('usage:read', <RunPage />) };
    },
  },
  {
    path: 'leads',
    lazy: async () => {
      const { LeadsPage } = await import('./leads');
      return { element: guarded('leads:read', <LeadsPage />) };
    },
  },
  {
    path: 'leads/:leadId',
    lazy: async () => {
      const { LeadPage } = await import('./lead');
      return { element: guarded('leads:read', <LeadPage />) };
    },
  },
];
