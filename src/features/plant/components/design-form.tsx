import { useState } from 'react';
import { tubeGauges, tubeMaterials } from '../../../../shared/calc/hei';
import { parseTypedNumber, roundForEntry } from '../../../../shared/entry-units';
import type { UnitDesign } from '../../../../shared/schemas/plant';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useChangeSetup } from '../api/setup';
import { SaveVersion } from './save-version';

// Each box: its label, unit, and the conversion between what is typed and SI.
// `offset`: the conversion adds it, so the round trip's float noise is relative to it (see roundForEntry).
type Spec = { key: keyof UnitDesign; label: string; unit: string; toSi?: (v: number) => number; fromSi?: (v: number) => number; offset?: number; optional?: boolean };
const C = { toSi: (v: number) => v + 273.15, fromSi: (v: number) => v - 273.15, offset: 273.15 };
const kPa = { toSi: (v: number) => v * 1000, fromSi: (v: number) => v / 1000 };
const MW = { toSi: (v: number) => v * 1e6, fromSi: (v: number) => v / 1e6 };
const specs: Spec[] = [
  { key: 'surfaceAreaM2', label: 'Surface area', unit: 'm²' },
  { key: 'tubeOdMm', label: 'Tube OD', unit: 'mm' },
  { key: 'tubeCount', label: 'Tube count (all shells)', unit: 'tubes' },
  { key: 'passes', label: 'Passes', unit: 'passes' },
  { key: 'designCwFlowKgS', label: 'Design CW flow', unit: 'kg/s' },
  { key: 'designCwInletK', label: 'Design CW inlet', unit: '°C', ...C },
  { key: 'designBackpressurePa', label: 'Design backpressure', unit: 'kPa a', ...kPa },
  { key: 'designDutyW', label: 'Design duty', unit: 'MW', ...MW },
  { key: 'designCleanliness', label: 'Design cleanliness factor', unit: '(ratio)' },
  { key: 'designCleanUWM2K', label: 'Data-sheet clean U (optional)', unit: 'W/(m²·K)', optional: true },
  { key: 'energyPricePerMwh', label: 'Energy price (optional)', unit: 'per MWh', optional: true },
  { key: 'towerDesignRangeK', label: 'Tower design range (optional)', unit: 'K', optional: true },
  { key: 'towerDesignApproachK', label: 'Tower design approach (optional)', unit: 'K', optional: true },
  { key: 'towerDesignWetBulbK', label: 'Tower design wet bulb (optional)', unit: '°C', optional: true, ...C },
];

const toText = (design: UnitDesign) =>
  Object.fromEntries(
    specs.map((s) => {
      const v = design[s.key] as number | null | undefined;
      return [s.key, v == null ? '' : String(roundForEntry(s.fromSi ? s.fromSi(v) : v, s.offset))];
    }),
  ) as Record<string, string>;

export function DesignForm({ unitId, design, editable }: { unitId: number; design: UnitDesign; editable: boolean }) {
  const change = useChangeSetup(unitId);
  const [text, setText] = useState(() => toText(design));
  const [curve, setCurve] = useState(() => design.backpressureCorrection.map(([p, mw]) => [String(roundForEntry(p / 1000)), String(roundForEntry(mw))]));
  const [material, setMaterial] = useState<string>(design.tubeMaterial);
  const [gauge, setGauge] = useState(design.tubeGaugeBwg);
  const [currency, setCurrency] = useState(design.currency ?? '');
  const [note, setNote] = useState('');
  // Boxes that do not hold a number, found before anything is sent; the server's messages otherwise.
  const [typingErrors, setTypingErrors] = useState<Record<string, string>>({});
  const fields = { ...(change.error instanceof ApiError ? change.error.fields : {}), ...typingErrors };

  const save = () => {
    const values: Record<string, unknown> = {};
    const errors: Record<string, string> = {};
    for (const s of specs) {
      const typed = parseTypedNumber(text[s.key] ?? '');
      if (typed.empty) {
        if (s.optional) values[s.key] = null;
        else errors[`design.${s.key}`] = `${s.label} is missing`;
      } else if ('error' in typed) errors[`design.${s.key}`] = typed.error;
      else values[s.key] = s.toSi ? s.toSi(typed.value) : typed.value;
    }
    const points: [number, number][] = [];
    curve.forEach(([p, mw], i) => {
      const [bp, loss] = [parseTypedNumber(p ?? ''), parseTypedNumber(mw ?? '')];
      if ('value' in bp && 'value' in loss) points.push([bp.value * 1000, loss.value]);
      else errors['design.backpressureCorrection'] ??= `Curve row ${i + 1}: give the backpressure and the MW as numbers`;
    });
    setTypingErrors(errors);
    if (Object.keys(errors).length) return;
    const design = { ...values, tubeMaterial: material, tubeGaugeBwg: gauge, currency: currency || null, backpressureCorrection: points } as unknown as UnitDesign;
    change.mutate({ kind: 'design', design, note }, { onSuccess: () => setNote('') });
  };

  return (
    <form
      aria-label="Design data"
      className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
    >
      <h2 className="font-bold">Design data</h2>
      {Object.keys(typingErrors).length ? (
        <Notice kind="error">Nothing was saved: the marked boxes need a number.</Notice>
      ) : change.error ? (
        <Notice kind="error">{change.error.message}</Notice>
      ) : null}
      {change.isSuccess ? <Notice kind="success">Saved as a new version; readings from now on are judged by it.</Notice> : null}
      <fieldset disabled={!editable} className="grid gap-3 sm:grid-cols-2">
        {specs.map((s) => (
          <label key={s.key} className="flex flex-col text-sm">
            {s.label}
            <span className="flex items-center gap-2">
              <input
                className="reading w-full rounded-md border border-line bg-field px-2 py-1 aria-[invalid=true]:border-alarm"
                aria-invalid={Boolean(fields[`design.${s.key}`])}
                inputMode="decimal"
                value={text[s.key] ?? ''}
                onChange={(e) => setText({ ...text, [s.key]: e.target.value })}
              />
              <span className="shrink-0 text-muted">{s.unit}</span>
            </span>
            {fields[`design.${s.key}`] ? <span role="alert" className="text-alarm">⚠ {fields[`design.${s.key}`]}</span> : null}
          </label>
        ))}
        <label className="flex flex-col text-sm">
          Tube material
          <select className="rounded-md border border-line bg-field px-2 py-1" value={material} onChange={(e) => setMaterial(e.target.value)}>
            {tubeMaterials.map((m) => (
              <option key={m}>{m}</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm">
          Tube gauge
          <select className="rounded-md border border-line bg-field px-2 py-1" value={gauge} onChange={(e) => setGauge(Number(e.target.value))}>
            {tubeGauges.map((g) => (
              <option key={g} value={g}>
                {g} BWG
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm">
          Currency
          <input className="rounded-md border border-line bg-field px-2 py-1" value={currency} onChange={(e) => setCurrency(e.target.value)} />
        </label>
        <div className="flex flex-col gap-1 text-sm sm:col-span-2">
          <span className="font-bold">Backpressure correction curve (MW lost against design; linear between rows, never beyond them)</span>
          {curve.map(([p, mw], i) => (
            <div key={i} className="flex items-center gap-2">
              <input aria-label={`Curve row ${i + 1} backpressure`} className="reading w-28 rounded-md border border-line bg-field px-2 py-1" value={p} onChange={(e) => setCurve(curve.map((r, j) => (j === i ? [e.target.value, r[1]!] : r)))} />
              <span className="text-muted">kPa a →</span>
              <input aria-label={`Curve row ${i + 1} MW`} className="reading w-28 rounded-md border border-line bg-field px-2 py-1" value={mw} onChange={(e) => setCurve(curve.map((r, j) => (j === i ? [r[0]!, e.target.value] : r)))} />
              <span className="text-muted">MW</span>
              {editable ? (
                <button type="button" className="text-sm underline" onClick={() => setCurve(curve.filter((_, j) => j !== i))}>
                  remove
                </button>
              ) : null}
            </div>
          ))}
          {editable ? (
            <button type="button" className="self-start text-sm underline" onClick={() => setCurve([...curve, ['', '']])}>
              add a row
            </button>
          ) : null}
          {fields['design.backpressureCorrection'] ? <span role="alert" className="text-alarm">⚠ {fields['design.backpressureCorrection']}</span> : null}
        </div>
      </fieldset>
      <SaveVersion editable={editable} note={note} onNote={setNote} error={fields.note} pending={change.isPending} saveLabel="Save as a new version" readOnlyText="Only an administrator changes design data." />
    </form>
  );
}
