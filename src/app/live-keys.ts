// Which cached queries each kind of change makes stale — built from the features' key factories
// only, and typed over every live entity, so a new kind of record cannot be forgotten here. The
// socket handler and the mutations of the person who made the change use the same map.
import type { QueryClient, QueryKey } from '@tanstack/react-query';
import type { LiveEntity, LiveEvent } from '../../shared/live-events';
import { crewKeys } from '../components/plant/crews';
import { peopleKeys } from '../components/people/people-keys';
import { calcKeys } from '../components/readings/get-condenser-design';
import { unitKeys } from '../components/readings/unit-picker';
import { userKeys } from '../features/admin-users';
import { auditKeys } from '../features/audit';
import { flagKeys } from '../features/flags';
import { handoverKeys, shiftCondenserKeys } from '../features/handover';
import { importKeys } from '../features/imports';
import { conditionKeys, logKeys } from '../features/log';
import { logbookKeys } from '../features/logbook';
import { orderKeys } from '../features/orders';
import { overviewKeys } from '../features/overview';
import { stationSettingsKeys } from '../features/shifts';
import { setupKeys } from '../features/plant';
import { readingKeys } from '../features/rounds';
import { sessionKeys } from '../features/session';
import { trainingKeys } from '../features/training';
import { trendKeys } from '../features/trends';

/** Keys for what a unit shows of its rounds and what follows from them (flags, trends, the board). */
const unitPlantState = (unitId: number): QueryKey[] => [readingKeys.list(unitId), flagKeys.unit(unitId), trendKeys.unit(unitId), handoverKeys.unit(unitId), shiftCondenserKeys.unit(unitId)];

/** What each kind of change makes stale, besides the front page (which shows a bit of everything). */
const keysFor: Record<LiveEntity, (event: LiveEvent) => QueryKey[]> = {
  reading: (e) => (e.unitId ? [...unitPlantState(e.unitId), readingKeys.detail(Number(e.id))] : [readingKeys.all]),
  import: (e) => (e.unitId ? unitPlantState(e.unitId) : [readingKeys.all]),
  flag: (e) => (e.unitId ? [flagKeys.unit(e.unitId), trendKeys.unit(e.unitId), handoverKeys.unit(e.unitId)] : [flagKeys.all]),
  log_entry: (e) => (e.unitId ? [logKeys.unitEntries(e.unitId), handoverKeys.unit(e.unitId)] : [logKeys.all]),
  log_review: (e) => (e.unitId ? [logKeys.unitEntries(e.unitId), logKeys.shifts(e.unitId)] : [logKeys.all]),
  condition: (e) => (e.unitId ? [conditionKeys.list(e.unitId), logKeys.unitEntries(e.unitId), handoverKeys.unit(e.unitId)] : [conditionKeys.all]),
  standing_order: () => [orderKeys.all, handoverKeys.all],
  handover: (e) => [...(e.unitId ? [handoverKeys.unit(e.unitId)] : []), handoverKeys.one(Number(e.id))],
  training: () => [trainingKeys.all],
  plant: (e) => [unitKeys.all, shiftCondenserKeys.all, ...(e.unitId ? [setupKeys.unit(e.unitId), calcKeys.design(e.unitId)] : [setupKeys.all, calcKeys.all])],
  people: () => [userKeys.all, peopleKeys.all, crewKeys.all, sessionKeys.me(), auditKeys.all, handoverKeys.all],
  station_settings: () => [unitKeys.all, logKeys.all, handoverKeys.all, shiftCondenserKeys.all, stationSettingsKeys.all],
  review_comment: () => [logbookKeys.all],
};

// Every kind of change shows on the overview (crew, rounds, flags, conditions, handover, what waits on you).
export const liveKeys: Record<LiveEntity, (event: LiveEvent) => QueryKey[]> = Object.fromEntries(
  Object.entries(keysFor).map(([entity, keys]) => [entity, (event: LiveEvent) => [...keys(event), overviewKeys.all]]),
) as Record<LiveEntity, (event: LiveEvent) => QueryKey[]>;

/** Every factory's root: what a tab refetches after its live connection was down (it may have missed any event). */
const everyRoot = (): QueryKey[] => [
  readingKeys.all, flagKeys.all, trendKeys.all, handoverKeys.all, shiftCondenserKeys.all, logKeys.all, conditionKeys.all, orderKeys.all,
  trainingKeys.all, unitKeys.all, setupKeys.all, calcKeys.all, userKeys.all, peopleKeys.all, crewKeys.all, sessionKeys.all, auditKeys.all,
  stationSettingsKeys.all, logbookKeys.all, overviewKeys.all, importKeys.all,
];

export function invalidateEverything(queryClient: QueryClient) {
  for (const queryKey of everyRoot()) void queryClient.invalidateQueries({ queryKey });
}

/** Marks stale what this change affects; the queries on screen refetch. */
export function invalidateForChange(queryClient: QueryClient, event: LiveEvent) {
  for (const queryKey of liveKeys[event.entity]?.(event) ?? []) void queryClient.invalidateQueries({ queryKey });
}
