import { Router } from 'express';
import { z } from 'zod';
import { amendReadingSchema, recordReadingSchema } from '../../../shared/schemas/readings';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { getReading, listReadings, type ReadingService } from './service';

const listQuery = z.object({
  before: z.iso.datetime({ offset: true }).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

// Trainees record rounds (marked for countersign); trainers review and administrators set up, neither records.
const mayRecord = allow('reading.record');
const mayCorrect = allow('reading.amend');
const mayCountersign = allow('reading.countersign');

export function readingRoutes(readings: ReadingService): Router {
  const router = Router();

  router.get('/units/:unitId/readings', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    const q = parseInput(listQuery, req.query);
    res.json({ readings: await listReadings(unitId, { limit: q.limit, before: q.before ? new Date(q.before) : undefined }) });
  });

  router.post('/units/:unitId/readings', mayRecord, async (req, res) => {
    const input = parseInput(recordReadingSchema, req.body);
    const saved = await readings.record(req.user!, parseId(req.params.unitId, 'unitId'), input);
    // A retry of a round already stored answers 200 with that round, not 201 with a second.
    res.status(saved.repeated ? 200 : 201).json(saved);
  });

  router.get('/readings/:id', signedIn, async (req, res) => {
    res.json(await getReading(parseId(req.params.id)));
  });

  router.post('/readings/:id/amendments', mayCorrect, async (req, res) => {
    const input = parseInput(amendReadingSchema, req.body);
    res.status(201).json(await readings.amend(req.user!, parseId(req.params.id), input));
  });

  router.post('/readings/:id/countersign', mayCountersign, async (req, res) => {
    res.json(await readings.countersign(req.user!, parseId(req.params.id)));
  });

  return router;
}
