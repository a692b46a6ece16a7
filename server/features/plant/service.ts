// Plant setup and the plant lookups other features ask for: units, stations, crews, equipment.
import { UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import { recordAudit } from '../../lib/audit';
import { referenceRead } from '../../lib/reference-cache';
import { ValidationError } from '../../lib/errors';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { namesOf } from '../users/index';
import { Crew, Equipment, LimitSetVersion, PlantUnit, PlausibleRangeVersion, Station, UnitDesignVersion, type EquipmentKind } from './model';
import { designInForce, limitsInForce, plausibleInForce, requireUnit } from './versions';

// Units, stations and crews are reference data: read through the cache (lib/reference-cache.ts).
export function findUnit(unitId: number, transaction?: Transaction) {
  return referenceRead(`unit:${unitId}`, () => PlantUnit.findByPk(unitId, { transaction }), transaction);
}

/** Every unit, by code. */
export function allUnits() {
  return referenceRead('units', () => PlantUnit.findAll({ order: [['code', 'ASC']] }));
}

/** Ids of a station's units. */
export async function unitIdsOfStation(stationId: number, transaction?: Transaction) {
  return referenceRead(`unit-ids:${stationId}`, async () => (await PlantUnit.findAll({ where: { stationId }, attributes: ['id'], transaction })).map((u) => u.id), transaction);
}

/**
 * Takes the unit's row lock for the rest of the transaction: writers that may open automatic flags
 * on a unit take turns on it, so two never race to open one flag.
 */
export async function lockUnit(unitId: number, transaction: Transaction) {
  await PlantUnit.findByPk(unitId, { attributes: ['id'], transaction, lock: transaction.LOCK.UPDATE });
}

export function findStation(stationId: number) {
  return referenceRead(`station:${stationId}`, () => Station.findByPk(stationId));
}

export function allStations() {
  return referenceRead('stations', () => Station.findAll({ order: [['id', 'ASC']] }));
}

/** The station with the lowest id: the one pages without a unit or crew use. */
export function firstStation() {
  return referenceRead('first-station', () => Station.findOne({ order: [['id', 'ASC']] }));
}

export function findCrew(crewId: number) {
  return Crew.findByPk(crewId);
}

export async function listCrews() {
  const crews = await Crew.findAll({ order: [['name', 'ASC']] });
  return crews.map((c) => ({ id: c.id, name: c.name, stationId: c.stationId }));
}

/** Crew names by id (every crew when `ids` is left out). */
export async function crewNamesOf(ids?: number[]): Promise<Map<number, string>> {
  if (ids && ids.length === 0) return new Map();
  const every = await referenceRead('crew-names', async () => (await Crew.findAll({ attributes: ['id', 'name'] })).map((c) => [c.id, c.name] as const));
  const wanted = ids ? new Set(ids) : null;
  return new Map(every.filter(([id]) => !wanted || wanted.has(id)));
}

/** How many of these crews belong to the station (a rotation or swap names crews of its station only). */
export function countCrewsOfStation(stationId: number, crewIds: number[]) {
  return Crew.count({ where: { id: crewIds, stationId } });
}

export function findEquipment(equipmentId: number) {
  return Equipment.findByPk(equipmentId);
}

/** Limit sets by id (a past shift shows the limits its rounds were judged by). */
export async function limitSetsById(ids: number[]) {
  return new Map((ids.length ? await LimitSetVersion.findAll({ where: { id: [...new Set(ids)] } }) : []).map((l) => [l.id, l]));
}

/** Every version of a unit's design data, limits and plausible ranges (judging readings at many times at once). */
export async function allVersionsOf(unitId: number, transaction?: Transaction) {
  const [designs, limits, plausible] = await Promise.all([
    UnitDesignVersion.findAll({ where: { unitId }, transaction }),
    LimitSetVersion.findAll({ where: { unitId }, transaction }),
    PlausibleRangeVersion.findAll({ where: { unitId }, transaction }),
  ]);
  return { designs, limits, plausible };
}

/** A unit's setup page: what is in force now, every earlier version with its author, and its equipment. */
export async function unitSetup(unitId: number) {
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
  const authors = await namesOf([...designHistory, ...limitHistory, ...plausibleHistory].map((v) => v.createdBy));
  const history = (v: { id: number; effectiveFrom: Date; note: string | null; createdBy: number | null }) => ({
    id: v.id,
    effectiveFrom: v.effectiveFrom.toISOString(),
    note: v.note,
    by: v.createdBy ? (authors.get(v.createdBy) ?? `#${v.createdBy}`) : 'set-up',
  });
  return {
    unit: { id: unit.id, code: unit.code, name: unit.name },
    design: { versionId: design.id, data: design.data },
    limits: { versionId: limits.id, data: limits.limits },
    // versionId null: the unit has no ranges of its own yet and the starting ranges apply.
    plausible: { versionId: plausible.versionId, data: plausible.ranges },
    designHistory: designHistory.map(history),
    limitHistory: limitHistory.map(history),
    plausibleHistory: plausibleHistory.map(history),
    equipment: equipment.map((e) => ({ id: e.id, kind: e.kind, tag: e.tag, name: e.name })),
  };
}

export function makeEquipmentService(sequelize: Sequelize) {
  async function addEquipment(actorId: number, unitId: number, input: { kind: EquipmentKind; tag: string; name: string }) {
    await requireUnit(unitId);
    try {
      const created = await unitOfWork(sequelize, async (transaction) => {
        const row = await Equipment.create({ unitId, ...input }, { transaction });
        await recordAudit({ actorId, action: 'equipment.create', entity: 'equipment', entityId: row.id, after: input }, transaction);
        publish(transaction, { entity: 'plant', id: row.id, unitId });
        return row;
      });
      return { id: created.id, ...input };
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw new ValidationError({ tag: 'This unit already has equipment with that tag' });
      throw error;
    }
  }
  return { addEquipment };
}
export type EquipmentService = ReturnType<typeof makeEquipmentService>;
