// The limits table as typed ↔ a limit set in SI. A box that does not hold a number is an error on that
// box; it is never sent (as null, which once deleted the limit) and never dropped.
import { checkCatalog, checkKeys, type CheckKey } from '../../../../shared/calc/check-catalog';
import type { LimitBand, LimitSet } from '../../../../shared/calc/limits';
import type { DisplayPreferences } from '../../../../shared/display';
import { fromEntryValue, parseTypedNumber, toEntryValue } from '../../../../shared/entry-units';

export const bandKeys = ['lowAlarm', 'lowWatch', 'highWatch', 'highAlarm'] as const;
export type BandKey = (typeof bandKeys)[number];
export const bandLabels: Record<BandKey, string> = { lowAlarm: 'low alarm', lowWatch: 'low watch', highWatch: 'high watch', highAlarm: 'high alarm' };
export type LimitText = Record<CheckKey, Record<BandKey, string>>;

/** The field key the server uses for one box, so its messages and ours land in the same place. */
export const limitField = (key: CheckKey, band: BandKey) => `limits.${key}.${band}`;

export function limitTextFrom(limits: LimitSet, prefs: DisplayPreferences): LimitText {
  return Object.fromEntries(
    checkKeys.map((key) => [
      key,
      Object.fromEntries(bandKeys.map((b) => {
        const si = limits[key]?.[b];
        return [b, si == null ? '' : String(toEntryValue(si, checkCatalog[key].quantity, prefs))];
      })),
    ]),
  ) as LimitText;
}

export function limitSetFromText(text: LimitText, prefs: DisplayPreferences): { limits: LimitSet; errors: Record<string, string> } {
  const limits: LimitSet = {};
  const errors: Record<string, string> = {};
  for (const key of checkKeys) {
    const band: LimitBand = {};
    for (const b of bandKeys) {
      const typed = parseTypedNumber(text[key][b]);
      if (typed.empty) continue;
      if ('error' in typed) errors[limitField(key, b)] = `${checkCatalog[key].label}, ${bandLabels[b]}: ${typed.error}`;
      else band[b] = fromEntryValue(typed.value, checkCatalog[key].quantity, prefs);
    }
    if (Object.keys(band).length) limits[key] = band;
  }
  return { limits, errors };
}
