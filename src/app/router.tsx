import { createBrowserRouter } from 'react-router';
import type { QueryClient } from '@tanstack/react-query';
import { setSignedOutHandler } from '../lib/api-client';
import { sessionKeys } from '../features/session/api/session-keys';
import { AppShell } from './layout/app-shell';
import { RequireRole } from './layout/require-role';
import { SignInPage } from '../features/session/routes/sign-in-page';
import { OverviewPage } from '../features/overview/routes/overview-page';
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
        {
          path: 'account/password',
          lazy: async () => ({ Component: (await import('../features/session/routes/change-password-page')).ChangePasswordPage }),
        },
        { path: 'handover', lazy: async () => ({ Component: (await import('../features/handover/routes/handover-page')).HandoverPage }) },
        { path: 'handover/:id/print', lazy: async () => ({ Component: (await import('../features/handover/routes/print-page')).HandoverPrintPage }) },
        { path: 'log', lazy: async () => ({ Component: (await import('../features/log/routes/log-page')).LogPage }) },
        { path: 'orders', lazy: async () => ({ Component: (await import('../features/orders/routes/orders-page')).OrdersPage }) },
        { path: 'rounds', lazy: async () => ({ Component: (await import('../features/rounds/routes/rounds-page')).RoundsPage }) },
        { path: 'rounds/:id', lazy: async () => ({ Component: (await import('../features/rounds/routes/reading-page')).ReadingPage }) },
        { path: 'flags', lazy: async () => ({ Component: (await import('../features/flags/routes/flags-page')).FlagsPage }) },
        { path: 'trends', lazy: async () => ({ Component: (await import('../features/trends/routes/trends-page')).TrendsPage }) },
        {
          path: 'import',
          element: <RequireRole action="import.run" />,
          children: [{ index: true, lazy: async () => ({ Component: (await import('../features/imports/routes/import-page')).ImportPage }) }],
        },
        { path: 'logbook', lazy: async () => ({ Component: (await import('../features/logbook/routes/logbook-page')).LogbookPage }) },
        {
          path: 'logbook/units/:unitId/shifts/:shiftStart',
          lazy: async () => ({ Component: (await import('../features/logbook/routes/past-shift-page')).PastShiftPage }),
        },
        { path: 'training', lazy: async () => ({ Component: (await import('../features/training/routes/training-page')).TrainingPage }) },
        { path: 'training/trainees/:id', lazy: async () => ({ Component: (await import('../features/training/routes/trainee-page')).TraineePage }) },
        { path: 'plant', lazy: async () => ({ Component: (await import('../features/plant/routes/plant-page')).PlantPage }) },
        {
          path: 'condenser-check',
          lazy: async () => ({ Component: (await import('../features/condenser-check/routes/condenser-check-page')).CondenserCheckPage }),
        },
        {
          path: 'admin',
          children: [
            {
              path: 'people',
              element: <RequireRole action="people.manage" />,
              children: [{ index: true, lazy: async () => ({ Component: (await import('../features/admin-users/routes/users-page')).UsersPage }) }],
            },
            {
              path: 'shifts',
              element: <RequireRole action="shifts.manage" />,
              children: [{ index: true, lazy: async () => ({ Component: (await import('../features/shifts/routes/shifts-page')).ShiftsPage }) }],
            },
            {
              path: 'audit',
              element: <RequireRole action="audit.read" />,
              children: [{ index: true, lazy: async () => ({ Component: (await import('../features/audit/routes/audit-page')).AuditPage }) }],
            },
          ],
        },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
