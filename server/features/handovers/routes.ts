import { Router } from 'express';
import { answerSchema, editHandoverItemSchema, handoverAmendmentSchema, newHandoverItemSchema, questionSchema, saveNotesSchema } from '../../../shared/schemas/handovers';
import { allow, signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import type { HandoverService } from './service';
import { viewHandover } from './view';

// Crew members act on handovers; the service checks outgoing/incoming crew and role per action.
const crewMember = allow('handover.take-part');

export function handoverRoutes(handovers: HandoverService): Router {
  const router = Router();

  /** The shift change in progress and its board. A read: opening the board creates nothing. */
  router.get('/units/:unitId/handovers/current', signedIn, async (req, res) => {
    const { change, handover, mayStart, window } = await handovers.current(req.user!, parseId(req.params.unitId, 'unitId'));
    res.json({
      shiftChange: {
        shiftStart: change.shiftStart.toISOString(),
        handoverAt: change.handoverAt.toISOString(),
        timeZone: change.settings.timeZone,
        outgoingCrewId: change.outgoingCrewId,
        incomingCrewId: change.incomingCrewId,
        windowOpensAt: window.opensAt.toISOString(),
        windowClosesAt: window.closesAt.toISOString(),
      },
      mayStart,
      board: handover ? await viewHandover(handover.id) : null,
    });
  });

  /** Starts this shift change's draft; starting it again returns the same one. */
  router.post('/units/:unitId/handovers/current', crewMember, async (req, res) => {
    const handover = await handovers.start(req.user!, parseId(req.params.unitId, 'unitId'));
    res.status(201).json({ board: await viewHandover(handover.id) });
  });

  router.get('/handovers/:id', signedIn, async (req, res) => {
    res.json({ board: await viewHandover(parseId(req.params.id)) });
  });

  router.put('/handovers/:id/notes', crewMember, async (req, res) => {
    res.json(await handovers.saveNotes(req.user!, parseId(req.params.id), parseInput(saveNotesSchema, req.body)));
  });

  router.post('/handovers/:id/items', crewMember, async (req, res) => {
    const item = await handovers.addItem(req.user!, parseId(req.params.id), parseInput(newHandoverItemSchema, req.body));
    res.status(201).json({ id: item.id });
  });

  router.patch('/handover-items/:id', crewMember, async (req, res) => {
    await handovers.editItem(req.user!, parseId(req.params.id), parseInput(editHandoverItemSchema, req.body));
    res.json({ ok: true });
  });

  router.delete('/handover-items/:id', crewMember, async (req, res) => {
    await handovers.removeItem(req.user!, parseId(req.params.id));
    res.status(204).end();
  });

  router.post('/handovers/:id/submit', crewMember, async (req, res) => {
    const { alreadySubmitted } = await handovers.submit(req.user!, parseId(req.params.id));
    res.json({ alreadySubmitted, board: await viewHandover(parseId(req.params.id)) });
  });

  router.post('/handovers/:id/amendments', crewMember, async (req, res) => {
    const amendment = await handovers.amend(req.user!, parseId(req.params.id), parseInput(handoverAmendmentSchema, req.body));
    res.status(201).json({ id: amendment.id });
  });

  router.post('/handover-items/:id/acknowledge', crewMember, async (req, res) => {
    const { already } = await handovers.acknowledge(req.user!, parseId(req.params.id));
    res.status(already ? 200 : 201).json({ ok: true, already });
  });

  router.post('/handover-items/:id/queries', crewMember, async (req, res) => {
    const query = await handovers.ask(req.user!, parseId(req.params.id), parseInput(questionSchema, req.body));
    res.status(201).json({ id: query.id });
  });

  router.post('/handover-queries/:id/answer', crewMember, async (req, res) => {
    await handovers.answer(req.user!, parseId(req.params.id), parseInput(answerSchema, req.body).answer);
    res.json({ ok: true });
  });

  router.post('/handovers/:id/accept', crewMember, async (req, res) => {
    const { alreadyAccepted } = await handovers.accept(req.user!, parseId(req.params.id));
    res.json({ alreadyAccepted, board: await viewHandover(parseId(req.params.id)) });
  });

  return router;
}
