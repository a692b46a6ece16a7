import { useState } from 'react';
import { plausibleCatalog, plausibleKeys, type PlausibleKey, type PlausibleRanges } from '../../../../shared/calc/plausibility';
import { plausibleSettingUnits } from '../../../../shared/plausibility-display';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useChangeSetup } from '../api/setup';
import { SaveVersion } from './save-version';

const ends = ['low', 'high'] as const;
type End = (typeof ends)[number];
type Texts = Record<PlausibleKey, Record<End, string>>;

/** Typed text → SI, or a message per box for text that is not a number (nothing is sent then). */
function parse(text: Texts): { ranges: PlausibleRanges | null; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const ranges = {} as PlausibleRanges;
  for (const key of plausibleKeys) {
    const units = plausibleSettingUnits(key);
    const [low, high] = ends.map((end) => {
      const typed = text[key][end].trim().replace(',', '.');
      const value = typed === '' ? NaN : Number(typed);
      if (!Number.isFinite(value)) errors[`ranges.${key}.${end}`] = `${plausibleCatalog[key].label}: enter the ${end} end as a number`;
      return units.toSi(value);
    }) as [number, number];
    ranges[key] = { low, high };
  }
  return { ranges: Object.keys(errors).length ? null : ranges, errors };
}

type Props = { unitId: number; ranges: PlausibleRanges; own: boolean; editable: boolean };

export function PlausibleRangesForm({ unitId, ranges, own, editable }: Props) {
  const change = useChangeSetup(unitId);
  const [text, setText] = useState<Texts>(
    () =>
      Object.fromEntries(
        plausibleKeys.map((key) => [key, Object.fromEntries(ends.map((end) => [end, String(plausibleSettingUnits(key).toShown(ranges[key][end]))]))]),
      ) as Texts,
  );
  const [note, setNote] = useState('');
  const [typedErrors, setTypedErrors] = useState<Record<string, string>>({});
  const fields = { ...(change.error instanceof ApiError ? change.error.fields : {}), ...typedErrors };

  const save = () => {
    const parsed = parse(text);
    setTypedErrors(parsed.errors);
    if (!parsed.ranges) return;
    change.mutate({ kind: 'plausible', ranges: parsed.ranges, note }, { onSuccess: () => setNote('') });
  };

  return (
    <form
      aria-label="Plausible ranges"
      className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
    >
      <h2 className="font-bold">Plausible ranges</h2>
      <p className="text-sm text-muted">
        A reading or check outside its range is possible but suspicious: the round asks the operator to confirm it, marks it “outside plausible
        range” and withholds the checks computed from it.{' '}
        {own
          ? 'These are this unit’s own ranges (the starting ones are common practice for surface condensers, no source).'
          : 'This unit has no ranges of its own yet: these are the starting ranges, common practice for surface condensers with no source — set this unit’s from its design.'}{' '}
        Flows are per cent of the design CW flow, and of the design duty ÷ 2210 kJ/kg (HEI) for exhaust steam.
      </p>
      {change.error ? <Notice kind="error">{change.error.message}</Notice> : null}
      {change.isSuccess ? <Notice kind="success">Saved as a new version; earlier readings keep the ranges of their time.</Notice> : null}
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <thead>
            <tr className="text-muted">
              <th>Reading or check</th>
              <th>Low</th>
              <th>High</th>
              <th>Unit</th>
            </tr>
          </thead>
          <tbody>
            {plausibleKeys.map((key) => (
              <tr key={key} className="border-t border-line">
                <td className="pr-2">
                  {plausibleCatalog[key].label}
                  {ends.map((end) => (fields[`ranges.${key}.${end}`] ? <span key={end} role="alert" className="block text-alarm">⚠ {fields[`ranges.${key}.${end}`]}</span> : null))}
                </td>
                {ends.map((end) => (
                  <td key={end} className="pr-1">
                    <input
                      aria-label={`${plausibleCatalog[key].label} plausible ${end}`}
                      disabled={!editable}
                      inputMode="decimal"
                      className="reading w-24 rounded-md border border-line bg-field px-1 py-0.5"
                      value={text[key][end]}
                      onChange={(e) => setText({ ...text, [key]: { ...text[key], [end]: e.target.value } })}
                    />
                  </td>
                ))}
                <td className="text-muted">{plausibleSettingUnits(key).unit}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <SaveVersion
        editable={editable}
        note={note}
        onNote={setNote}
        error={fields.note}
        pending={change.isPending}
        saveLabel="Save plausible ranges as a new version"
        readOnlyText="Only an administrator changes plausible ranges."
      />
    </form>
  );
}
