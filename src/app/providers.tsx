import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router';
import { useState } from 'react';
import { ApiError } from '../lib/api-client';
import { createAppRouter } from './router';
import { LiveAnnouncer } from './live-announcer';

function makeQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        // A 4xx will not get better by asking again.
        retry: (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
        refetchOnWindowFocus: true,
        // Without a network a query still asks once: the service worker answers from its copy where it
        // keeps one (what a round and a log entry need); retries wait for the network.
        networkMode: 'offlineFirst',
      },
      // A write is tried at once, never held silently while offline: rounds and log entries go to
      // the device's queue (features/offline), anything else says the server could not be reached.
      mutations: { networkMode: 'always' },
    },
  });
}

export function AppProviders() {
  const [queryClient] = useState(makeQueryClient);
  const [router] = useState(() => createAppRouter(queryClient));
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
      <LiveAnnouncer />
    </QueryClientProvider>
  );
}
