import { Router } from 'express';
import { amendLogEntrySchema, logQuerySchema, newLogEntrySchema, signReviewSchema, stationSettingsSchema } from '../../../shared/schemas/log';
import { recentShiftStarts, stationLocalLabel } from '../../../shared/shift-time';
import { adminOnly, authorize, signedIn } from '../../lib/auth';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { parseId, parseInput } from '../../lib/validate';
import { Station } from '../plant/model';
import { NotFound } from '../../lib/errors';
import { StationSettingsRow } from '../stations/model';
import { settingsForStation, settingsForUnit } from '../stations/settings';
import { listEntries, reviewsFor, type LogService } from './service';
import type { Sequelize } from 'sequelize';

const mayWrite = authorize(['trainee', 'operator', 'shift_lead', 'admin']);
const mayReview = authorize(['shift_lead']);

export function logRoutes(sequelize: Sequelize, log: LogService): Router {
  const router = Router();

  router.get('/stations/:stationId/settings', signedIn, async (req, res) => {
    const stationId = parseId(req.params.stationId, 'stationId');
    if (!(await Station.findByPk(stationId))) throw new NotFound('That station');
    res.json({ settings: await settingsForStation(stationId) });
  });

  router.put('/stations/:stationId/settings', adminOnly, async (req, res) => {
    const stationId = parseId(req.params.stationId, 'stationId');
    if (!(await Station.findByPk(stationId))) throw new NotFound('That station');
    const settings = parseInput(stationSettingsSchema, req.body);
    await sequelize.transaction(async (transaction) => {
      const before = await settingsForStation(stationId, transaction);
      await StationSettingsRow.upsert({ stationId, ...settings, updatedAt: new Date() }, { transaction });
      await recordAudit({ actorId: req.user!.id, action: 'station.settings', entity: 'station', entityId: stationId, before, after: settings }, transaction);
      publish(transaction, { entity: 'station_settings', id: stationId });
    });
    res.json({ settings });
  });

  router.get('/units/:unitId/log', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    await settingsForUnit(unitId);
    res.json({ entries: await listEntries(unitId, parseInput(logQuerySchema, req.query)) });
  });

  router.post('/units/:unitId/log', mayWrite, async (req, res) => {
    const entry = await log.addEntry(req.user!, parseId(req.params.unitId, 'unitId'), parseInput(newLogEntrySchema, req.body));
    res.status(201).json({ id: entry.id, late: entry.late, enteredAt: entry.enteredAt.toISOString(), shiftStart: entry.shiftStart.toISOString() });
  });

  router.post('/log/:id/amendments', mayWrite, async (req, res) => {
    const amendment = await log.amend(req.user!, parseId(req.params.id), parseInput(amendLogEntrySchema, req.body));
    res.status(201).json({ id: amendment.id });
  });

  /** The station's settings and recent shifts with who signed each position's review. */
  router.get('/units/:unitId/log/shifts', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    const { settings } = await settingsForUnit(unitId);
    const starts = recentShiftStarts(new Date(), settings.timeZone, settings.shiftChangeTimes, 14);
    res.json({
      settings,
      shifts: starts.map((s) => ({ start: s.toISOString(), label: stationLocalLabel(s, settings.timeZone) })),
      reviews: await reviewsFor(unitId, starts),
    });
  });

  router.post('/units/:unitId/log/reviews', mayReview, async (req, res) => {
    const input = parseInput(signReviewSchema, req.body);
    const review = await log.signReview(req.user!, parseId(req.params.unitId, 'unitId'), input.position, input.shiftStart);
    res.status(201).json({ id: review.id, reviewedAt: review.reviewedAt.toISOString() });
  });

  return router;
}
