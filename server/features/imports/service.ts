// Historian CSV import: map columns, preview every row, then store the valid ones in one transaction.
import { Op, type Sequelize } from 'sequelize';
import type { ReadingSetSi } from '../../../shared/calc/evaluate';
import { importFields, type ImportField, type ImportMapping, type ImportRowReport } from '../../../shared/schemas/imports';
import { readingSetInputSchema, type ReadingSetInput } from '../../../shared/schemas/reading-set';
import { publish } from '../../lib/live';
import { recordAudit } from '../../lib/audit';
import { convertReadingSet } from '../../lib/convert-readings';
import { ValidationError, fieldErrorsFromZod } from '../../lib/errors';
import { requireUnit, unjudgedReason, versionStarts } from '../plant/versions';
import { settingsForStation } from '../stations/settings';
import { parseStationTime } from '../../../shared/station-time';
import { ReadingSet } from '../readings/model';
import { checkTakenAt, storeReading } from '../readings/service';
import { ImportMappingRow } from './model';
import { parseCsv } from './parse-csv';

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
  return { reports, valid, counts: { rows: rows.length, valid: count('valid'), invalid: count('invalid'), duplicate: count('duplicate') }, timeZone };
}

export function makeImportService(sequelize: Sequelize) {
  async function commit(actor: { id: number; role: string }, unitId: number, buffer: Buffer, mapping: ImportMapping) {
    const analysis = await analyseImport(unitId, buffer, mapping);
    let flagsRaised = 0;
    let outsidePlausible = 0;
    // All valid rows or none: a failure part-way leaves nothing half-imported.
    await sequelize.transaction(async (transaction) => {
      for (const row of analysis.valid) {
        const stored = await storeReading(
          // History is taken as the historian kept it: a row outside the plausible range is stored
          // marked (and its derived checks withheld) rather than refused, as nobody is there to confirm it.
          { unitId, takenAt: row.takenAt, raw: row.raw, si: row.si, actor, source: 'import', importKey: row.takenAt.toISOString(), confirmed: 'all' },
          transaction,
        );
        flagsRaised += stored.flagsRaised;
        if (stored.reading.outsidePlausible.length) outsidePlausible += 1;
      }
      const [mappingRow] = await ImportMappingRow.findOrCreate({
        where: { unitId, source: mapping.source },
        defaults: { unitId, source: mapping.source, mapping, updatedBy: actor.id, updatedAt: new Date() },
        transaction,
      });
      await mappingRow.update({ mapping, updatedBy: actor.id, updatedAt: new Date() }, { transaction });
      await recordAudit(
        { actorId: actor.id, action: 'import.commit', entity: 'unit', entityId: unitId, after: { source: mapping.source, ...analysis.counts, outsidePlausible } },
        transaction,
      );
      publish(transaction, { entity: 'import', id: unitId, unitId });
    });
    return {
      timeZone: analysis.timeZone,
      imported: analysis.valid.length,
      /** Rows stored marked "outside plausible range". */
      outsidePlausible,
      flagsRaised,
      counts: analysis.counts,
      problems: analysis.reports.filter((r) => r.status !== 'valid').slice(0, 500),
    };
  }
  return { commit };
}
export type ImportService = ReturnType<typeof makeImportService>;

export async function rememberedMappings(unitId: number) {
  const rows = await ImportMappingRow.findAll({ where: { unitId }, order: [['updatedAt', 'DESC']] });
  return rows.map((r) => ({ source: r.source, mapping: r.mapping, updatedAt: r.updatedAt.toISOString() }));
}

export const importFieldList = Object.entries(importFields).map(([key, spec]) => ({ key, ...spec }));
