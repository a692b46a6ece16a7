import { Router } from 'express';
import {
  decisionSchema,
  newTaskSchema,
  newTrainingEntrySchema,
  rejectEntrySchema,
  retireTaskSchema,
  taskChangeSchema,
  trainingAmendmentSchema,
} from '../../../shared/schemas/training';
import { allow, signedIn } from '../../lib/auth';
import { Forbidden } from '../../lib/errors';
import { parseId, parseInput } from '../../lib/validate';
import { mayReadTrainingOf } from '../../../shared/policies/training';
import { countersignQueue, crewQualifications, currentTasks, presentTask, progressOf, taskVersions, trainerQueue, type TrainingService } from './service';

const catalogueEditors = allow('training.catalogue');
const trainees = allow('training.practice');
const countersigners = allow('training.countersign');
const trainers = allow('training.decide');
const reviewers = allow('training.review-queue');
const crewViewers = allow('training.crews');

export function trainingRoutes(training: TrainingService): Router {
  const router = Router();

  router.get('/training/tasks', signedIn, async (req, res) => {
    const includeRetired = req.query.includeRetired === 'true';
    res.json({ tasks: (await currentTasks({ includeRetired })).map(presentTask) });
  });

  router.get('/training/tasks/:taskKey/versions', signedIn, async (req, res) => {
    res.json({ versions: await taskVersions(String(req.params.taskKey)) });
  });

  router.post('/training/tasks', catalogueEditors, async (req, res) => {
    res.status(201).json({ task: await training.createTask(req.user!, parseInput(newTaskSchema, req.body)) });
  });

  router.put('/training/tasks/:taskKey', catalogueEditors, async (req, res) => {
    res.json({ task: await training.changeTask(req.user!, String(req.params.taskKey), parseInput(taskChangeSchema, req.body)) });
  });

  router.post('/training/tasks/:taskKey/retire', catalogueEditors, async (req, res) => {
    const { changeNote } = parseInput(retireTaskSchema, req.body);
    res.json({ task: await training.changeTask(req.user!, String(req.params.taskKey), { retired: true, changeNote }) });
  });

  router.post('/training/entries', trainees, async (req, res) => {
    const entry = await training.recordEntry(req.user!, parseInput(newTrainingEntrySchema, req.body));
    res.status(201).json({ id: entry.id, status: entry.status });
  });

  router.post('/training/entries/:id/countersign', countersigners, async (req, res) => {
    await training.settleEntry(req.user!, parseId(req.params.id), { status: 'countersigned' });
    res.json({ ok: true });
  });

  router.post('/training/entries/:id/reject', countersigners, async (req, res) => {
    const { reason } = parseInput(rejectEntrySchema, req.body);
    await training.settleEntry(req.user!, parseId(req.params.id), { status: 'rejected', reason });
    res.json({ ok: true });
  });

  router.post('/training/decisions', trainers, async (req, res) => {
    const decision = await training.decide(req.user!, parseInput(decisionSchema, req.body));
    res.status(201).json({ id: decision.id, decision: decision.decision });
  });

  router.post('/training/amendments', allow('training.amend'), async (req, res) => {
    const amendment = await training.amend(req.user!, parseInput(trainingAmendmentSchema, req.body));
    res.status(201).json({ id: amendment.id });
  });

  router.get('/training/me', trainees, async (req, res) => {
    res.json(await progressOf(req.user!.id));
  });

  router.get('/training/trainees/:id', signedIn, async (req, res) => {
    const id = parseId(req.params.id);
    if (!mayReadTrainingOf(req.user!, id)) throw new Forbidden('Trainees see their own training records only');
    res.json(await progressOf(id));
  });

  router.get('/training/countersign-queue', countersigners, async (req, res) => {
    res.json({ entries: await countersignQueue(req.user!) });
  });

  router.get('/training/review-queue', reviewers, async (_req, res) => {
    res.json(await trainerQueue());
  });

  router.get('/training/crews/:crewId', crewViewers, async (req, res) => {
    res.json(await crewQualifications(parseId(req.params.crewId, 'crewId')));
  });

  return router;
}
