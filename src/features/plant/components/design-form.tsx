import { useFieldArray, useWatch } from 'react-hook-form';
import { tubeGauges, tubeMaterials } from '../../../../shared/calc/hei';
import { parseTypedNumber, roundForEntry } from '../../../../shared/entry-units';
import { newDesignVersionSchema, type UnitDesign } from '../../../../shared/schemas/plant';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { Notice } from '../../../components/ui/notice';
import { useChangeSetup, type OnVersionSaved } from '../api/setup';
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

type Values = { boxes: Record<string, string>; curve: { backpressure: string; mw: string }[]; tubeMaterial: string; tubeGaugeBwg: string; currency: string; note: string };

// Each box converts from its shown unit to SI; a box that is not a number is its own message and nothing is sent.
// The shared design-version contract then checks the whole as the server does.
const designForm = throughContract(
  (v: Values, fail) => {
    const values: Record<string, unknown> = {};
    for (const s of specs) {
      const typed = parseTypedNumber(v.boxes[s.key] ?? '');
      if (typed.empty) {
        if (s.optional) values[s.key] = null;
        else fail(`boxes.${s.key}`, `${s.label} is missing`);
      } else if ('error' in typed) fail(`boxes.${s.key}`, typed.error);
      else values[s.key] = s.toSi ? s.toSi(typed.value) : typed.value;
    }
    const points: [number, number][] = [];
    let curveFailed = false;
    v.curve.forEach(({ backpressure, mw }, i) => {
      const [bp, loss] = [parseTypedNumber(backpressure), parseTypedNumber(mw)];
      if ('value' in bp && 'value' in loss) points.push([bp.value * 1000, loss.value]);
      else if (!curveFailed) {
        curveFailed = true;
        fail('curve', `Curve row ${i + 1}: give the backpressure and the MW as numbers`);
      }
    });
    const design = { ...values, tubeMaterial: v.tubeMaterial, tubeGaugeBwg: Number(v.tubeGaugeBwg), currency: v.currency || null, backpressureCorrection: points };
    return { design, note: v.note };
  },
  newDesignVersionSchema,
  (path) => designFieldFor(path),
);

// The contract's paths are design.<field>; the form keeps the numbers in boxes and the curve apart.
function designFieldFor(path: string) {
  const [head, field] = path.split('.');
  if (head !== 'design' || !field) return undefined;
  if (field === 'backpressureCorrection') return 'curve';
  return specs.some((s) => s.key === field) ? `boxes.${field}` : field;
}

/** saved: the version in force is the one this person just saved here. */
type Props = { unitId: number; design: UnitDesign; editable: boolean; saved: boolean; onVersionSaved: OnVersionSaved };

export function DesignForm({ unitId, design, editable, saved, onVersionSaved }: Props) {
  const change = useChangeSetup(unitId, onVersionSaved);
  const form = useSchemaForm(designForm, {
    defaultValues: {
      boxes: toText(design),
      curve: design.backpressureCorrection.map(([p, mw]) => ({ backpressure: String(roundForEntry(p / 1000)), mw: String(roundForEntry(mw)) })),
      tubeMaterial: design.tubeMaterial,
      tubeGaugeBwg: String(design.tubeGaugeBwg),
      currency: design.currency ?? '',
      note: '',
    },
    fieldFor: designFieldFor,
  });
  const curve = useFieldArray({ control: form.control, name: 'curve' });
  const note = useWatch({ control: form.control, name: 'note' });
  const typingErrors = !form.failure && Object.keys(form.formState.errors).some((f) => f === 'boxes' || f === 'curve');

  return (
    <form
      aria-label="Design data"
      className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
      noValidate
      onSubmit={form.submit(async (version) => {
        // The contract's tube material is one of tubeMaterials (its enum is typed as string).
        await change.mutateAsync({ kind: 'design', design: version.design as UnitDesign, note: version.note });
        form.reset({ ...form.getValues(), note: '' });
      })}
    >
      <h2 className="font-bold">Design data</h2>
      {typingErrors ? <Notice kind="error">Nothing was saved: the marked boxes need a number.</Notice> : <FormFailure form={form} />}
      {saved ? <Notice kind="success">Saved as a new version; readings from now on are judged by it.</Notice> : null}
      <fieldset disabled={!editable} className="grid gap-3 sm:grid-cols-2">
        {specs.map((s) => (
          <label key={s.key} className="flex flex-col text-sm">
            {s.label}
            <span className="flex items-center gap-2">
              <input
                className="reading w-full rounded-md border border-line bg-field px-2 py-1 aria-[invalid=true]:border-alarm"
                aria-invalid={Boolean(form.error(`boxes.${s.key}`))}
                inputMode="decimal"
                {...form.register(`boxes.${s.key}`)}
              />
              <span className="shrink-0 text-muted">{s.unit}</span>
            </span>
            <FieldMessage message={form.error(`boxes.${s.key}`)} />
          </label>
        ))}
        <label className="flex flex-col text-sm">
          Tube material
          <select className="rounded-md border border-line bg-field px-2 py-1" {...form.register('tubeMaterial')}>
            {tubeMaterials.map((m) => (
              <option key={m}>{m}</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm">
          Tube gauge
          <select className="rounded-md border border-line bg-field px-2 py-1" {...form.register('tubeGaugeBwg')}>
            {tubeGauges.map((g) => (
              <option key={g} value={g}>
                {g} BWG
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm">
          Currency
          <input className="rounded-md border border-line bg-field px-2 py-1" {...form.register('currency')} />
        </label>
        <div className="flex flex-col gap-1 text-sm sm:col-span-2">
          <span className="font-bold">Backpressure correction curve (MW lost against design; linear between rows, never beyond them)</span>
          {curve.fields.map((row, i) => (
            <div key={row.id} className="flex items-center gap-2">
              <input aria-label={`Curve row ${i + 1} backpressure`} className="reading w-28 rounded-md border border-line bg-field px-2 py-1" {...form.register(`curve.${i}.backpressure`)} />
              <span className="text-muted">kPa a →</span>
              <input aria-label={`Curve row ${i + 1} MW`} className="reading w-28 rounded-md border border-line bg-field px-2 py-1" {...form.register(`curve.${i}.mw`)} />
              <span className="text-muted">MW</span>
              {editable ? (
                <Button tone="link" className="text-sm" onClick={() => curve.remove(i)}>
                  remove
                </Button>
              ) : null}
            </div>
          ))}
          {editable ? (
            <Button tone="link" className="self-start text-sm" onClick={() => curve.append({ backpressure: '', mw: '' })}>
              add a row
            </Button>
          ) : null}
          <FieldMessage message={form.error('curve')} />
        </div>
      </fieldset>
      <SaveVersion editable={editable} note={note} onNote={(text) => form.setValue('note', text, { shouldDirty: true })} error={form.error('note')} pending={change.isPending} saveLabel="Save as a new version" readOnlyText="Only an administrator changes design data." />
    </form>
  );
}
