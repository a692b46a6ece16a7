// Who of the demo people was at work when. The station's rotation names the crew of each shift; a
// fixed pattern inside the crew says who walked each round, so the invented history reads like real
// shifts: field operators walk most rounds, the control room takes some, and the trainee walks her
// share only on her own crew's shifts with an operator of that crew beside her.
import type { StationSettings } from '../../../shared/schemas/log';
import { nextShiftStart, shiftStartFor } from '../../../shared/shift-time';
import { crewFromRotation, type CrewRotation } from '../../features/shifts/crews';

export type DemoPerson = { id: number; name: string; role: string; crewId: number | null; position: string | null };
export type RoundBy = { shiftStart: Date; crewId: number; recorder: DemoPerson; countersigner: DemoPerson | null };

type CrewStaff = { lead: DemoPerson[]; control: DemoPerson[]; field: DemoPerson[]; trainees: DemoPerson[] };

export function makeRoster(people: DemoPerson[], settings: Pick<StationSettings, 'timeZone' | 'shiftChangeTimes'>, rotation: CrewRotation) {
  const perDay = settings.shiftChangeTimes.length;
  const staff = new Map<number, CrewStaff>();
  for (const person of people) {
    if (person.crewId === null) continue;
    const crew = staff.get(person.crewId) ?? { lead: [], control: [], field: [], trainees: [] };
    if (person.role === 'shift_lead') crew.lead.push(person);
    else if (person.role === 'trainee') crew.trainees.push(person);
    else if (person.role === 'operator') (person.position === 'field_cw_tower' ? crew.field : crew.control).push(person);
    staff.set(person.crewId, crew);
  }

  const shiftAt = (at: Date) => shiftStartFor(at, settings.timeZone, settings.shiftChangeTimes);
  const crewOf = (shiftStart: Date) => crewFromRotation(rotation, shiftStart, perDay);

  /** Who walked the round on unit number `unitIndex` (0-based) at `takenAt`. */
  function roundBy(takenAt: Date, unitIndex: number): RoundBy {
    const shiftStart = shiftAt(takenAt);
    const crewId = crewOf(shiftStart);
    const crew = crewId === null ? undefined : staff.get(crewId);
    if (crewId === null || !crew) throw new Error(`the demo rotation puts no staffed crew on the shift of ${takenAt.toISOString()}`);
    const hour = Math.floor((takenAt.getTime() - shiftStart.getTime()) / 3_600_000);
    const pick = <T>(list: T[], n: number) => list[n % list.length];
    const operators = [...crew.field, ...crew.control];
    // One round in four per unit from the control room (staggered between the units), the rest in the field.
    if ((hour + unitIndex) % 4 === 3 || crew.field.length === 0) {
      const desk = [...crew.control, ...crew.lead];
      return { shiftStart, crewId, recorder: pick(desk, Math.floor(hour / 4))!, countersigner: null };
    }
    const trainee = crew.trainees[0];
    // The trainee walks every third Unit 1 field round; the field operator with her countersigns.
    if (trainee && unitIndex === 0 && hour % 3 === 1 && operators.length) {
      return { shiftStart, crewId, recorder: trainee, countersigner: pick(crew.field.length ? crew.field : operators, hour)! };
    }
    return { shiftStart, crewId, recorder: pick(crew.field, hour + unitIndex)!, countersigner: null };
  }

  /** The first shift of `crewId` starting at or after the shift containing `from`. */
  function shiftOfCrew(crewId: number, from: Date): Date {
    let start = shiftAt(from);
    for (let i = 0; i < rotation.crewIds.length * 2; i++) {
      if (crewOf(start) === crewId) return start;
      start = nextShiftStart(start, settings.timeZone, settings.shiftChangeTimes);
    }
    throw new Error(`crew ${crewId} works no shift in the demo rotation`);
  }

  /** The shift `back` shifts before the one containing `at` (0 = that shift). */
  function shiftsBack(at: Date, back: number): Date {
    let start = shiftAt(at);
    for (let i = 0; i < back; i++) start = shiftAt(new Date(start.getTime() - 1));
    return start;
  }

  const members = (crewId: number) => staff.get(crewId) ?? { lead: [], control: [], field: [], trainees: [] };
  return { roundBy, shiftAt, crewOf, shiftOfCrew, shiftsBack, members };
}
export type DemoRoster = ReturnType<typeof makeRoster>;
