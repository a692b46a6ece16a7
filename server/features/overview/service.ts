// The shift's front page: per unit, who is on shift and who comes next, the latest round and its
// key checks, open flags and conditions, and the state of the coming handover; and for the person
// asking, what waits on them. Read-only: nothing here creates, updates or touches a row (the
// handover board's own "current" route opens a draft; this deliberately does not call it).
import type { Sequelize } from 'sequelize';
import { shiftRoles } from '../../../shared/policies/handover';
import { remainingTime } from '../../../shared/conditions';
import type { Overview, OverviewHandover, OverviewUnit } from '../../../shared/schemas/overview';
import { stationLocalLabel } from '../../../shared/shift-time';
import { coalesced } from '../../lib/coalesce';
import { peopleOnCrewsOrIds } from '../users/index';
import { shiftNow } from './shift-now';
import { currentHandovers, latestRounds, openConditions, openFlags, type CurrentHandovers } from './unit-state';
import { handoverItemsFor, handoverQuestionsFor, handoversToAcceptFor, reviewCommentsFor, standingOrdersFor, trainingEntriesFor, traineeRoundsFor, type ReviewCommentsFor } from './waiting';

const roleOrder: Record<string, number> = { shift_lead: 0, operator: 1, trainee: 2 };

export function makeOverviewService(sequelize: Sequelize, deps: { reviewCommentsFor: ReviewCommentsFor }) {
  /** What every viewer sees alike: the shift and each unit's state. Shared by requests asked at once. */
  async function unitPicture(now: Date) {
    const shift = await shiftNow(now);
    const unitIds = shift.units.map((u) => u.id);
    const stationOf = (stationId: number) => shift.stations.get(stationId)!;
    const [rounds, flags, conditions, handovers] = await Promise.all([
      latestRounds(sequelize, unitIds),
      openFlags(sequelize, unitIds),
      openConditions(unitIds),
      currentHandovers(shift.units.map((u) => ({ unitId: u.id, shiftStart: stationOf(u.stationId).shiftStart }))),
    ]);
    return { now, shift, rounds, flags, conditions, handovers };
  }
  // The page asked for now (no time given) is the one shared: its time is when the shared read began.
  const sharedPicture = coalesced((at: Date | null) => unitPicture(at ?? new Date()), (at) => (at ? String(at.getTime()) : 'now'));

  async function overview(viewer: Express.User, at?: Date): Promise<Overview> {
    const [picture, traineeRounds, trainingEntries, standingOrders, reviewComments] = await Promise.all([
      sharedPicture(at ?? null),
      traineeRoundsFor(viewer),
      trainingEntriesFor(viewer),
      standingOrdersFor(viewer),
      reviewCommentsFor(viewer, deps.reviewCommentsFor, at ?? new Date()),
    ]);
    const { now, shift, rounds, flags, conditions, handovers } = picture;
    const stationOf = (stationId: number) => shift.stations.get(stationId)!;

    // Everyone named on the page, and the crews whose acknowledgements are counted, in one read.
    const crewIds = new Set<number>();
    for (const s of shift.stations.values()) if (s.crewOnShiftId !== null) crewIds.add(s.crewOnShiftId);
    for (const h of handovers.handovers) if (h.incomingCrewId !== null) crewIds.add(h.incomingCrewId);
    const userIds = new Set<number>([...[...rounds.values()].map((r) => r.recordedBy), ...traineeRounds.map((r) => r.recordedBy)]);
    const people = await peopleOnCrewsOrIds([...crewIds], [...userIds]);
    const nameOf = (id: number) => people.find((p) => p.id === id)?.name ?? `#${id}`;
    const crewMembers = (crewId: number | null) =>
      crewId === null ? [] : people.filter((p) => p.crewId === crewId && p.active && shiftRoles.includes(p.role)).sort((a, b) => (roleOrder[a.role]! - roleOrder[b.role]!) || a.name.localeCompare(b.name));
    const crew = (id: number | null) => (id === null ? null : { id, name: shift.crewNames.get(id) ?? `#${id}` });
    const unitName = (id: number) => shift.units.find((u) => u.id === id)?.name ?? `#${id}`;

    const units: OverviewUnit[] = shift.units.map((unit) => {
      const station = stationOf(unit.stationId);
      const { timeZone, roundIntervalMinutes } = station.settings;
      const round = rounds.get(unit.id);
      const ageMs = round ? now.getTime() - round.takenAt.getTime() : 0;
      return {
        unit: { id: unit.id, code: unit.code, name: unit.name, stationId: unit.stationId, station: station.name },
        timeZone,
        roundIntervalMinutes,
        shift: {
          shiftStart: station.shiftStart.toISOString(),
          changeAt: station.changeAt.toISOString(),
          crewOnShift: crew(station.crewOnShiftId),
          incomingCrew: crew(station.incomingCrewId),
          people: crewMembers(station.crewOnShiftId).map((p) => ({ id: p.id, name: p.name, role: p.role })),
        },
        round: round
          ? {
              id: round.id,
              takenAt: round.takenAt.toISOString(),
              recordedBy: nameOf(round.recordedBy),
              recordedAsTrainee: round.recordedAsTrainee,
              needsCountersign: round.needsCountersign,
              amended: round.amended,
              ageMs,
              overdue: ageMs > roundIntervalMinutes * 60_000,
              worstStatus: round.worstStatus,
              checks: round.checks,
            }
          : null,
        flags: { open: flags.counts.get(unit.id)!, top: flags.top.get(unit.id)! },
        conditions: conditions
          .filter((c) => c.unitId === unit.id)
          .map((c) => {
            const left = remainingTime(c.startedAt, c.limitAt, now, null);
            return { id: c.id, title: c.title, limitAt: c.limitAt.toISOString(), limitLocal: stationLocalLabel(c.limitAt, timeZone), remainingMs: left.remainingMs, state: left.state };
          }),
        handover: handoverState(unit.id, station.changeAt, handovers, crewMembers),
      };
    });

    return {
      serverNow: now.toISOString(),
      units,
      waiting: {
        handoverItems: handoverItemsFor(viewer, handovers, unitName),
        handoverQuestions: handoverQuestionsFor(viewer, handovers, unitName),
        handoversToAccept: handoversToAcceptFor(viewer, handovers, unitName, crewMembers),
        traineeRounds: traineeRounds.map((r) => ({
          id: r.id,
          unitId: r.unitId,
          unitName: unitName(r.unitId),
          takenAt: r.takenAt.toISOString(),
          timeZone: stationOf(shift.units.find((u) => u.id === r.unitId)!.stationId).settings.timeZone,
          recordedBy: nameOf(r.recordedBy),
        })),
        trainingEntries,
        standingOrders,
        reviewComments,
      },
    };
  }

  return { overview };
}
export type OverviewService = ReturnType<typeof makeOverviewService>;

/** None yet / draft / submitted (with the acknowledgements still missing from the incoming crew) / accepted. */
function handoverState(
  unitId: number,
  changeAt: Date,
  current: CurrentHandovers,
  crewMembers: (crewId: number | null) => { id: number }[],
): OverviewHandover {
  const h = current.handovers.find((x) => x.unitId === unitId);
  const at = changeAt.toISOString();
  if (!h) return { state: 'none', id: null, changeAt: at };
  if (h.status === 'draft') return { state: 'draft', id: h.id, changeAt: h.handoverAt.toISOString() };
  const items = current.items.filter((i) => i.handoverId === h.id);
  const incoming = crewMembers(h.incomingCrewId);
  const outstanding = items.reduce((n, item) => n + incoming.filter((p) => !current.acks.some((a) => a.itemId === item.id && a.userId === p.id)).length, 0);
  if (h.status === 'accepted') return { state: 'accepted', id: h.id, changeAt: h.handoverAt.toISOString(), acknowledgementsOutstanding: outstanding };
  const questions = current.openQuestions.filter((q) => items.some((i) => i.id === q.itemId)).length;
  return { state: 'submitted', id: h.id, changeAt: h.handoverAt.toISOString(), acknowledgementsOutstanding: outstanding, openQuestions: questions };
}
