// The bookkeeping of one evaluation: each check's value or the reason it is absent, and which
// readings and checks lie outside the unit's plausible ranges. A check built on one of those is
// withheld with the same reason, and so is everything built on it in turn.
import type { CheckKey } from './check-catalog';
import { CalcInputError, CalcRangeError } from './input-error';
import { outsidePlausible, plausibleKeys, withheldReason, type OutsidePlausible, type PlausibleDesign, type PlausibleKey, type PlausibleRanges } from './plausibility';

/** What a check can be computed from: another check, or a reading that is not itself a check. */
export type Source = CheckKey | 'steamFlow' | 'pH';

class Missing extends Error {}

/** Use a value another check produced; if it is absent, this check is absent too. */
export function need(value: number | null | undefined, what: string): number {
  if (value == null) throw new Missing(`needs ${what}`);
  return value;
}

const isPlausibleKey = (key: string): key is PlausibleKey => (plausibleKeys as readonly string[]).includes(key);

export function checkComputer(plausible: PlausibleRanges, design: PlausibleDesign) {
  const values: Partial<Record<CheckKey, number | null>> = {};
  const reasons: Partial<Record<CheckKey, string>> = {};
  const implausible: OutsidePlausible[] = [];
  const marked: Partial<Record<CheckKey, OutsidePlausible>> = {};
  /** Sources that must not feed another check, with the reason the operator reads. */
  const withheld = new Map<Source, string>();

  /** Notes a reading or check outside its plausible range; whatever is built on it is then withheld. */
  const assess = (key: PlausibleKey, value: number | null | undefined) => {
    if (value == null) return;
    const outside = outsidePlausible(key, value, plausible, design);
    if (!outside) return;
    implausible.push(outside);
    withheld.set(key, withheldReason(key));
    if (key !== 'steamFlow' && key !== 'pH') marked[key] = outside;
  };

  /** Computes one check unless a source it is built from is withheld; then it is withheld too. */
  const compute = (key: CheckKey, fn: () => number | null, absentReason?: string, from: Source[] = []): number | null => {
    const blocked = from.map((source) => withheld.get(source)).find((reason) => reason !== undefined);
    if (blocked) {
      values[key] = null;
      reasons[key] = blocked;
      withheld.set(key, blocked);
      return null;
    }
    try {
      const value = fn();
      if (value !== null && !Number.isFinite(value)) throw new CalcInputError(key, 'the result is not a finite number');
      values[key] = value;
      if (value === null && absentReason) reasons[key] = absentReason;
      if (isPlausibleKey(key)) assess(key, value);
      return value;
    } catch (error) {
      values[key] = null;
      if (error instanceof Missing) reasons[key] = error.message;
      // A formula's own range is stated in SI; the operator reads what happened instead.
      else if (error instanceof CalcRangeError) reasons[key] = `not computed: the readings put the ${error.field} outside the range this calculation covers`;
      else if (error instanceof CalcInputError) reasons[key] = error.sentence;
      else throw error;
      return null;
    }
  };

  return { compute, assess, values, reasons, marked, implausible };
}
