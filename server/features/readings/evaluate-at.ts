// Judge readings by the design data, limits and plausible ranges that were in force when they were taken.
import type { Transaction } from 'sequelize';
import { checkKeys } from '../../../shared/calc/check-catalog';
import { evaluateReadingSet, type Evaluation, type ReadingSetSi } from '../../../shared/calc/evaluate';
import { worstOf } from '../../../shared/calc/worst-status';
export { worstOf };
import type { Status } from '../../../shared/calc/limits';
import type { UnitDesign } from '../../../shared/schemas/plant';
import { startingPlausibleRanges } from '../../../shared/calc/plausibility';
import { allVersionsOf } from '../plant/index';
import { designInForce, limitsInForce, plausibleInForce } from '../plant/index';

export type Judged = {
  evaluation: Evaluation;
  design: UnitDesign;
  designVersionId: number;
  limitVersionId: number;
  plausibleVersionId: number | null;
  worstStatus: Status;
};

export async function judgeAt(unitId: number, takenAt: Date, si: ReadingSetSi, transaction?: Transaction): Promise<Judged> {
  const [design, limits, plausible] = await Promise.all([
    designInForce(unitId, takenAt, transaction),
    limitsInForce(unitId, takenAt, transaction),
    plausibleInForce(unitId, takenAt, transaction),
  ]);
  const evaluation = evaluateReadingSet(si, design.data, limits.limits, plausible.ranges);
  return {
    evaluation,
    design: design.data,
    designVersionId: design.id,
    limitVersionId: limits.id,
    plausibleVersionId: plausible.versionId,
    worstStatus: worstOf(evaluation),
  };
}

/** The newest version with `effectiveFrom <= at` (ties: the later id), as `designInForce` asks SQL. */
function inForceAt<V extends { id: number; effectiveFrom: Date }>(versions: V[], at: Date): V | undefined {
  let best: V | undefined;
  for (const v of versions) {
    if (v.effectiveFrom > at) continue;
    if (!best || v.effectiveFrom > best.effectiveFrom || (v.effectiveFrom.getTime() === best.effectiveFrom.getTime() && v.id > best.id)) best = v;
  }
  return best;
}

/**
 * `judgeAt` for many readings of one unit (an import batch): the unit's versions are read once and
 * each reading is judged by those in force when it was taken. Versions are append-only, so a list
 * read inside the batch's transaction stays right for the whole batch.
 */
export async function judgeManyAt(unitId: number, transaction: Transaction): Promise<(takenAt: Date, si: ReadingSetSi) => Judged> {
  const { designs, limits: limitSets, plausible: plausibleSets } = await allVersionsOf(unitId, transaction);
  return (takenAt, si) => {
    const design = inForceAt(designs, takenAt);
    const limits = inForceAt(limitSets, takenAt);
    // The import's analysis refuses rows from before the first versions; this is the last word.
    if (!design || !limits) throw new Error(`no design data or limits in force for unit ${unitId} at ${takenAt.toISOString()}`);
    // A unit without a plausible-range version of its own uses the starting ranges, as `plausibleInForce` does.
    const plausible = inForceAt(plausibleSets, takenAt);
    const evaluation = evaluateReadingSet(si, design.data, limits.limits, plausible?.ranges ?? startingPlausibleRanges);
    return {
      evaluation,
      design: design.data,
      designVersionId: design.id,
      limitVersionId: limits.id,
      plausibleVersionId: plausible?.id ?? null,
      worstStatus: worstOf(evaluation),
    };
  };
}

/** The rows of the derived trend table for one reading's current values. */
export function valueRows(readingSetId: number, unitId: number, takenAt: Date, evaluation: Evaluation) {
  return checkKeys
    .map((key) => evaluation.checks[key])
    .filter((check) => check.value !== null)
    .map((check) => ({
      readingSetId,
      unitId,
      takenAt,
      parameter: check.key,
      value: check.value!,
      status: check.status,
      outsidePlausible: Boolean(check.outsidePlausible),
    }));
}
