import { Router } from 'express';
import { amendLogEntrySchema, logQuerySchema, newLogEntrySchema, signReviewSchema } from '../../../shared/schemas/log';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { listEntries, recentShiftsWithReviews, type LogService } from './service';


export function logRoutes(log: LogService): Router {
  const router = Router();

  router.get('/units/:unitId/log', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    res.json({ entries: await listEntries(unitId, parseInput(logQuerySchema, req.query), req.user!) });
  });

  router.post('/units/:unitId/log', allow('log.write'), async (req, res) => {
    const { entry, repeated } = await log.addEntry(req.user!, parseId(req.params.unitId, 'unitId'), parseInput(newLogEntrySchema, req.body));
    // A retry of an entry already stored answers 200 with that entry, not 201 with a second.
    res.status(repeated ? 200 : 201).json({
      id: entry.id,
      late: entry.late,
      arrivedLate: entry.arrivedLate,
      eventAt: entry.eventAt.toISOString(),
      enteredAt: entry.enteredAt.toISOString(),
      receivedAt: entry.receivedAt.toISOString(),
      shiftStart: entry.shiftStart.toISOString(),
      clientId: entry.clientId,
    });
  });

  router.post('/log/:id/amendments', allow('log.amend'), async (req, res) => {
    const amendment = await log.amend(req.user!, parseId(req.params.id), parseInput(amendLogEntrySchema, req.body));
    res.status(201).json({ id: amendment.id });
  });

  /** The station's settings and recent shifts with who signed each position's review. */
  router.get('/units/:unitId/log/shifts', signedIn, async (req, res) => {
    res.json(await recentShiftsWithReviews(parseId(req.params.unitId, 'unitId')));
  });

  router.post('/units/:unitId/log/reviews', allow('log.review'), async (req, res) => {
    const input = parseInput(signReviewSchema, req.body);
    const review = await log.signReview(req.user!, parseId(req.params.unitId, 'unitId'), input.position, input.shiftStart);
    res.status(201).json({ id: review.id, reviewedAt: review.reviewedAt.toISOString() });
  });

  return router;
}
