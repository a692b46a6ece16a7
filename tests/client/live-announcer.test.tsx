// Changes made by others that matter on the floor (a flag, the handover board moving on) are read
// out politely by a screen reader: one live region, fed by the live socket; other events stay silent.
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, render, renderHook, screen } from '@testing-library/react';
import type { ReactNode } from 'react';
import { io } from 'socket.io-client';
import { describe, expect, it } from 'vitest';
import { LiveAnnouncer } from '../../src/app/live-announcer';
import { useLiveUpdates } from '../../src/app/use-live-updates';
import { getSocket } from '../../src/lib/socket';
import type { LiveEvent } from '../../shared/live-events';

/** The fake socket of tests/client/support/setup.ts: `receive` plays what the server would send. */
const server = io() as unknown as { receive: (event: string, ...args: unknown[]) => void };

async function mountShell() {
  const client = new QueryClient();
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  render(<LiveAnnouncer />);
  renderHook(() => useLiveUpdates(true), { wrapper });
  // The socket.io client is loaded after the page draws (src/lib/socket.ts).
  await act(() => getSocket().ready);
  return screen.getByTestId('live-announcer');
}

const send = (event: LiveEvent) => act(() => server.receive('changed', event));

describe('live announcements', () => {
  it('is one polite region that says a flag change and a board change, and says the same change again when it happens again', async () => {
    const region = await mountShell();
    expect(region.getAttribute('aria-live')).toBe('polite');
    expect(region.textContent).toBe('');

    send({ entity: 'flag', id: 12, unitId: 1 });
    expect(region.textContent).toMatch(/^Flags changed on the unit you are watching/);

    send({ entity: 'handover', id: 3, unitId: 1 });
    expect(region.textContent).toMatch(/^The handover board changed: an item, an acknowledgement/);

    // A second acknowledgement: the region's text must change, or a screen reader would stay silent.
    const before = region.textContent;
    send({ entity: 'handover', id: 3, unitId: 1 });
    expect(region.textContent).not.toBe(before);
    expect(region.textContent?.trim()).toBe(before?.trim());
  });

  it('stays silent for changes that only refresh what is on screen (a round, a log entry)', async () => {
    const region = await mountShell();
    const before = region.textContent;
    send({ entity: 'reading', id: 5, unitId: 1 });
    send({ entity: 'log_entry', id: 9, unitId: 1 });
    expect(region.textContent).toBe(before);
    send({ entity: 'flag', id: 13, unitId: 1 });
    expect(region.textContent).toMatch(/^Flags changed/);
  });
});
