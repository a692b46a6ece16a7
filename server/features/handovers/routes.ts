import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { answerSchema, crewRotationSchema, crewSwapSchema, handoverAmendmentSchema, newHandoverItemSchema, questionSchema, saveNotesSchema } from '../../../shared/schemas/handovers';
import { adminOnly, authorize, signedIn } from '../../lib/auth';
import { recordAudit } from '../../lib/audit';
import { NotFound, ValidationError } from '../../lib/errors';
import { parseId, parseInput } from '../../lib/validate';
import { Crew, Station } from '../plant/model';
import { CrewSwap } from '../shifts/model';
import { StationSettingsRow } from '../stations/model';
import { defaultStationSettings } from '../stations/settings';
import { viewHandover, type HandoverService } from './service';
import { shiftStartFor } from '../../../shared/shift-time';
import { settingsForStation } from '../stations/settings';

// Crew members act on handovers; the service checks outgoing/incoming crew and role per action.
const crewMember = authorize(['trainee', 'operator', 'shift_lead']);

export function handoverRoutes(sequelize: Sequelize, handovers: HandoverService): Router {
  const router = Router();

  router.get('/units/:unitId/handovers/current', signedIn, async (req, res) => {
    const { change, handover } = await handovers.current(req.user!, parseId(req.params.unitId, 'unitId'));
    res.json({
      shiftChange: { shiftStart: change.shiftStart.toISOString(), handoverAt: change.handoverAt.toISOString(), timeZone: change.settings.timeZone, outgoingCrewId: change.outgoingCrewId, incomingCrewId: change.incomingCrewId },
      board: handover ? await viewHandover(handover.id) : null,
    });
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

  router.post('/handovers/:id/submit', crewMember, async (req, res) => {
    await handovers.submit(req.user!, parseId(req.params.id));
    res.json({ board: await viewHandover(parseId(req.params.id)) });
  });

  router.post('/handovers/:id/amendments', crewMember, async (req, res) => {
    const amendment = await handovers.amend(req.user!, parseId(req.params.id), parseInput(handoverAmendmentSchema, req.body));
    res.status(201).json({ id: amendment.id });
  });

  router.post('/handover-items/:id/acknowledge', crewMember, async (req, res) => {
    await handovers.acknowledge(req.user!, parseId(req.params.id));
    res.status(201).json({ ok: true });
  });

  router.post('/handover-items/:id/queries', crewMember, async (req, res) => {
    const query = await handovers.ask(req.user!, parseId(req.params.id), parseInput(questionSchema, req.body).question);
    res.status(201).json({ id: query.id });
  });

  router.post('/handover-queries/:id/answer', crewMember, async (req, res) => {
    await handovers.answer(req.user!, parseId(req.params.id), parseInput(answerSchema, req.body).answer);
    res.json({ ok: true });
  });

  router.post('/handovers/:id/accept', crewMember, async (req, res) => {
    await handovers.accept(req.user!, parseId(req.params.id));
    res.json({ board: await viewHandover(parseId(req.params.id)) });
  });

  router.put('/stations/:stationId/crew-rotation', adminOnly, async (req, res) => {
    const stationId = parseId(req.params.stationId, 'stationId');
    if (!(await Station.findByPk(stationId))) throw new NotFound('That station');
    const rotation = parseInput(crewRotationSchema, req.body);
    if ((await Crew.count({ where: { id: rotation.crewIds, stationId } })) !== new Set(rotation.crewIds).size) throw new ValidationError({ crewIds: 'Unknown crew' });
    const settings = await settingsForStation(stationId);
    if (shiftStartFor(new Date(rotation.anchorShiftStart), settings.timeZone, settings.shiftChangeTimes).getTime() !== Date.parse(rotation.anchorShiftStart)) {
      throw new ValidationError({ anchorShiftStart: 'Not the start of a shift at this station' });
    }
    await sequelize.transaction(async (transaction) => {
      const row = await StationSettingsRow.findByPk(stationId, { transaction });
      if (row) await row.update({ crewRotation: rotation }, { transaction });
      else await StationSettingsRow.create({ stationId, ...defaultStationSettings, crewRotation: rotation, updatedAt: new Date() }, { transaction });
      await recordAudit({ actorId: req.user!.id, action: 'station.crew_rotation', entity: 'station', entityId: stationId, after: rotation }, transaction);
    });
    res.json({ rotation });
  });

  router.post('/stations/:stationId/crew-swaps', adminOnly, async (req, res) => {
    const stationId = parseId(req.params.stationId, 'stationId');
    const swap = parseInput(crewSwapSchema, req.body);
    if (!(await Crew.findOne({ where: { id: swap.crewId, stationId } }))) throw new ValidationError({ crewId: 'Unknown crew' });
    // A swap at any other instant would match no shift and change nothing, silently.
    const { timeZone, shiftChangeTimes } = await settingsForStation(stationId);
    if (shiftStartFor(new Date(swap.shiftStart), timeZone, shiftChangeTimes).getTime() !== Date.parse(swap.shiftStart)) {
      throw new ValidationError({ shiftStart: `Not the start of a shift at this station (shifts change at ${shiftChangeTimes.join(', ')} station time, ${timeZone})` });
    }
    const created = await sequelize.transaction(async (transaction) => {
      const row = await CrewSwap.create({ stationId, shiftStart: new Date(swap.shiftStart), crewId: swap.crewId, reason: swap.reason, createdBy: req.user!.id, createdAt: new Date() }, { transaction });
      await recordAudit({ actorId: req.user!.id, action: 'station.crew_swap', entity: 'station', entityId: stationId, after: swap }, transaction);
      return row;
    });
    res.status(201).json({ id: created.id });
  });

  return router;
}
