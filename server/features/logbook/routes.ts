import { Router } from 'express';
import Papa from 'papaparse';
import type { Sequelize } from 'sequelize';
import { documentKindLabels, logbookSearchSchema, reviewCommentSchema, type LogbookSearch } from '../../../shared/schemas/logbook';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { Station } from '../plant/model';
import { settingsForStation, settingsForUnit } from '../stations/settings';
import { searchLogbook } from './search';
import { pastShift } from './past-shift';
import type { ReviewCommentService } from './review-comments';

const mayComment = allow('review.comment');
const CSV_ROWS = 5000;

/** Date filters are station-local days: the unit's station, or the first station. */
async function timeZoneFor(filters: LogbookSearch) {
  if (filters.unitId) return (await settingsForUnit(filters.unitId)).settings.timeZone;
  const station = await Station.findOne({ order: [['id', 'ASC']] });
  return (await settingsForStation(station?.id ?? 0)).timeZone;
}

export function logbookRoutes(sequelize: Sequelize, comments: ReviewCommentService): Router {
  const router = Router();

  router.get('/logbook/search', signedIn, async (req, res) => {
    const filters = parseInput(logbookSearchSchema, req.query);
    res.json(await searchLogbook(sequelize, filters, await timeZoneFor(filters)));
  });

  router.get('/logbook/search.csv', signedIn, async (req, res) => {
    const filters = parseInput(logbookSearchSchema, req.query);
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
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="hotwell-logbook-search.csv"');
    res.send(`\uFEFF${csv}`);
  });

  router.get('/logbook/units/:unitId/shifts/:shiftStart', signedIn, async (req, res) => {
    res.json(await pastShift(sequelize, req.user!, parseId(req.params.unitId, 'unitId'), String(req.params.shiftStart)));
  });

  router.post('/logbook/review-comments', mayComment, async (req, res) => {
    res.status(201).json({ comment: await comments.add(req.user!, parseInput(reviewCommentSchema, req.body)) });
  });

  router.get('/logbook/review-comments/mine', signedIn, async (req, res) => {
    res.json({ comments: await comments.forPerson(req.user!) });
  });

  return router;
}
