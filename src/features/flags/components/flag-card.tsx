import { useState } from 'react';
import { Link } from 'react-router';
import { defaultDisplayPreferences, displayQuantity } from '../../../../shared/display';
import { formatStationTime } from '../../../../shared/station-time';
import { StatusBadge } from '../../../components/ui/status-badge';
import { Notice } from '../../../components/ui/notice';
import { useFlagAction, type FlagView } from '../api/flags';
import { PersonSelect } from '../../../components/people/person-select';

export function FlagCard({ flag, mayLead, timeZone }: { flag: FlagView; mayLead: boolean; timeZone: string }) {
  const stamp = (iso: string) => formatStationTime(iso, timeZone);
  const action = useFlagAction();
  const [mode, setMode] = useState<'none' | 'assign' | 'clear'>('none');
  const [text, setText] = useState('');
  const [assignee, setAssignee] = useState('');
  const value = flag.lastValue !== null && flag.quantity ? displayQuantity(flag.lastValue, flag.quantity, defaultDisplayPreferences) : null;
  const fieldError = action.error && 'fields' in action.error ? (action.error as { fields: Record<string, string> }).fields : {};

  return (
    <article className="rounded-lg border border-line bg-panel p-3" data-testid={`flag-${flag.id}`} aria-label={`Flag: ${flag.parameterLabel}`}>
      <header className="flex flex-wrap items-center gap-2">
        <StatusBadge status={flag.status === 'cleared' ? 'normal' : flag.severity} />
        <h3 className="font-bold">{flag.parameterLabel}</h3>
        <span className="text-sm text-muted">
          {flag.origin === 'automatic' ? 'outside limits' : `raised by ${flag.raisedBy}`} · {stamp(flag.raisedAt)}
          {flag.status === 'cleared' ? ' · cleared' : ''}
        </span>
        {value ? (
          <span className="reading ml-auto text-lg font-semibold">
            {value.text} <span className="text-sm font-normal text-muted">{value.unit}</span>
          </span>
        ) : null}
      </header>
      {flag.comment ? <p className="mt-1">{flag.comment}</p> : null}
      {flag.lastReadingSetId ? (
        <p className="text-sm">
          Latest reading:{' '}
          <Link className="text-accent underline" to={`/rounds/${flag.lastReadingSetId}`}>
            {stamp(flag.lastSeenAt)}
          </Link>
        </p>
      ) : null}
      {flag.assignedTo ? (
        <p className="text-sm">
          <strong>Follow-up by {flag.assignedTo}:</strong> {flag.followUp}
        </p>
      ) : null}
      {flag.status === 'cleared' ? (
        <p className="text-sm">
          <strong>
            Cleared by {flag.clearedBy} at {flag.clearedAt ? stamp(flag.clearedAt) : ''}:
          </strong>{' '}
          {flag.clearComment}
        </p>
      ) : null}
      {action.error ? <Notice kind="error">{action.error.message}</Notice> : null}
      {mayLead && flag.status === 'open' ? (
        <div className="mt-2 flex flex-col gap-2">
          {mode === 'none' ? (
            <div className="flex gap-2">
              <button type="button" className="rounded-md border border-line px-2 py-1 text-sm font-bold" onClick={() => setMode('assign')}>
                Assign follow-up
              </button>
              <button type="button" className="rounded-md border border-line px-2 py-1 text-sm font-bold" onClick={() => setMode('clear')}>
                Clear flag
              </button>
            </div>
          ) : (
            <form
              className="flex flex-col gap-2"
              onSubmit={(e) => {
                e.preventDefault();
                const done = { onSuccess: () => { setMode('none'); setText(''); } };
                if (mode === 'assign') action.mutate({ kind: 'assign', id: flag.id, input: { assignedTo: Number(assignee), followUp: text, version: flag.version } }, done);
                else action.mutate({ kind: 'clear', id: flag.id, input: { comment: text, version: flag.version } }, done);
              }}
            >
              {mode === 'assign' ? (
                <PersonSelect label="Who follows it up" value={assignee} onChange={setAssignee} error={fieldError.assignedTo} />
              ) : null}
              <label className="flex flex-col text-sm">
                {mode === 'assign' ? 'What to do' : 'Closing comment'}
                <textarea className="rounded-md border border-line bg-field p-2" rows={2} value={text} onChange={(e) => setText(e.target.value)} />
                {fieldError.followUp || fieldError.comment ? <span className="text-alarm">⚠ {fieldError.followUp ?? fieldError.comment}</span> : null}
              </label>
              <div className="flex gap-2">
                <button type="submit" className="rounded-md bg-accent px-3 py-1 font-bold text-on-accent" disabled={action.isPending}>
                  {mode === 'assign' ? 'Assign' : 'Clear with this comment'}
                </button>
                <button type="button" className="rounded-md border border-line px-3 py-1" onClick={() => setMode('none')}>
                  Cancel
                </button>
              </div>
            </form>
          )}
        </div>
      ) : null}
    </article>
  );
}
