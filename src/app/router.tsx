import { createBrowserRouter } from 'react-router';
import type { QueryClient } from '@tanstack/react-query';
import { setSignedOutHandler } from '../lib/api-client';
import { AppShell } from './layout/app-shell';
import { RequireRole } from './layout/require-role';
import { NotFoundPage } from './layout/not-found-page';
import { loadSignInPage, loadChangePasswordPage, meQueryOptions, sessionKeys } from '../features/session';
import { rememberedUnitId, unitsQueryOptions } from '../components/readings/unit-picker';
import { loadHandoverPage, loadHandoverPrintPage } from '../features/handover';
import { loadLogPage } from '../features/log';
import { loadOrdersPage } from '../features/orders';
import { loadReadingPage, loadRoundsPage, prefetchRoundsPage } from '../features/rounds';
import { loadFlagsPage } from '../features/flags';
import { loadTrendsPage } from '../features/trends';
import { loadImportPage } from '../features/imports';
import { loadLogbookPage, loadPastShiftPage } from '../features/logbook';
import { loadTraineePage, loadTrainingPage } from '../features/training';
import { loadPlantPage } from '../features/plant';
import { loadCondenserCheckPage } from '../features/condenser-check';
import { loadUsersPage } from '../features/admin-users';
import { loadShiftsPage } from '../features/shifts';
import { loadAuditPage } from '../features/audit';
import { loadOverviewPage } from '../features/overview';
import { forgetOfflineCopies, noteSignedInPerson } from '../features/offline/shell';

export function createAppRouter(queryClient: QueryClient) {
  // Any 401 from the API means the session ended (expiry, deactivation, restart of the store).
  // The device's offline copies of this person's answers go with the session.
  setSignedOutHandler(() => {
    noteSignedInPerson(null);
    void forgetOfflineCopies();
    queryClient.setQueryData(sessionKeys.me(), null);
  });
  // A route's data is asked for as its code loads, not after the page has drawn (one round trip, not
  // several, on a slow link); the loaders only start the queries and never hold the page back.
  const unitIn = (request: Request) => Number(new URL(request.url).searchParams.get('unit')) || rememberedUnitId();
  const startShellQueries = () => {
    void queryClient.prefetchQuery(meQueryOptions());
    void queryClient.prefetchQuery(unitsQueryOptions());
    return null;
  };
  return createBrowserRouter([
    { path: '/sign-in', lazy: async () => ({ Component: await loadSignInPage() }) },
    {
      path: '/',
      element: <AppShell />,
      loader: startShellQueries,
      // Shown while the first page's code arrives (the loaders themselves return at once).
      hydrateFallbackElement: <p className="p-8 text-muted">Loading…</p>,
      children: [
        { index: true, lazy: async () => ({ Component: await loadOverviewPage() }) },
        {
          path: 'account/password',
          lazy: async () => ({ Component: await loadChangePasswordPage() }),
        },
        { path: 'handover', lazy: async () => ({ Component: await loadHandoverPage() }) },
        { path: 'handover/:id/print', lazy: async () => ({ Component: await loadHandoverPrintPage() }) },
        { path: 'log', lazy: async () => ({ Component: await loadLogPage() }) },
        { path: 'orders', lazy: async () => ({ Component: await loadOrdersPage() }) },
        {
          path: 'rounds',
          loader: ({ request }) => {
            prefetchRoundsPage(queryClient, unitIn(request));
            return null;
          },
          lazy: async () => ({ Component: await loadRoundsPage() }),
        },
        { path: 'rounds/:id', lazy: async () => ({ Component: await loadReadingPage() }) },
        { path: 'flags', lazy: async () => ({ Component: await loadFlagsPage() }) },
        { path: 'trends', lazy: async () => ({ Component: await loadTrendsPage() }) },
        {
          path: 'import',
          element: <RequireRole action="import.run" />,
          children: [{ index: true, lazy: async () => ({ Component: await loadImportPage() }) }],
        },
        { path: 'logbook', lazy: async () => ({ Component: await loadLogbookPage() }) },
        {
          path: 'logbook/units/:unitId/shifts/:shiftStart',
          lazy: async () => ({ Component: await loadPastShiftPage() }),
        },
        { path: 'training', lazy: async () => ({ Component: await loadTrainingPage() }) },
        { path: 'training/trainees/:id', lazy: async () => ({ Component: await loadTraineePage() }) },
        { path: 'plant', lazy: async () => ({ Component: await loadPlantPage() }) },
        {
          path: 'condenser-check',
          lazy: async () => ({ Component: await loadCondenserCheckPage() }),
        },
        {
          path: 'admin',
          children: [
            {
              path: 'people',
              element: <RequireRole action="people.manage" />,
              children: [{ index: true, lazy: async () => ({ Component: await loadUsersPage() }) }],
            },
            {
              path: 'shifts',
              element: <RequireRole action="shifts.manage" />,
              children: [{ index: true, lazy: async () => ({ Component: await loadShiftsPage() }) }],
            },
            {
              path: 'audit',
              element: <RequireRole action="audit.read" />,
              children: [{ index: true, lazy: async () => ({ Component: await loadAuditPage() }) }],
            },
          ],
        },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
