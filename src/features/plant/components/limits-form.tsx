import { useWatch } from 'react-hook-form';
import { checkCatalog, checkKeys, type CheckKey } from '../../../../shared/calc/check-catalog';
import type { LimitSet } from '../../../../shared/calc/limits';
import { convertForDisplay, defaultDisplayPreferences } from '../../../../shared/display';
import { Notice } from '../../../components/ui/notice';
import { newLimitVersionSchema } from '../../../../shared/schemas/plant';
import { FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useChangeSetup, type OnVersionSaved } from '../api/setup';
import { bandKeys, bandLabels, limitField, limitSetFromText, limitTextFrom, type LimitText } from '../lib/limit-entry';
import { SaveVersion } from './save-version';

const prefs = { ...defaultDisplayPreferences, currency: 'money' };
const unitOf = (key: CheckKey) => convertForDisplay(1, checkCatalog[key].quantity, prefs).unit;

type Values = { limits: LimitText; note: string };

// The boxes hold numbers in the shown units: a box that is not a number is its own message and nothing is sent;
// the rest goes to SI and the shared limit-version contract checks it as the server does.
const limitsForm = throughContract((v: Values, fail) => {
  const { limits, errors } = limitSetFromText(v.limits, prefs);
  for (const [field, message] of Object.entries(errors)) fail(field, message);
  return { limits, note: v.note };
}, newLimitVersionSchema);

/** The number of boxes with a message: a leaf of the errors under `limits`. */
const countBoxes = (node: unknown): number =>
  !node || typeof node !== 'object' ? 0 : typeof (node as { message?: unknown }).message === 'string' ? 1 : Object.entries(node).reduce((n, [k, child]) => n + (k === 'ref' ? 0 : countBoxes(child)), 0);

/** saved: the version in force is the one this person just saved here. */
type Props = { unitId: number; limits: LimitSet; editable: boolean; saved: boolean; onVersionSaved: OnVersionSaved };

export function LimitsForm({ unitId, limits, editable, saved, onVersionSaved }: Props) {
  const change = useChangeSetup(unitId, onVersionSaved);
  const form = useSchemaForm(limitsForm, { defaultValues: { limits: limitTextFrom(limits, prefs), note: '' } });
  const boxErrors = form.failure ? 0 : countBoxes(form.formState.errors.limits);
  const note = useWatch({ control: form.control, name: 'note' });

  return (
    <form
      aria-label="Limit set"
      className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
      noValidate
      onSubmit={form.submit(async (version) => {
        await change.mutateAsync({ kind: 'limits', ...version });
        form.reset({ ...form.getValues(), note: '' });
      })}
    >
      <h2 className="font-bold">Limits (watch and alarm)</h2>
      {boxErrors ? (
        <Notice kind="error">{`Nothing was saved: ${boxErrors === 1 ? 'one box needs' : `${boxErrors} boxes need`} a number (marked below), or leave a box empty for no limit.`}</Notice>
      ) : (
        <FormFailure form={form} />
      )}
      {saved ? <Notice kind="success">Saved as a new version; earlier readings keep the limits of their time.</Notice> : null}
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
                <td className="pr-2">{checkCatalog[key].label}</td>
                {bandKeys.map((b) => {
                  const error = form.error(limitField(key, b));
                  const errorId = `limit-error-${key}-${b}`;
                  return (
                    <td key={b} className="pr-1 align-top">
                      <input
                        aria-label={`${checkCatalog[key].label} ${bandLabels[b]}`}
                        aria-invalid={Boolean(error)}
                        aria-describedby={error ? errorId : undefined}
                        disabled={!editable}
                        inputMode="decimal"
                        className="reading w-20 rounded-md border border-line bg-field px-1 py-0.5 aria-[invalid=true]:border-alarm"
                        {...form.register(`limits.${key}.${b}`)}
                      />
                      {error ? (
                        <span id={errorId} role="alert" className="block max-w-40 text-xs text-alarm">
                          ⚠ {error}
                        </span>
                      ) : null}
                    </td>
                  );
                })}
                <td className="text-muted">{unitOf(key)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <SaveVersion editable={editable} note={note} onNote={(text) => form.setValue('note', text, { shouldDirty: true })} error={form.error('note')} pending={change.isPending} saveLabel="Save limits as a new version" readOnlyText="Only an administrator changes limits." />
    </form>
  );
}
