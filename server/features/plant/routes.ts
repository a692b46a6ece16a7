import { Router } from 'express';
import { equipmentSchema, newDesignVersionSchema, newLimitVersionSchema, newPlausibleVersionSchema } from '../../../shared/schemas/plant';
import { allow, signedIn } from '../../lib/auth';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { ValidationError } from '../../lib/errors';
import { parseId, parseInput } from '../../lib/validate';
import { User } from '../users/model';
import { Crew, Equipment, LimitSetVersion, PlausibleRangeVersion, UnitDesignVersion } from './model';
import { listUnits } from './unit-list';
import { designInForce, limitsInForce, plausibleInForce, requireUnit, type VersionService } from './versions';
import type { Sequelize } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';


/** Plant setup: everyone signed in reads it; only administrators change it, always as a new version. */
export function plantRoutes(sequelize: Sequelize, versions: VersionService): Router {
  const router = Router();
  router.use(signedIn);

  router.get('/crews', async (_req, res) => {
    const crews = await Crew.findAll({ order: [['name', 'ASC']] });
    res.json({ crews: crews.map((c) => ({ id: c.id, name: c.name, stationId: c.stationId })) });
  });

  router.get('/units', async (_req, res) => {
    res.json({ units: await listUnits() });
  });

  router.get('/people', async (_req, res) => {
    // For pickers (who follows up a flag): names and roles of active people, nothing more.
    const people = await User.findAll({ where: { active: true }, attributes: ['id', 'name', 'role'], order: [['name', 'ASC']] });
    res.json({ people: people.map((p) => ({ id: p.id, name: p.name, role: p.role })) });
  });

  router.get('/units/:unitId/setup', async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    const unit = await requireUnit(unitId);
    const historyOf = { where: { unitId }, order: [['effectiveFrom', 'DESC'], ['id', 'DESC']] as [string, string][], attributes: ['id', 'effectiveFrom', 'note', 'createdBy'] };
    const [design, limits, plausible, designHistory, limitHistory, plausibleHistory, equipment] = await Promise.all([
      designInForce(unitId),
      limitsInForce(unitId),
      plausibleInForce(unitId),
      UnitDesignVersion.findAll(historyOf),
      LimitSetVersion.findAll(historyOf),
      PlausibleRangeVersion.findAll(historyOf),
      Equipment.findAll({ where: { unitId }, order: [['kind', 'ASC'], ['tag', 'ASC']] }),
    ]);
    const authorIds = [...new Set([...designHistory, ...limitHistory, ...plausibleHistory].map((v) => v.createdBy).filter((id): id is number => id !== null))];
    const authors = new Map((await User.findAll({ where: { id: authorIds }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
    const history = (v: { id: number; effectiveFrom: Date; note: string | null; createdBy: number | null }) => ({
      id: v.id,
      effectiveFrom: v.effectiveFrom.toISOString(),
      note: v.note,
      by: v.createdBy ? (authors.get(v.createdBy) ?? `#${v.createdBy}`) : 'set-up',
    });
    res.json({
      unit: { id: unit.id, code: unit.code, name: unit.name },
      design: { versionId: design.id, data: design.data },
      limits: { versionId: limits.id, data: limits.limits },
      // versionId null: the unit has no ranges of its own yet and the starting ranges apply.
      plausible: { versionId: plausible.versionId, data: plausible.ranges },
      designHistory: designHistory.map(history),
      limitHistory: limitHistory.map(history),
      plausibleHistory: plausibleHistory.map(history),
      equipment: equipment.map((e) => ({ id: e.id, kind: e.kind, tag: e.tag, name: e.name })),
    });
  });

  router.post('/units/:unitId/design-versions', allow('plant.manage'), async (req, res) => {
    const input = parseInput(newDesignVersionSchema, req.body);
    const created = await versions.addDesignVersion(req.user!.id, parseId(req.params.unitId, 'unitId'), input.design as never, input.note);
    res.status(201).json({ versionId: created.id });
  });

  router.post('/units/:unitId/limit-versions', allow('plant.manage'), async (req, res) => {
    const input = parseInput(newLimitVersionSchema, req.body);
    const created = await versions.addLimitVersion(req.user!.id, parseId(req.params.unitId, 'unitId'), input.limits, input.note);
    res.status(201).json({ versionId: created.id });
  });

  router.post('/units/:unitId/plausible-range-versions', allow('plant.manage'), async (req, res) => {
    const input = parseInput(newPlausibleVersionSchema, req.body);
    const created = await versions.addPlausibleVersion(req.user!.id, parseId(req.params.unitId, 'unitId'), input.ranges, input.note);
    res.status(201).json({ versionId: created.id });
  });

  router.post('/units/:unitId/equipment', allow('plant.manage'), async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    await requireUnit(unitId);
    const input = parseInput(equipmentSchema, req.body);
    try {
      const created = await sequelize.transaction(async (transaction) => {
        const row = await Equipment.create({ unitId, ...input }, { transaction });
        await recordAudit({ actorId: req.user!.id, action: 'equipment.create', entity: 'equipment', entityId: row.id, after: input }, transaction);
        publish(transaction, { entity: 'plant', id: row.id, unitId });
        return row;
      });
      res.status(201).json({ equipment: { id: created.id, ...input } });
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw new ValidationError({ tag: 'This unit already has equipment with that tag' });
      throw error;
    }
  });

  return router;
}
