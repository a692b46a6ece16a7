import { useState } from 'react';
import { checkCatalog, checkKeys, type CheckKey } from '../../../../shared/calc/check-catalog';
import type { LimitBand, LimitSet } from '../../../../shared/calc/limits';
import { convertForDisplay, defaultDisplayPreferences } from '../../../../shared/display';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useChangeSetup } from '../api/setup';
import { SaveVersion } from './save-version';

const bandKeys = ['lowAlarm', 'lowWatch', 'highWatch', 'highAlarm'] as const;
const prefs = { ...defaultDisplayPreferences, currency: 'money' };

// Display ↔ SI for one parameter: every quantity here is linear, d = k·v + c.
function scale(key: CheckKey) {
  const q = checkCatalog[key].quantity;
  const c = convertForDisplay(0, q, prefs).value;
  const k = convertForDisplay(1, q, prefs).value - c;
  return { unit: convertForDisplay(1, q, prefs).unit, toDisplay: (v: number) => Number((k * v + c).toFixed(6)), toSi: (d: number) => (d - c) / k };
}

export function LimitsForm({ unitId, limits, editable }: { unitId: number; limits: LimitSet; editable: boolean }) {
  const change = useChangeSetup(unitId);
  const [text, setText] = useState(() =>
    Object.fromEntries(
      checkKeys.map((key) => [key, Object.fromEntries(bandKeys.map((b) => [b, limits[key]?.[b] == null ? '' : String(scale(key).toDisplay(limits[key]![b]!))]))]),
    ) as Record<CheckKey, Record<(typeof bandKeys)[number], string>>,
  );
  const [note, setNote] = useState('');
  const fields = change.error instanceof ApiError ? change.error.fields : {};

  const save = () => {
    const next: LimitSet = {};
    for (const key of checkKeys) {
      const band: LimitBand = {};
      for (const b of bandKeys) {
        const raw = text[key][b].trim();
        if (raw !== '') band[b] = scale(key).toSi(Number(raw));
      }
      if (Object.keys(band).length) next[key] = band;
    }
    change.mutate({ kind: 'limits', limits: next, note }, { onSuccess: () => setNote('') });
  };

  return (
    <form
      aria-label="Limit set"
      className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
    >
      <h2 className="font-bold">Limits (watch and alarm)</h2>
      {change.error ? <Notice kind="error">{change.error.message}</Notice> : null}
      {change.isSuccess ? <Notice kind="success">Saved as a new version; earlier readings keep the limits of their time.</Notice> : null}
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <thead>
            <tr className="text-muted">
              <th>Parameter</th>
              <th>Low alarm</th>
              <th>Low watch</th>
              <th>High watch</th>
              <th>High alarm</th>
              <th>Unit</th>
            </tr>
          </thead>
          <tbody>
            {checkKeys.map((key) => (
              <tr key={key} className="border-t border-line">
                <td className="pr-2">
                  {checkCatalog[key].label}
                  {bandKeys.map((b) => (fields[`limits.${key}.${b}`] ? <span key={b} role="alert" className="block text-alarm">⚠ {fields[`limits.${key}.${b}`]}</span> : null))}
                </td>
                {bandKeys.map((b) => (
                  <td key={b} className="pr-1">
                    <input
                      aria-label={`${checkCatalog[key].label} ${b}`}
                      disabled={!editable}
                      inputMode="decimal"
                      className="reading w-20 rounded-md border border-line bg-field px-1 py-0.5"
                      value={text[key][b]}
                      onChange={(e) => setText({ ...text, [key]: { ...text[key], [b]: e.target.value } })}
                    />
                  </td>
                ))}
                <td className="text-muted">{scale(key).unit}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <SaveVersion editable={editable} note={note} onNote={setNote} error={fields.note} pending={change.isPending} saveLabel="Save limits as a new version" readOnlyText="Only an administrator changes limits." />
    </form>
  );
}
