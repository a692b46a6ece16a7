// Historian CSV import: map columns, preview every row, then store the valid ones in batches.
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { ReadingSetSi } from '../../../shared/calc/evaluate';
import { type ImportField, type ImportMapping, type ImportRowReport } from '../../../shared/schemas/imports';
import { readingSetInputSchema, type ReadingSetInput } from '../../../shared/schemas/reading-set';
import { publish } from '../../lib/live';
import { recordAudit } from '../../lib/audit';
import { convertReadingSet } from '../../lib/convert-readings';
import { HttpError, ValidationError, fieldErrorsFromZod } from '../../lib/errors';
import { unitOfWork } from '../../lib/unit-of-work';
import { takeFlagTurn } from '../flags/index';
import { requireUnit, unjudgedReason, versionStarts } from '../plant/index';
import { settingsForStation } from '../stations/index';
import { parseStationTime } from '../../../shared/station-time';
import { ReadingSet } from '../readings/index';
import { checkTakenAt, storeImportBatch } from '../readings/index';
import { ImportMappingRow } from './model';
import { parseCsv } from './parse-csv';
import { logger } from '../../lib/logger';

type ValidRow = { row: number; takenAt: Date; raw: ReadingSetInput; si: ReadingSetSi };

type ParsedTime = { at: Date } | { error: string };
const NOT_A_TIME = 'Not a date-time (use ISO 8601, e.g. 2026-03-01T14:00:00Z, or station time 2026-03-01 15:00)';

/**
 * ISO 8601 with an offset or Z keeps it. Without one the time is the station's wall clock. A historian that
 * writes local times shows the hour the clocks go back twice, in order: the first row with such a time is
 * read as its first occurrence and a later row with the same text as the second (`repeats` counts them).
 */
function parseTime(text: string | undefined, timeZone: string, repeats: Map<string, number>): ParsedTime | null {
  if (!text) return null;
  const trimmed = text.trim();
  const iso = /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})?$/;
  if (!iso.test(trimmed)) return { error: NOT_A_TIME };
  if (/(Z|[+-]\d{2}:?\d{2})$/.test(trimmed)) {
    const date = new Date(trimmed.replace(' ', 'T'));
    return Number.isNaN(date.getTime()) ? { error: NOT_A_TIME } : { at: date };
  }
  const first = parseStationTime(trimmed, timeZone);
  if (!first.ok) return { error: first.message };
  if (!first.repeated) return { at: first.at };
  const key = first.at.toISOString();
  const seen = repeats.get(key) ?? 0;
  repeats.set(key, seen + 1);
  return { at: seen === 0 ? first.repeated.first : first.repeated.second };
}

function cell(row: Record<string, string>, column: string | undefined): string | undefined {
  if (!column) return undefined;
  const value = row[column];
  return value === undefined || value.trim() === '' ? undefined : value.trim();
}

function buildReading(unitId: number, row: Record<string, string>, mapping: ImportMapping): { raw?: ReadingSetInput; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const value = (field: ImportField) => {
    const spec = mapping.columns[field];
    const text = cell(row, spec?.column);
    if (text === undefined) return undefined;
    const number = Number(text.replace(',', '.'));
    if (!Number.isFinite(number)) errors[field] = `“${text.slice(0, 40)}” is not a number`;
    return number;
  };
  const quantity = (field: ImportField) => {
    const v = value(field);
    return v === undefined ? null : { value: v, unit: mapping.columns[field]!.unit };
  };
  const temperature = (field: ImportField) => quantity(field);
  const candidate = {
    unitId,
    pressure: quantity('pressure'),
    barometer: quantity('barometer'),
    hotwellTemperature: temperature('hotwellTemperature'),
    cwInletTemperature: temperature('cwInletTemperature'),
    cwOutletTemperature: temperature('cwOutletTemperature'),
    cwFlow: quantity('cwFlow'),
    steamFlow: quantity('steamFlow'),
    dissolvedOxygenPpb: value('dissolvedOxygenPpb') ?? null,
    tower: {
      coldWaterTemperature: temperature('basinTemperature'),
      wetBulbTemperature: temperature('wetBulbTemperature'),
      dryBulbTemperature: temperature('dryBulbTemperature'),
      relativeHumidityPercent: value('relativeHumidityPercent') ?? null,
    },
  };
  if (Object.keys(errors).length) return { errors };
  const parsed = readingSetInputSchema.safeParse(candidate);
  if (!parsed.success) {
    for (const [path, message] of Object.entries(fieldErrorsFromZod(parsed.error))) {
      const field = path.split('.')[0] === 'tower' ? path.split('.')[1]! : path.split('.')[0]!;
      errors[field] ??= path.endsWith('.value') || !path.includes('.') ? (candidate[field as keyof typeof candidate] == null ? 'missing' : message) : message;
    }
    return { errors };
  }
  return { raw: parsed.data, errors };
}

export type ImportAnalysis = {
  reports: ImportRowReport[];
  valid: ValidRow[];
  counts: { rows: number; valid: number; invalid: number; duplicate: number };
  /** Of the duplicates, rows stored by an earlier import (the rest repeat an earlier row of this file). */
  alreadyImported: number;
  /** The station's zone, in which times without an offset were read. */
  timeZone: string;
};

export async function analyseImport(unitId: number, buffer: Buffer, mapping: ImportMapping): Promise<ImportAnalysis> {
  const unit = await requireUnit(unitId);
  const { headers, rows } = parseCsv(buffer);
  const [starts, { timeZone }] = await Promise.all([versionStarts(unitId), settingsForStation(unit.stationId)]);
  const missing = [mapping.timeColumn, ...Object.values(mapping.columns).map((c) => c!.column)].filter((c) => !headers.includes(c));
  if (missing.length) throw new ValidationError({ mapping: `The file has no column named ${missing.map((m) => `“${m}”`).join(', ')}` });

  const reports: ImportRowReport[] = [];
  const candidates: ValidRow[] = [];
  const seenInFile = new Set<string>();
  const repeats = new Map<string, number>();
  rows.forEach((row, index) => {
    const rowNumber = index + 2; // line in the file, counting the header
    const time = parseTime(cell(row, mapping.timeColumn), timeZone, repeats);
    const takenAt = time && 'at' in time ? time.at : null;
    const errors: Record<string, string> = {};
    if (!takenAt) errors.time = time && 'error' in time ? time.error : NOT_A_TIME;
    else {
      try {
        checkTakenAt(takenAt, 'time');
      } catch (error) {
        if (error instanceof ValidationError) Object.assign(errors, error.fields);
        else throw error;
      }
      // History from before the unit's first design data or limits has nothing to be judged by.
      const unjudged = errors.time ? null : unjudgedReason(takenAt, starts, timeZone);
      if (unjudged) errors.time = unjudged;
    }
    const built = buildReading(unitId, row, mapping);
    Object.assign(errors, built.errors);
    let si: ReadingSetSi | null = null;
    if (built.raw && !Object.keys(errors).length) {
      try {
        si = convertReadingSet(built.raw);
      } catch (error) {
        if (error instanceof ValidationError) Object.assign(errors, error.fields);
        else throw error;
      }
    }
    const key = takenAt?.toISOString() ?? '';
    if (Object.keys(errors).length || !si || !takenAt) {
      reports.push({ row: rowNumber, takenAt: takenAt?.toISOString() ?? null, status: 'invalid', errors });
    } else if (seenInFile.has(key)) {
      reports.push({ row: rowNumber, takenAt: key, status: 'duplicate', errors: { time: 'Same time as an earlier row of this file' } });
    } else {
      seenInFile.add(key);
      candidates.push({ row: rowNumber, takenAt, raw: built.raw!, si });
      reports.push({ row: rowNumber, takenAt: key, status: 'valid', errors: {} });
    }
  });

  // Rows already imported before (same unit and time) are reported, not stored again.
  const existing = new Set<string>();
  if (candidates.length) {
    const times = candidates.map((c) => c.takenAt.getTime());
    const stored = await ReadingSet.findAll({
      where: { unitId, importKey: { [Op.ne]: null }, takenAt: { [Op.between]: [new Date(Math.min(...times)), new Date(Math.max(...times))] } },
      attributes: ['importKey'],
    });
    for (const s of stored) existing.add(s.importKey!);
  }
  const valid = candidates.filter((c) => !existing.has(c.takenAt.toISOString()));
  for (const report of reports) {
    if (report.status === 'valid' && existing.has(report.takenAt!)) {
      report.status = 'duplicate';
      report.errors = { time: 'Already imported' };
    }
  }
  const count = (status: ImportRowReport['status']) => reports.filter((r) => r.status === status).length;
  return {
    reports,
    valid,
    counts: { rows: rows.length, valid: count('valid'), invalid: count('invalid'), duplicate: count('duplicate') },
    alreadyImported: candidates.length - valid.length,
    timeZone,
  };
}

/** Rows per transaction: a round on the same unit waits for at most one batch. */
/** Step 1 of an import: the file's columns and a few rows, to map them. Stores nothing. */
export async function inspectFile(unitId: number, buffer: Buffer) {
  await requireUnit(unitId);
  const { headers, rows } = parseCsv(buffer);
  return { headers, sample: rows.slice(0, 5), rowCount: rows.length };
}

export const IMPORT_BATCH_ROWS = 100;

export function makeImportService(sequelize: Sequelize, options: { batchRows?: number } = {}) {
  const batchRows = options.batchRows ?? IMPORT_BATCH_ROWS;

  async function rememberMapping(actor: { id: number }, unitId: number, mapping: ImportMapping, transaction: Transaction) {
    const [mappingRow, created] = await ImportMappingRow.findOrCreate({
      where: { unitId, source: mapping.source },
      defaults: { unitId, source: mapping.source, mapping, updatedBy: actor.id, updatedAt: new Date() },
      transaction,
    });
    if (!created) await mappingRow.update({ mapping, updatedBy: actor.id, updatedAt: new Date() }, { transaction });
  }

  /**
   * Stores one batch as one unit of work. It takes the unit's turn first (rounds that may open a
   * flag take the same one, so neither deadlocks the other), then skips rows stored meanwhile by
   * another import of the same file: with the turn held, that check cannot go stale.
   */
  async function storeBatch(actor: { id: number; role: string }, unitId: number, rows: ValidRow[], first: boolean, mapping: ImportMapping, counts: ImportAnalysis['counts']) {
    return unitOfWork(
      sequelize,
      async (transaction) => {
        await takeFlagTurn(unitId, transaction);
        const keys = rows.map((r) => r.takenAt.toISOString());
        const there = new Set(
          (await ReadingSet.findAll({ where: { unitId, importKey: keys }, attributes: ['importKey'], transaction })).map((r) => r.importKey!),
        );
        const fresh = rows.filter((r) => !there.has(r.takenAt.toISOString())).map((r) => ({ ...r, importKey: r.takenAt.toISOString() }));
        const { flagsRaised, outsidePlausible } = await storeImportBatch(unitId, actor, fresh, transaction);
        const stored = fresh.length;
        if (first) await rememberMapping(actor, unitId, mapping, transaction);
        await recordAudit(
          {
            actorId: actor.id,
            action: 'import.batch',
            entity: 'unit',
            entityId: unitId,
            after: { source: mapping.source, firstRow: rows[0]?.row ?? null, lastRow: rows.at(-1)?.row ?? null, stored, alreadyThere: there.size, ...(first ? { file: counts } : {}) },
          },
          transaction,
        );
        publish(transaction, { entity: 'import', id: unitId, unitId });
        return { stored, alreadyThere: there.size, flagsRaised, outsidePlausible };
      },
      'import batch',
    );
  }

  /**
   * Stores the valid rows in batches of `batchRows`, each its own transaction. A failure part-way
   * keeps the batches already written, whole, and says so; importing the same file again stores
   * only the rest, since rows are keyed by unit and time.
   */
  async function commit(actor: { id: number; role: string }, unitId: number, buffer: Buffer, mapping: ImportMapping) {
    const analysis = await analyseImport(unitId, buffer, mapping);
    const totals = { stored: 0, alreadyThere: analysis.alreadyImported, flagsRaised: 0, outsidePlausible: 0, batches: 0 };
    const batches: ValidRow[][] = [];
    for (let i = 0; i < analysis.valid.length; i += batchRows) batches.push(analysis.valid.slice(i, i + batchRows));
    if (batches.length === 0) batches.push([]);
    for (const [index, batch] of batches.entries()) {
      try {
        const done = await storeBatch(actor, unitId, batch, index === 0, mapping, analysis.counts);
        totals.stored += done.stored;
        totals.alreadyThere += done.alreadyThere;
        totals.flagsRaised += done.flagsRaised;
        totals.outsidePlausible += done.outsidePlausible;
        totals.batches += 1;
      } catch (error) {
        if (totals.batches === 0 || error instanceof HttpError) throw error;
        logger.error({ unitId, batch: index + 1, batches: batches.length, err: error }, 'import batch failed');
        throw new HttpError(
          500,
          'IMPORT_INCOMPLETE',
          `The import stopped at file row ${batch[0]!.row}: ${totals.stored} rows were stored (${totals.batches} whole batches of up to ${batchRows} rows) and nothing of the batch that failed. ` +
            'Import the same file again to add the rest; rows already stored are skipped.',
        );
      }
    }
    return {
      timeZone: analysis.timeZone,
      imported: totals.stored,
      alreadyThere: totals.alreadyThere,
      batches: totals.batches,
      batchRows,
      flagsRaised: totals.flagsRaised,
      /** Rows stored marked "outside plausible range". */
      outsidePlausible: totals.outsidePlausible,
      counts: analysis.counts,
      problems: analysis.reports.filter((r) => r.status !== 'valid').slice(0, 500),
    };
  }
  return { commit };
}
export type ImportService = ReturnType<typeof makeImportService>;

export async function rememberedMappings(unitId: number) {
  await requireUnit(unitId);
  const rows = await ImportMappingRow.findAll({ where: { unitId }, order: [['updatedAt', 'DESC']] });
  return rows.map((r) => ({ source: r.source, mapping: r.mapping, updatedAt: r.updatedAt.toISOString() }));
}

