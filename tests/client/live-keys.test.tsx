// Each live event (and the change a person just made) must make stale exactly what shows the
// changed record: the pages of that unit, never the other unit's, never unrelated features.
// A real QueryClient holds one query per thing a page would show; each case lists, in plain
// words, which of them the event makes stale.
import { QueryClient, QueryClientProvider, type QueryKey } from '@tanstack/react-query';
import { renderHook } from '@testing-library/react';
import type { ReactNode } from 'react';
import { io } from 'socket.io-client';
import { getSocket } from '../../src/lib/socket';
import { describe, expect, it } from 'vitest';
import { liveEntities, type LiveEntity, type LiveEvent } from '../../shared/live-events';
import { invalidateForChange } from '../../src/app/live-keys';
import { useLiveUpdates } from '../../src/app/use-live-updates';
import { crewKeys } from '../../src/components/plant/crews';
import { peopleKeys } from '../../src/components/people/person-select';
import { calcKeys } from '../../src/components/readings/get-condenser-design';
import { unitKeys } from '../../src/components/readings/unit-picker';
import { userKeys } from '../../src/features/admin-users/api/user-keys';
import { auditKeys } from '../../src/features/audit/api/audit-keys';
import { flagKeys } from '../../src/features/flags/api/flags';
import { shiftCondenserKeys } from '../../src/features/handover/api/get-shift-condenser';
import { handoverKeys } from '../../src/features/handover/api/handover';
import { conditionKeys, logKeys } from '../../src/features/log/api/log';
import { logbookKeys } from '../../src/features/logbook/api/logbook';
import { orderKeys } from '../../src/features/orders/api/orders';
import { overviewKeys } from '../../src/features/overview/api/overview-keys';
import { setupKeys } from '../../src/features/plant/api/setup';
import { readingKeys } from '../../src/features/rounds/api/reading-keys';
import { sessionKeys } from '../../src/features/session/api/session-keys';
import { stationSettingsKeys } from '../../src/features/shifts/api/station-settings';
import { trainingKeys } from '../../src/features/training/api/training';
import { trendKeys } from '../../src/features/trends/api/get-trend';

const trend = (unitId: number) => trendKeys.one({ unitId, parameters: ['ttd'], from: '2026-03-01T00:00:00Z', to: '2026-03-02T00:00:00Z' });

/** What the open pages of two units hold in the cache, by a name a test can list. */
const cached = {
  'rounds U1': readingKeys.list(1),
  'rounds U2': readingKeys.list(2),
  'round 5': readingKeys.detail(5),
  'round 6': readingKeys.detail(6),
  'flags U1': flagKeys.list(1, { status: 'open' }),
  'flags U2': flagKeys.list(2, { status: 'open' }),
  'trend U1': trend(1),
  'trend U2': trend(2),
  'board U1': handoverKeys.current(1),
  'board U2': handoverKeys.current(2),
  'handover 10': handoverKeys.one(10),
  'handover 11': handoverKeys.one(11),
  'shift condenser U1': shiftCondenserKeys.shift(1, null),
  'shift condenser U2': shiftCondenserKeys.shift(2, null),
  'log U1': logKeys.entries(1, {}),
  'log U2': logKeys.entries(2, {}),
  'log reviews U1': logKeys.shifts(1),
  'conditions U1': conditionKeys.list(1),
  'conditions U2': conditionKeys.list(2),
  'orders in force': orderKeys.list('in-force', ''),
  'orders to acknowledge': orderKeys.pending(),
  overview: overviewKeys.page(),
  'my training': trainingKeys.me(),
  'my review comments': logbookKeys.myComments(),
  me: sessionKeys.me(),
  people: userKeys.list(),
  audit: auditKeys.list(),
  units: unitKeys.all,
  'setup U1': setupKeys.unit(1),
  'setup U2': setupKeys.unit(2),
  'design U1': calcKeys.design(1),
  'design U2': calcKeys.design(2),
  crews: crewKeys.all,
  'people picker': peopleKeys.all,
  'station settings': stationSettingsKeys.station(1),
} satisfies Record<string, QueryKey>;
type Cached = keyof typeof cached;

function cacheOfOpenPages() {
  const queryClient = new QueryClient();
  for (const key of Object.values(cached)) queryClient.setQueryData(key, { some: 'data' });
  return queryClient;
}

const staleIn = (queryClient: QueryClient) =>
  (Object.keys(cached) as Cached[]).filter((name) => queryClient.getQueryState(cached[name])?.isInvalidated).sort();

const everyBoard: Cached[] = ['board U1', 'board U2', 'handover 10', 'handover 11'];

/** Every kind of event, with what it must make stale (the overview shows a bit of everything). */
const cases: Record<LiveEntity, [LiveEvent, Cached[]][]> = {
  reading: [[{ entity: 'reading', id: 5, unitId: 1 }, ['rounds U1', 'round 5', 'flags U1', 'trend U1', 'board U1', 'shift condenser U1', 'overview']]],
  import: [[{ entity: 'import', id: 'batch', unitId: 2 }, ['rounds U2', 'flags U2', 'trend U2', 'board U2', 'shift condenser U2', 'overview']]],
  flag: [[{ entity: 'flag', id: 3, unitId: 2 }, ['flags U2', 'trend U2', 'board U2', 'overview']]],
  log_entry: [[{ entity: 'log_entry', id: 9, unitId: 1 }, ['log U1', 'board U1', 'overview']]],
  log_review: [[{ entity: 'log_review', id: 4, unitId: 1 }, ['log U1', 'log reviews U1', 'overview']]],
  condition: [[{ entity: 'condition', id: 2, unitId: 1 }, ['conditions U1', 'log U1', 'board U1', 'overview']]],
  standing_order: [[{ entity: 'standing_order', id: 8 }, ['orders in force', 'orders to acknowledge', ...everyBoard, 'overview']]],
  handover: [[{ entity: 'handover', id: 10, unitId: 1 }, ['board U1', 'handover 10', 'overview']]],
  training: [[{ entity: 'training', id: 1, userId: 7 }, ['my training', 'overview']]],
  plant: [
    [{ entity: 'plant', id: 1, unitId: 1 }, ['units', 'shift condenser U1', 'shift condenser U2', 'setup U1', 'design U1', 'overview']],
    [{ entity: 'plant', id: 'crews' }, ['units', 'shift condenser U1', 'shift condenser U2', 'setup U1', 'setup U2', 'design U1', 'design U2', 'overview']],
  ],
  people: [[{ entity: 'people', id: 7 }, ['people', 'people picker', 'crews', 'me', 'audit', ...everyBoard, 'overview']]],
  station_settings: [
    [{ entity: 'station_settings', id: 1 }, ['units', 'log U1', 'log U2', 'log reviews U1', ...everyBoard, 'shift condenser U1', 'shift condenser U2', 'station settings', 'overview']],
  ],
  review_comment: [[{ entity: 'review_comment', id: 12, userId: 7 }, ['my review comments', 'overview']]],
};

describe('live update → stale queries', () => {
  it('has a case for every kind of live event', () => {
    expect(Object.keys(cases).sort()).toEqual([...liveEntities].sort());
  });

  for (const [entity, list] of Object.entries(cases)) {
    for (const [event, expected] of list) {
      it(`${entity} ${JSON.stringify(event)} makes stale exactly: ${expected.join(', ')}`, () => {
        const queryClient = cacheOfOpenPages();
        invalidateForChange(queryClient, event);
        expect(staleIn(queryClient)).toEqual([...expected].sort());
      });
    }
  }

  it('does the same for an event arriving on the live socket', async () => {
    const queryClient = cacheOfOpenPages();
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
    renderHook(() => useLiveUpdates(true), { wrapper });
    // The socket.io client is loaded after the page draws (src/lib/socket.ts).
    await getSocket().ready;
    const socket = io() as unknown as { receive: (event: string, ...args: unknown[]) => void };
    socket.receive('changed', { entity: 'flag', id: 3, unitId: 2 } satisfies LiveEvent);
    expect(staleIn(queryClient)).toEqual(['board U2', 'flags U2', 'overview', 'trend U2']);
  });
});
