import { useState } from 'react';
import { checkCatalog, checkKeys, type CheckKey } from '../../../../shared/calc/check-catalog';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useFlagAction } from '../api/flags';

export function RaiseFlagForm({ unitId }: { unitId: number }) {
  const action = useFlagAction();
  const [parameter, setParameter] = useState<CheckKey>('ttd');
  const [severity, setSeverity] = useState<'watch' | 'alarm'>('watch');
  const [comment, setComment] = useState('');
  const fields = action.error instanceof ApiError ? action.error.fields : {};
  return (
    <form
      aria-label="Raise a flag"
      className="grid gap-3 rounded-lg border border-line bg-panel p-3 sm:grid-cols-3"
      onSubmit={(e) => {
        e.preventDefault();
        action.mutate({ kind: 'raise', unitId, input: { parameter, severity, comment } }, { onSuccess: () => setComment('') });
      }}
    >
      <h2 className="font-bold sm:col-span-3">Raise a flag</h2>
      {action.error ? <div className="sm:col-span-3"><Notice kind="error">{action.error.message}</Notice></div> : null}
      <label className="flex flex-col text-sm">
        Parameter
        <select className="rounded-md border border-line bg-field px-2 py-1" value={parameter} onChange={(e) => setParameter(e.target.value as CheckKey)}>
          {checkKeys.map((key) => (
            <option key={key} value={key}>
              {checkCatalog[key].label}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-sm">
        Severity
        <select className="rounded-md border border-line bg-field px-2 py-1" value={severity} onChange={(e) => setSeverity(e.target.value as 'watch' | 'alarm')}>
          <option value="watch">Watch</option>
          <option value="alarm">Alarm</option>
        </select>
      </label>
      <label className="flex flex-col text-sm sm:col-span-3">
        Comment
        <textarea className="rounded-md border border-line bg-field p-2" rows={2} value={comment} onChange={(e) => setComment(e.target.value)} />
        {fields.comment ? <span role="alert" className="text-alarm">⚠ {fields.comment}</span> : null}
      </label>
      <button type="submit" className="rounded-md bg-accent px-3 py-2 font-bold text-on-accent sm:col-span-1" disabled={action.isPending}>
        Raise flag
      </button>
    </form>
  );
}
