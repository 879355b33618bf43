import type { ReactNode } from 'react';
import type { RouteObject } from 'react-router';
import type { Permission } from '@wickstone/contracts';
import { RequirePermission } from '../components/guard';

const guarded = (permission: Permission, screen: ReactNode) => (
  <RequirePermission permission={permission}>{screen}</RequirePermission>
);

/*
 * The widget screens under /orgs/:orgId. Loaded on first visit: they carry calc-core's six
 * calculators, which no other screen needs.
 */
export const widgetRoutes: RouteObject[] = [
  {
    path: 'widgets',
    lazy: async () => {
      const { WidgetsPage } = await import('./widgets');
      return { element: guarded('widgets:read', <WidgetsPage />) };
    },
  },
  {
    path: 'widgets/new',
    lazy: async () => {
      const { NewWidgetPage } = await import('./widgets-new');
      return { element: guarded('widgets:write', <NewWidgetPage />) };
    },
  },
  {
    path: 'widgets/:widgetId',
    lazy: async () => {
      const { WidgetEditorPage } = await import('./widgets-editor');
      return { element: guarded('widgets:read', <WidgetEditorPage />) };
    },
  },
];
