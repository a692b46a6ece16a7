// Live evaluation for the round form: every check for one reading set by the unit's versions in
// force now, and those versions for the browser to compute with. Saves nothing.
import { evaluateReadingSet } from '../../../shared/calc/evaluate';
import type { ReadingSetInput } from '../../../shared/schemas/reading-set';
import { convertReadingSet } from '../../lib/convert-readings';
import { designInForce, limitsInForce, plausibleInForce, requireUnit } from '../plant/index';

async function versionsNow(unitId: number) {
  await requireUnit(unitId);
  const [design, limits, plausible] = await Promise.all([designInForce(unitId), limitsInForce(unitId), plausibleInForce(unitId)]);
  return { design, limits, plausible };
}

export async function evaluateNow(input: ReadingSetInput) {
  const si = convertReadingSet(input);
  const { design, limits, plausible } = await versionsNow(input.unitId);
  const evaluation = evaluateReadingSet(si, design.data, limits.limits, plausible.ranges);
  return { ...evaluation, designVersionId: design.id, limitVersionId: limits.id, plausibleVersionId: plausible.versionId, inputsSi: si };
}

export async function condenserDesignNow(unitId: number) {
  const { design, limits, plausible } = await versionsNow(unitId);
  return { design: design.data, limits: limits.limits, plausible: plausible.ranges, designVersionId: design.id, limitVersionId: limits.id, plausibleVersionId: plausible.versionId };
}
