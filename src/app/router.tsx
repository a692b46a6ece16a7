import { createBrowserRouter } from 'react-router';
import type { QueryClient } from '@tanstack/react-query';
import { setSignedOutHandler } from '../lib/api-client';
import { sessionKeys } from '../features/session/api/session-keys';
import { AppShell } from './layout/app-shell';
import { RequireRole } from './layout/require-role';
import { SignInPage } from '../features/session/routes/sign-in-page';
import { ChangePasswordPage } from '../features/session/routes/change-password-page';
import { OverviewPage } from '../features/overview/routes/overview-page';
import { UsersPage } from '../features/admin-users/routes/users-page';
import { AuditPage } from '../features/audit/routes/audit-page';
import { NotFoundPage } from './layout/not-found-page';

export function createAppRouter(queryClient: QueryClient) {
  // Any 401 from the API means the session ended (expiry, deactivation, restart of the store).
  setSignedOutHandler(() => queryClient.setQueryData(sessionKeys.me(), null));
  return createBrowserRouter([
    { path: '/sign-in', element: <SignInPage /> },
    {
      path: '/',
      element: <AppShell />,
      children: [
        { index: true, element: <OverviewPage /> },
        { path: 'account/password', element: <ChangePasswordPage /> },
        {
          path: 'admin',
          element: <RequireRole roles={['admin']} />,
          children: [
            { path: 'people', element: <UsersPage /> },
            { path: 'audit', element: <AuditPage /> },
          ],
        },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
