// Which design data and limits were in force at a moment, and how new versions are made.
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { LimitSet } from '../../../shared/calc/limits';
import type { UnitDesign } from '../../../shared/schemas/plant';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { NotFound } from '../../lib/errors';
import { LimitSetVersion, PlantUnit, UnitDesignVersion } from './model';

const inForce = (unitId: number, at: Date) => ({
  where: { unitId, effectiveFrom: { [Op.lte]: at } },
  order: [
    ['effectiveFrom', 'DESC'],
    ['id', 'DESC'],
  ] as [string, string][],
});

export async function designInForce(unitId: number, at = new Date(), transaction?: Transaction): Promise<UnitDesignVersion> {
  const version = await UnitDesignVersion.findOne({ ...inForce(unitId, at), transaction });
  if (!version) throw new NotFound('Design data in force for that unit and time');
  return version;
}

export async function limitsInForce(unitId: number, at = new Date(), transaction?: Transaction): Promise<LimitSetVersion> {
  const version = await LimitSetVersion.findOne({ ...inForce(unitId, at), transaction });
  if (!version) throw new NotFound('A limit set in force for that unit and time');
  return version;
}

export async function requireUnit(unitId: number): Promise<PlantUnit> {
  const unit = await PlantUnit.findByPk(unitId);
  if (!unit) throw new NotFound('That unit');
  return unit;
}

export function makeVersionService(sequelize: Sequelize) {
  async function addDesignVersion(actorId: number, unitId: number, design: UnitDesign, note: string) {
    await requireUnit(unitId);
    return unitOfWork(sequelize, async (transaction) => {
      const before = await UnitDesignVersion.findOne({ ...inForce(unitId, new Date()), transaction });
      const created = await UnitDesignVersion.create(
        { unitId, effectiveFrom: new Date(), data: design, note, createdBy: actorId },
        { transaction },
      );
      await recordAudit(
        { actorId, action: 'unit_design.new_version', entity: 'unit', entityId: unitId, before: before?.data ?? null, after: { versionId: created.id, note, data: design } },
        transaction,
      );
      publish(transaction, { entity: 'plant', id: created.id, unitId });
      return created;
    });
  }

  async function addLimitVersion(actorId: number, unitId: number, limits: LimitSet, note: string) {
    await requireUnit(unitId);
    return unitOfWork(sequelize, async (transaction) => {
      const before = await LimitSetVersion.findOne({ ...inForce(unitId, new Date()), transaction });
      const created = await LimitSetVersion.create({ unitId, effectiveFrom: new Date(), limits, note, createdBy: actorId }, { transaction });
      await recordAudit(
        { actorId, action: 'limit_set.new_version', entity: 'unit', entityId: unitId, before: before?.limits ?? null, after: { versionId: created.id, note, limits } },
        transaction,
      );
      publish(transaction, { entity: 'plant', id: created.id, unitId });
      return created;
    });
  }

  return { addDesignVersion, addLimitVersion };
}
export type VersionService = ReturnType<typeof makeVersionService>;
