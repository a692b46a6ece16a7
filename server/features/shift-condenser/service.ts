// Reads a unit's rounds over a shift window and hands them to the pure summary in
// shared/shift-condenser.ts. Used live by the handover board and, inside the submit transaction,
// to freeze what the outgoing crew handed over.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { CheckKey } from '../../../shared/calc/check-catalog';
import type { Status } from '../../../shared/calc/limits';
import { nextShiftStart, shiftStartFor } from '../../../shared/shift-time';
import { shiftCondenserChecks, shiftCondenserState, type RoundValues, type ShiftCondenserState } from '../../../shared/shift-condenser';
import { NotFound, ValidationError } from '../../lib/errors';
import { designInForceOrNone, findUnit } from '../plant/index';
import { latestEvaluationBetween } from '../readings/index';
import { stationShiftSetup } from '../stations/index';

type Row = { id: number; p: CheckKey; t: Date | string; v: number; s: Status };

export function makeShiftCondenserService(sequelize: Sequelize) {
  /** The state over [shiftStart, until]; `transaction` makes it read what that transaction sees. */
  async function stateOver(unitId: number, shiftStart: Date, until: Date, transaction?: Transaction): Promise<ShiftCondenserState> {
    const unit = await findUnit(unitId, transaction);
    if (!unit) throw new NotFound('That unit');
    const { settings } = await stationShiftSetup(unit.stationId, transaction);
    const { timeZone, shiftChangeTimes } = settings;
    // The start-of-shift value may come from the previous shift: read from its start.
    const previousStart = shiftStartFor(new Date(shiftStart.getTime() - 1), timeZone, shiftChangeTimes);
    const shiftEnd = nextShiftStart(shiftStart, timeZone, shiftChangeTimes);
    const placeholders = shiftCondenserChecks.map(() => '?').join(', ');
    // Answered from the covering trend index (unit_id, parameter, taken_at, value, status) + primary key.
    const rows = await sequelize.query<Row>(
      `SELECT reading_set_id AS id, parameter AS p, taken_at AS t, value AS v, status AS s FROM reading_values
       WHERE unit_id = ? AND parameter IN (${placeholders}) AND taken_at BETWEEN ? AND ?`,
      { replacements: [unitId, ...shiftCondenserChecks, previousStart, until], type: QueryTypes.SELECT, transaction },
    );
    const rounds = new Map<number, RoundValues>();
    for (const row of rows) {
      const id = Number(row.id);
      const round = rounds.get(id) ?? { readingSetId: id, takenAt: new Date(row.t).getTime(), values: {} };
      round.values[row.p] = { value: Number(row.v), status: row.s };
      rounds.set(id, round);
    }
    const [latestReasons, currency] = await Promise.all([latestReasonsIn(unitId, shiftStart, until, transaction), currencyAt(unitId, until, transaction)]);
    return shiftCondenserState({ unitId, timeZone, shiftStart, shiftEnd, until, rounds: [...rounds.values()], latestReasons, currency });
  }

  /** The shift in progress (no `shiftStartText`) or a past one, up to now or its end. */
  async function forShift(unitId: number, shiftStartText: string | undefined, now = new Date()): Promise<ShiftCondenserState> {
    const unit = await findUnit(unitId);
    if (!unit) throw new NotFound('That unit');
    const { settings } = await stationShiftSetup(unit.stationId);
    let start = shiftStartFor(now, settings.timeZone, settings.shiftChangeTimes);
    if (shiftStartText !== undefined) {
      start = new Date(shiftStartText);
      if (shiftStartFor(start, settings.timeZone, settings.shiftChangeTimes).getTime() !== start.getTime()) {
        throw new ValidationError({ shiftStart: `That time is not the start of a shift at this station (shift changes at ${settings.shiftChangeTimes.join(' and ')}, ${settings.timeZone})` });
      }
      if (start > now) throw new ValidationError({ shiftStart: 'That shift has not started yet' });
    }
    const end = nextShiftStart(start, settings.timeZone, settings.shiftChangeTimes);
    return stateOver(unitId, start, end < now ? end : now);
  }

  return { stateOver, forShift };
}
export type ShiftCondenserService = ReturnType<typeof makeShiftCondenserService>;

/** Why each check of the shift's latest round is absent, from that round's current evaluation. */
async function latestReasonsIn(unitId: number, from: Date, until: Date, transaction?: Transaction): Promise<Partial<Record<CheckKey, string>>> {
  const results = await latestEvaluationBetween(unitId, from, until, transaction);
  if (!results) return {};
  const reasons: Partial<Record<CheckKey, string>> = {};
  for (const key of shiftCondenserChecks) {
    const check = results.checks[key];
    if (check && check.value === null && check.reason) reasons[key] = check.reason;
  }
  return reasons;
}

async function currencyAt(unitId: number, at: Date, transaction?: Transaction): Promise<string | null> {
  const design = await designInForceOrNone(unitId, at, transaction);
  return design?.data.currency ?? null;
}
