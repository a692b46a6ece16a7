import { useEffect, useState } from 'react';
import { formatRemaining } from '../../../../shared/conditions';
import { StatusBadge } from '../../../components/ui/status-badge';
import { ApiError } from '../../../lib/api-client';
import { PersonSelect } from '../../../components/people/person-select';
import { useCloseCondition, useConditions, useOpenCondition, type ConditionView } from '../api/log';

const stateBadge = { running: 'normal', due_soon: 'watch', overdue: 'alarm', closed: 'unknown' } as const;
const stateWord = { running: 'time left', due_soon: 'due soon', overdue: 'OVERDUE', closed: 'closed' } as const;

/** Counts down from the server's figure; the server's clock, not this device's, sets the start. */
function Countdown({ condition }: { condition: ConditionView }) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 30_000);
    return () => clearInterval(timer);
  }, []);
  const [loadedAt] = useState(() => Date.now());
  const remaining = condition.remainingMs - (now - loadedAt);
  return (
    <span className={`reading font-semibold ${remaining < 0 ? 'text-alarm' : ''}`} data-testid={`countdown-${condition.id}`}>
      {formatRemaining(remaining)}
    </span>
  );
}

function CloseForm({ condition, position }: { condition: ConditionView; position: string }) {
  const close = useCloseCondition();
  const [text, setText] = useState('');
  return (
    <form
      aria-label={`Close ${condition.title}`}
      className="mt-1 flex gap-2 text-sm"
      onSubmit={(e) => {
        e.preventDefault();
        close.mutate({ id: condition.id, text, position, version: condition.version });
      }}
    >
      <input aria-label="Closing entry" placeholder="Closing entry: what was done" className="flex-1 rounded-md border border-line bg-field px-2 py-1" value={text} onChange={(e) => setText(e.target.value)} />
      <button type="submit" className="rounded-md border border-line px-2 font-bold">
        Close
      </button>
      {close.error ? <span role="alert" className="text-alarm">⚠ {close.error.message}</span> : null}
    </form>
  );
}

function OpenForm({ unitId }: { unitId: number }) {
  const open = useOpenCondition(unitId);
  const [title, setTitle] = useState('');
  const [action, setAction] = useState('');
  const [hours, setHours] = useState('72');
  const [owner, setOwner] = useState('');
  const fields = open.error instanceof ApiError ? open.error.fields : {};
  return (
    <form
      aria-label="Open a time-limited condition"
      className="grid gap-2 border-t border-line pt-2 text-sm sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        open.mutate({ title, requiredAction: action, startedAt: new Date().toISOString(), limitHours: Number(hours), ownerId: Number(owner) }, { onSuccess: () => { setTitle(''); setAction(''); } });
      }}
    >
      <label className="flex flex-col">
        Condition
        <input className="rounded-md border border-line bg-field px-2 py-1" value={title} onChange={(e) => setTitle(e.target.value)} />
        {fields.title ? <span className="text-alarm">⚠ {fields.title}</span> : null}
      </label>
      <label className="flex flex-col">
        Required action
        <input className="rounded-md border border-line bg-field px-2 py-1" value={action} onChange={(e) => setAction(e.target.value)} />
        {fields.requiredAction ? <span className="text-alarm">⚠ {fields.requiredAction}</span> : null}
      </label>
      <label className="flex flex-col">
        Time allowed (hours from now)
        <input inputMode="decimal" className="rounded-md border border-line bg-field px-2 py-1" value={hours} onChange={(e) => setHours(e.target.value)} />
      </label>
      <PersonSelect label="Owner" value={owner} onChange={setOwner} error={fields.ownerId} />
      <button type="submit" className="rounded-md bg-accent px-3 py-1 font-bold text-on-accent sm:col-span-2">
        Open condition
      </button>
    </form>
  );
}

export function ConditionsPanel({ unitId, position, mayHandle }: { unitId: number; position: string; mayHandle: boolean }) {
  const conditions = useConditions(unitId);
  return (
    <section aria-label="Time-limited conditions" className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3">
      <h2 className="font-bold">Time-limited conditions</h2>
      {conditions.data?.length === 0 ? <p className="text-sm text-muted">None open.</p> : null}
      {conditions.data?.map((c) => (
        <article key={c.id} className="border-t border-line pt-2" aria-label={`Condition: ${c.title}`}>
          <div className="flex flex-wrap items-center gap-2">
            <StatusBadge status={stateBadge[c.state]} />
            <strong>{c.title}</strong>
            <span className="text-sm text-muted">{stateWord[c.state]}:</span>
            <Countdown condition={c} />
          </div>
          <p className="text-sm">
            {c.requiredAction} · deadline {c.limitLocal} (station time, {c.timeZone}) · owner {c.owner}
          </p>
          {mayHandle ? <CloseForm condition={c} position={position} /> : null}
        </article>
      ))}
      {mayHandle ? <OpenForm unitId={unitId} /> : null}
    </section>
  );
}
