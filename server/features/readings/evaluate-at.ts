// Judge readings by the design data, limits and plausible ranges that were in force when they were taken.
import type { Transaction } from 'sequelize';
import { checkKeys } from '../../../shared/calc/check-catalog';
import { evaluateReadingSet, type Evaluation, type ReadingSetSi } from '../../../shared/calc/evaluate';
import type { Status } from '../../../shared/calc/limits';
import type { UnitDesign } from '../../../shared/schemas/plant';
import { designInForce, limitsInForce, plausibleInForce } from '../plant/versions';

export type Judged = {
  evaluation: Evaluation;
  design: UnitDesign;
  designVersionId: number;
  limitVersionId: number;
  plausibleVersionId: number | null;
  worstStatus: Status;
};

const rank: Record<Status, number> = { unknown: 0, normal: 1, watch: 2, alarm: 3 };

export function worstOf(evaluation: Evaluation): Status {
  let worst: Status = 'normal';
  for (const key of checkKeys) {
    const status = evaluation.checks[key].status;
    if (status !== 'unknown' && rank[status] > rank[worst]) worst = status;
  }
  return worst;
}

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
