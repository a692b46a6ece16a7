// Which design data and limits were in force at a moment, and how new versions are made.
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { LimitSet } from '../../../shared/calc/limits';
import { startingPlausibleRanges, type PlausibleRanges } from '../../../shared/calc/plausibility';
import type { UnitDesign } from '../../../shared/schemas/plant';
import { stationLocalLabel } from '../../../shared/shift-time';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { NotFound } from '../../lib/errors';
import { referenceRead } from '../../lib/reference-cache';
import { LimitSetVersion, PlantUnit, PlausibleRangeVersion, UnitDesignVersion } from './model';

const inForce = (unitId: number, at: Date) => ({
  where: { unitId, effectiveFrom: { [Op.lte]: at } },
  order: [
    ['effectiveFrom', 'DESC'],
    ['id', 'DESC'],
  ] as [string, string][],
});

// Versions are reference data (lib/reference-cache.ts): each unit's whole history of each kind is
// read once, oldest first, and the one in force at a moment is picked from it here — the same rule as
// `inForce`: the latest effective at or before the moment, the later-made one on a tie.
const byStart = { order: [['effectiveFrom', 'ASC'], ['id', 'ASC']] as [string, string][] };
const designsOf = (unitId: number, transaction?: Transaction) =>
  referenceRead(`designs:${unitId}`, () => UnitDesignVersion.findAll({ where: { unitId }, ...byStart, transaction }), transaction);
const limitSetsOf = (unitId: number, transaction?: Transaction) =>
  referenceRead(`limit-sets:${unitId}`, () => LimitSetVersion.findAll({ where: { unitId }, ...byStart, transaction }), transaction);
const plausibleOf = (unitId: number, transaction?: Transaction) =>
  referenceRead(`plausible:${unitId}`, () => PlausibleRangeVersion.findAll({ where: { unitId }, ...byStart, transaction }), transaction);

function inForceAt<V extends { effectiveFrom: Date }>(oldestFirst: V[], at: Date): V | null {
  for (let i = oldestFirst.length - 1; i >= 0; i--) if (oldestFirst[i]!.effectiveFrom.getTime() <= at.getTime()) return oldestFirst[i]!;
  return null;
}

export async function designInForce(unitId: number, at = new Date(), transaction?: Transaction): Promise<UnitDesignVersion> {
  const version = inForceAt(await designsOf(unitId, transaction), at);
  if (!version) throw new NotFound('Design data in force for that unit and time');
  return version;
}

/** The design data in force at a moment, or null before the unit's first. */
export async function designInForceOrNone(unitId: number, at: Date, transaction?: Transaction) {
  return inForceAt(await designsOf(unitId, transaction), at);
}

export async function limitsInForce(unitId: number, at = new Date(), transaction?: Transaction): Promise<LimitSetVersion> {
  const version = inForceAt(await limitSetsOf(unitId, transaction), at);
  if (!version) throw new NotFound('A limit set in force for that unit and time');
  return version;
}

/** Every limit set that came into force up to `to`, oldest first (trends draw their bands from them). */
export async function limitVersionsUpTo(unitId: number, to: Date) {
  return (await limitSetsOf(unitId)).filter((v) => v.effectiveFrom.getTime() <= to.getTime());
}

export type PlausibleInForce = { versionId: number | null; ranges: PlausibleRanges };

/**
 * The plausible ranges in force at a moment; a unit that has none of its own yet (or a moment before
 * its first) uses the starting ranges, so no reading goes unchecked.
 */
export async function plausibleInForce(unitId: number, at = new Date(), transaction?: Transaction): Promise<PlausibleInForce> {
  const version = inForceAt(await plausibleOf(unitId, transaction), at);
  return version ? { versionId: version.id, ranges: version.ranges } : { versionId: null, ranges: startingPlausibleRanges };
}

export type VersionStarts = { design: Date | null; limits: Date | null };

/** When a unit's first design data and first limit set came into force (null: none yet). */
export async function versionStarts(unitId: number, transaction?: Transaction): Promise<VersionStarts> {
  const [designs, limits] = await Promise.all([designsOf(unitId, transaction), limitSetsOf(unitId, transaction)]);
  return { design: designs[0]?.effectiveFrom ?? null, limits: limits[0]?.effectiveFrom ?? null };
}

/**
 * Why a reading taken at `at` cannot be judged, in the words a person reads beside the time (station
 * time, labelled); null when design data and limits are both in force then. A reading from before the
 * unit's first versions would otherwise be judged by nothing, or by data written for a later plant.
 */
export function unjudgedReason(at: Date, starts: VersionStarts, timeZone: string): string | null {
  const when = (d: Date) => `${stationLocalLabel(d, timeZone)} (${timeZone})`;
  const missing = (what: string, from: Date | null) => {
    if (from && at.getTime() >= from.getTime()) return null;
    return from ? `No ${what} in force at ${when(at)}; this unit’s first ${what} is in force from ${when(from)}` : `No ${what} in force at ${when(at)}; this unit has none yet`;
  };
  return missing('design data', starts.design) ?? missing('limit set', starts.limits);
}

export async function requireUnit(unitId: number): Promise<PlantUnit> {
  const unit = await referenceRead(`unit:${unitId}`, () => PlantUnit.findByPk(unitId));
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

  async function addPlausibleVersion(actorId: number, unitId: number, ranges: PlausibleRanges, note: string) {
    await requireUnit(unitId);
    return unitOfWork(sequelize, async (transaction) => {
      const before = await plausibleInForce(unitId, new Date(), transaction);
      const created = await PlausibleRangeVersion.create({ unitId, effectiveFrom: new Date(), ranges, note, createdBy: actorId }, { transaction });
      await recordAudit(
        { actorId, action: 'plausible_ranges.new_version', entity: 'unit', entityId: unitId, before: before.ranges, after: { versionId: created.id, note, ranges } },
        transaction,
      );
      publish(transaction, { entity: 'plant', id: created.id, unitId });
      return created;
    });
  }

  return { addDesignVersion, addLimitVersion, addPlausibleVersion };
}
export type VersionService = ReturnType<typeof makeVersionService>;
