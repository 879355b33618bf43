import { createBrowserRouter } from 'react-router';
import type { Permission } from '@wickstone/contracts';
import type { ReactNode } from 'react';
import { requireSession, skipWhenSignedIn } from './lib/guards';
import { RequirePermission } from './components/guard';
import { LoadingState } from './components/states';
import { RootLayout } from './routes/root';
import { RouteError, NotFoundPage } from './routes/error';
import { PublicLayout } from './routes/public-layout';
import { HomePage, homeLoader } from './routes/home';
import { LoginPage } from './routes/login';
import { SignupPage } from './routes/signup';
import { ForgotPasswordPage } from './routes/forgot-password';
import { ResetPasswordPage } from './routes/reset-password';
import { AcceptInvitationPage } from './routes/accept-invitation';
import { VerifyPage } from './routes/verify';
import { DevMailPage } from './routes/dev-mail';
import { AppShell } from './routes/shell';
import { OrgLayout } from './routes/org-layout';
import { OrgsPage } from './routes/orgs';
import { OverviewPage } from './routes/overview';
import { TeamPage } from './routes/team';
import { AuditPage } from './routes/audit';
import { AccountPage } from './routes/account';
import { RetentionPage } from './routes/retention';
import { BillingPage } from './routes/billing';
import { widgetRoutes } from './routes/widgets-routes';
import { usageRoutes } from './routes/usage-routes';

const guarded = (permission: Permission, screen: ReactNode) => (
  <RequirePermission permission={permission}>{screen}</RequirePermission>
);

export const router = createBrowserRouter([
  {
    path: '/',
    element: <RootLayout />,
    errorElement: <RouteError />,
    // Shown while the first page's loader asks who is signed in.
    hydrateFallbackElement: <LoadingState label="Opening Wickstone…" />,
    children: [
      {
        element: <PublicLayout />,
        children: [
          { index: true, loader: homeLoader, element: <HomePage /> },
          { path: 'login', loader: skipWhenSignedIn, element: <LoginPage /> },
          { path: 'signup', loader: skipWhenSignedIn, element: <SignupPage /> },
          { path: 'forgot-password', element: <ForgotPasswordPage /> },
          { path: 'reset-password', element: <ResetPasswordPage /> },
          { path: 'invitations/:token', element: <AcceptInvitationPage /> },
          { path: 'verify/:runId', element: <VerifyPage /> },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
      { path: 'dev/mail', element: <DevMailPage /> },
      {
        loader: requireSession,
        element: <AppShell />,
        children: [
          { path: 'account', element: <AccountPage /> },
          { path: 'orgs', element: <OrgsPage /> },
          {
            path: 'orgs/:orgId',
            element: <OrgLayout />,
            children: [
              { index: true, element: guarded('org:read', <OverviewPage />) },
              { path: 'team', element: guarded('members:read', <TeamPage />) },
              { path: 'audit', element: guarded('audit:read', <AuditPage />) },
              { path: 'settings/retention', element: guarded('org:read', <RetentionPage />) },
              { path: 'billing', element: guarded('billing:manage', <BillingPage />) },
              ...widgetRoutes,
              ...usageRoutes,
              { path: '*', element: <NotFoundPage /> },
            ],
          },
        ],
      },
    ],
  },
]);
