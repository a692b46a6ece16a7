import { useState } from 'react';
import { checkCatalog, checkKeys, type CheckKey } from '../../../../shared/calc/check-catalog';
import type { LimitSet } from '../../../../shared/calc/limits';
import { convertForDisplay, defaultDisplayPreferences } from '../../../../shared/display';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useChangeSetup } from '../api/setup';
import { bandKeys, bandLabels, limitField, limitSetFromText, limitTextFrom, type LimitText } from '../lib/limit-entry';
import { SaveVersion } from './save-version';

const prefs = { ...defaultDisplayPreferences, currency: 'money' };
const unitOf = (key: CheckKey) => convertForDisplay(1, checkCatalog[key].quantity, prefs).unit;

export function LimitsForm({ unitId, limits, editable }: { unitId: number; limits: LimitSet; editable: boolean }) {
  const change = useChangeSetup(unitId);
  const [text, setText] = useState<LimitText>(() => limitTextFrom(limits, prefs));
  const [note, setNote] = useState('');
  // Boxes that do not hold a number, found before anything is sent; the server's messages otherwise.
  const [typingErrors, setTypingErrors] = useState<Record<string, string>>({});
  const fields = { ...(change.error instanceof ApiError ? change.error.fields : {}), ...typingErrors };
  const boxErrors = Object.keys(fields).filter((f) => f.startsWith('limits.')).length;

  const save = () => {
    const { limits: next, errors } = limitSetFromText(text, prefs);
    setTypingErrors(errors);
    if (Object.keys(errors).length) return;
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
      {boxErrors ? (
        <Notice kind="error">{`Nothing was saved: ${boxErrors === 1 ? 'one box needs' : `${boxErrors} boxes need`} a number (marked below), or leave a box empty for no limit.`}</Notice>
      ) : change.error ? (
        <Notice kind="error">{change.error.message}</Notice>
      ) : null}
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
                <td className="pr-2">{checkCatalog[key].label}</td>
                {bandKeys.map((b) => {
                  const error = fields[limitField(key, b)];
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
                        value={text[key][b]}
                        onChange={(e) => {
                          setText({ ...text, [key]: { ...text[key], [b]: e.target.value } });
                          if (typingErrors[limitField(key, b)]) setTypingErrors(({ [limitField(key, b)]: _, ...rest }) => rest);
                        }}
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
      <SaveVersion editable={editable} note={note} onNote={setNote} error={fields.note} pending={change.isPending} saveLabel="Save limits as a new version" readOnlyText="Only an administrator changes limits." />
    </form>
  );
}
