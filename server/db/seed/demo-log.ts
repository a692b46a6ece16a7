// The demo log: the shift in progress (crew A), the night before it (crew D) when 1-CWP-B came out
// of service, and crew A's shift two days back with the trainee's report. Each entry is written by
// someone of the crew on shift then; past shifts carry their lead's end-of-shift review. Unit 2 has
// a flag one crew's lead raised and a later crew's lead cleared.
import type { Sequelize } from 'sequelize';
import { nextShiftStart } from '../../../shared/shift-time';
import { defaultStationSettings } from '../../features/stations/settings';
import { LogEntry, LogReview } from '../../features/log/model';
import { StandingOrder } from '../../features/standing-orders/model';
import { Condition } from '../../features/conditions/model';
import { Equipment } from '../../features/plant/model';
import { Flag } from '../../features/flags/model';
import type { User } from '../../features/users/model';
import type { DemoRoster } from './demo-roster';

type Options = { stationId: number; unitId: number; otherUnitId: number; roster: DemoRoster; byEmail: Map<string, User>; now: Date };

export async function seedDemoLog(sequelize: Sequelize, { stationId, unitId, otherUnitId, roster, byEmail, now }: Options): Promise<number> {
  let created = 0;
  await sequelize.transaction(async (transaction) => {
    if (await LogEntry.count({ where: { unitId }, transaction })) return;
    const person = (email: string) => {
      const found = byEmail.get(email);
      if (!found) throw new Error(`demo person ${email} is missing`);
      return found;
    };
    const operator = person('operator.a@fernhollow.example');
    const field = person('field.a@fernhollow.example');
    const lead = person('lead.a@fernhollow.example');
    const trainee = person('trainee.a@fernhollow.example');
    const nightField = person('operator.d@fernhollow.example');
    const nightLead = person('lead.d@fernhollow.example');
    const pumpB = await Equipment.findOne({ where: { unitId, tag: '1-CWP-B' }, transaction });
    const { timeZone, shiftChangeTimes } = defaultStationSettings;
    const current = roster.shiftAt(now);
    const night = roster.shiftsBack(now, 1);
    const twoDaysBack = roster.shiftsBack(now, 4);
    const hours = (start: Date, h: number) => new Date(start.getTime() + h * 3_600_000);
    // The shift in progress may have just begun: its entries spread over the part already gone.
    const soFar = (fraction: number) => new Date(current.getTime() + fraction * (now.getTime() - current.getTime()));
    const entry = async (eventAt: Date, author: User, position: string, category: string, text: string, extra: Partial<{ equipmentId: number | null; carryToHandover: boolean }> = {}) => {
      await LogEntry.create(
        {
          unitId,
          position,
          category,
          eventAt,
          enteredAt: eventAt,
          receivedAt: eventAt,
          clientId: null,
          shiftStart: roster.shiftAt(eventAt),
          late: false,
          authorId: author.id,
          writtenAsTrainee: author.role === 'trainee',
          text,
          equipmentId: extra.equipmentId ?? null,
          readingSetId: null,
          flagId: null,
          conditionId: null,
          carryToHandover: extra.carryToHandover ?? false,
        },
        { transaction },
      );
      created += 1;
    };
    const review = async (shiftStart: Date, position: string, reviewer: User) => {
      const end = nextShiftStart(shiftStart, timeZone, shiftChangeTimes);
      await LogReview.create({ unitId, position, shiftStart, reviewedBy: reviewer.id, reviewedAt: new Date(end.getTime() - 25 * 60_000) }, { transaction });
      created += 1;
    };

    // Crew A, two days back: something for the logbook history and a trainer's review.
    await entry(hours(twoDaysBack, 4.5), trainee, 'field_cw_tower', 'alarm_abnormal', 'Hotwell level creeping up on Unit 1 during the round; told the control room. Level controller found in manual, put back to auto by the operator.');
    await review(twoDaysBack, 'field_cw_tower', lead);

    // Crew D, last night: the pump comes out for its seal, and the time-limited condition starts.
    const isolatedAt = hours(night, 8.5);
    await entry(isolatedAt, nightField, 'field_cw_tower', 'equipment_status', 'Isolated 1-CWP-B for seal replacement under permit WP-1187; 1-CWP-A carrying the load.', { equipmentId: pumpB?.id ?? null, carryToHandover: true });
    await review(night, 'field_cw_tower', nightLead);
    await Condition.create(
      {
        unitId,
        title: '1-CWP-B out of service (seal replacement)',
        requiredAction: 'Restore 1-CWP-B to service within 72 h, or reduce Unit 1 load per the operating procedure.',
        startedAt: isolatedAt,
        limitAt: new Date(isolatedAt.getTime() + 72 * 3_600_000),
        ownerId: nightLead.id,
        openedBy: nightField.id,
        openedAt: isolatedAt,
        closedBy: null,
        closedAt: null,
        closingEntryId: null,
      },
      { transaction },
    );
    created += 1;

    // Crew A, the shift in progress.
    await entry(soFar(0.05), operator, 'control_room', 'communication', 'Took the shift from crew D; walked down the condenser panel with the outgoing operator. 1-CWP-B still isolated for its seal.');
    await entry(soFar(0.4), operator, 'control_room', 'alarm_abnormal', 'Backpressure 5.3 kPa a, 0.5 kPa above expected; cleanliness trending down. Informed the shift lead.', { carryToHandover: true });
    await entry(soFar(0.7), field, 'field_cw_tower', 'operation', 'Backwashed Unit 1 waterbox A; screen ΔP back to normal.');

    // Unit 2: raised by the lead on shift four and a half days back, cleared by the lead a shift-and-a-half later.
    const raisedShift = roster.shiftsBack(now, 9);
    const clearedShift = roster.shiftsBack(now, 6);
    const leadOf = (shiftStart: Date) => roster.members(roster.crewOf(shiftStart)!).lead[0]!;
    const fieldOf = (shiftStart: Date) => roster.members(roster.crewOf(shiftStart)!).field[0] ?? leadOf(shiftStart);
    await Flag.create(
      {
        unitId: otherUnitId,
        parameter: 'cycles',
        origin: 'manual',
        severity: 'watch',
        status: 'cleared',
        firstReadingSetId: null,
        lastReadingSetId: null,
        lastValue: null,
        raisedAt: hours(raisedShift, 3),
        lastSeenAt: hours(raisedShift, 3),
        raisedBy: leadOf(raisedShift).id,
        comment: 'Basin conductivity analyser reads about 8 % above the lab sample; cycles on the round are overstated until it is recalibrated.',
        assignedTo: fieldOf(raisedShift).id,
        followUp: 'Take a basin sample for the lab on each round until I&C has recalibrated the analyser.',
        clearedBy: leadOf(clearedShift).id,
        clearedAt: hours(clearedShift, 5),
        clearComment: 'Analyser recalibrated by I&C under WO 24-0902; agrees with the lab sample within 2 %.',
      },
      { transaction },
    );
    created += 1;

    // Issued by crew A's lead on that shift two days back.
    const issuedAt = hours(twoDaysBack, 2);
    await StandingOrder.create(
      {
        stationId,
        title: 'Unit 1: hourly TTD while cleanliness is below 0.75',
        bodyHtml: '<p>Until the tubes are cleaned, record <strong>TTD every hour</strong> on the Unit 1 round and tell the shift lead if it passes 9 K.</p>',
        bodyText: 'Until the tubes are cleaned, record TTD every hour on the Unit 1 round and tell the shift lead if it passes 9 K.',
        effectiveFrom: issuedAt,
        effectiveTo: new Date(issuedAt.getTime() + 14 * 86_400_000),
        crewIds: [],
        positions: ['control_room'],
        issuedBy: lead.id,
        issuedAt,
      },
      { transaction },
    );
    created += 1;
  });
  return created;
}
