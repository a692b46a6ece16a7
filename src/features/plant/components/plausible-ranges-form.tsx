import { useWatch } from 'react-hook-form';
import { plausibleCatalog, plausibleKeys, type PlausibleKey, type PlausibleRanges } from '../../../../shared/calc/plausibility';
import { plausibleSettingUnits } from '../../../../shared/plausibility-display';
import { Notice } from '../../../components/ui/notice';
import { newPlausibleVersionSchema } from '../../../../shared/schemas/plant';
import { FieldMessage, FormFailure, throughContract, useSchemaForm, type Fail } from '../../../components/form/schema-form';
import { useChangeSetup, type OnVersionSaved } from '../api/setup';
import { SaveVersion } from './save-version';

const ends = ['low', 'high'] as const;
type End = (typeof ends)[number];
type Texts = Record<PlausibleKey, Record<End, string>>;

/** Typed text → SI, with a message per box for text that is not a number (nothing is sent then). */
function parse(text: Texts, fail: Fail): PlausibleRanges {
  const ranges = {} as PlausibleRanges;
  for (const key of plausibleKeys) {
    const units = plausibleSettingUnits(key);
    const [low, high] = ends.map((end) => {
      const typed = text[key][end].trim().replace(',', '.');
      const value = typed === '' ? NaN : Number(typed);
      if (!Number.isFinite(value)) fail(`ranges.${key}.${end}`, `${plausibleCatalog[key].label}: enter the ${end} end as a number`);
      return units.toSi(value);
    }) as [number, number];
    ranges[key] = { low, high };
  }
  return ranges;
}

type Values = { ranges: Texts; note: string };
const rangesForm = throughContract((v: Values, fail) => ({ ranges: parse(v.ranges, fail), note: v.note }), newPlausibleVersionSchema);

/** saved: the version in force is the one this person just saved here. */
type Props = { unitId: number; ranges: PlausibleRanges; own: boolean; editable: boolean; saved: boolean; onVersionSaved: OnVersionSaved };

export function PlausibleRangesForm({ unitId, ranges, own, editable, saved, onVersionSaved }: Props) {
  const change = useChangeSetup(unitId, onVersionSaved);
  const form = useSchemaForm(rangesForm, {
    defaultValues: {
      ranges: Object.fromEntries(
        plausibleKeys.map((key) => [key, Object.fromEntries(ends.map((end) => [end, String(plausibleSettingUnits(key).toShown(ranges[key][end]))]))]),
      ) as Texts,
      note: '',
    },
  });
  const note = useWatch({ control: form.control, name: 'note' });

  return (
    <form
      aria-label="Plausible ranges"
      className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
      noValidate
      onSubmit={form.submit(async (version) => {
        await change.mutateAsync({ kind: 'plausible', ...version });
        form.reset({ ...form.getValues(), note: '' });
      })}
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
      <FormFailure form={form} />
      {saved ? <Notice kind="success">Saved as a new version; earlier readings keep the ranges of their time.</Notice> : null}
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
                  {ends.map((end) => (
                    <FieldMessage key={end} message={form.error(`ranges.${key}.${end}`)} className="block text-alarm" />
                  ))}
                </td>
                {ends.map((end) => (
                  <td key={end} className="pr-1">
                    <input
                      aria-label={`${plausibleCatalog[key].label} plausible ${end}`}
                      disabled={!editable}
                      inputMode="decimal"
                      className="reading w-24 rounded-md border border-line bg-field px-1 py-0.5"
                      {...form.register(`ranges.${key}.${end}`)}
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
        onNote={(text) => form.setValue('note', text, { shouldDirty: true })}
        error={form.error('note')}
        pending={change.isPending}
        saveLabel="Save plausible ranges as a new version"
        readOnlyText="Only an administrator changes plausible ranges."
      />
    </form>
  );
}
