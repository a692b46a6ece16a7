// The logbook as read: search (as a page or a CSV file) and the record of one past shift.
import Papa from 'papaparse';
import type { Sequelize } from 'sequelize';
import { documentKindLabels, type LogbookSearch } from '../../../shared/schemas/logbook';
import { firstStation } from '../plant/index';
import { settingsForStation, settingsForUnit } from '../stations/index';
import { pastShift } from './past-shift';
import { searchLogbook } from './search';

const CSV_ROWS = 5000;

/** Date filters are station-local days: the unit's station, or the first station. */
async function timeZoneFor(filters: LogbookSearch) {
  if (filters.unitId) return (await settingsForUnit(filters.unitId)).settings.timeZone;
  const station = await firstStation();
  return (await settingsForStation(station?.id ?? 0)).timeZone;
}

export function makeLogbookService(sequelize: Sequelize) {
  async function search(filters: LogbookSearch) {
    return searchLogbook(sequelize, filters, await timeZoneFor(filters));
  }

  /** The hits as a CSV file (with a BOM, for spreadsheets), up to 5 000 rows. */
  async function searchCsv(filters: LogbookSearch) {
    const { hits } = await searchLogbook(sequelize, filters, await timeZoneFor(filters), CSV_ROWS);
    const csv = Papa.unparse(
      hits.map((h) => ({
        occurred_at_utc: h.occurredAt,
        shift_start_utc: h.shiftStart ?? '',
        unit: h.unitName ?? 'station',
        crew: h.crewName ?? '',
        person: h.personName ?? '',
        record: documentKindLabels[h.kind as keyof typeof documentKindLabels] ?? h.kind,
        severity: h.severity ?? '',
        title: h.title,
        text: h.snippet,
      })),
      // Log text is typed by people: a cell starting with = + - @ must not run as a spreadsheet formula.
      { escapeFormulae: true },
    );
    return `\uFEFF${csv}`;
  }

  function shift(viewer: Express.User, unitId: number, shiftStartText: string) {
    return pastShift(sequelize, viewer, unitId, shiftStartText);
  }

  return { search, searchCsv, shift };
}
export type LogbookService = ReturnType<typeof makeLogbookService>;
