import { useState } from 'react';
import { RichTextEditor } from '../../../components/ui/rich-text-editor';
import { Notice } from '../../../components/ui/notice';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { ApiError } from '../../../lib/api-client';
import { useCrews } from '../../../components/plant/crews';
import { StationTimeInput, readStationTime, useStationTimeField } from '../../../components/station-time/station-time-input';
import { useIssueOrder } from '../api/orders';

const field = 'rounded-md border border-line bg-field px-2 py-1';

export function IssueOrderForm({ positions, timeZone }: { positions: { key: string; label: string }[]; timeZone: string }) {
  const issue = useIssueOrder();
  const crews = useCrews();
  const [title, setTitle] = useState('');
  const [body, setBody] = useState('');
  const from = useStationTimeField();
  const to = useStationTimeField();
  const [crewIds, setCrewIds] = useState<number[]>([]);
  const [scopePositions, setScopePositions] = useState<string[]>([]);
  const [formKey, setFormKey] = useState(0);
  const fields = issue.error instanceof ApiError ? issue.error.fields : {};
  const toggle = <T,>(list: T[], item: T) => (list.includes(item) ? list.filter((x) => x !== item) : [...list, item]);

  return (
    <form
      key={formKey}
      aria-label="Issue a standing order"
      className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
      onSubmit={(e) => {
        e.preventDefault();
        const start = readStationTime(from, timeZone);
        const end = readStationTime(to, timeZone);
        if (!start.ok || !end.ok) return;
        issue.mutate(
          {
            title,
            bodyHtml: body,
            effectiveFrom: (start.at ?? new Date()).toISOString(),
            effectiveTo: end.at ? end.at.toISOString() : null,
            crewIds,
            positions: scopePositions,
          },
          {
            onSuccess: () => {
              setTitle('');
              setBody('');
              from.reset();
              to.reset();
              setFormKey((k) => k + 1);
            },
          },
        );
      }}
    >
      <h2 className="font-bold">Issue a standing order</h2>
      <FormErrorSummary error={issue.error} placed={['title', 'bodyHtml', 'effectiveFrom', 'effectiveTo']} />
      {issue.isSuccess ? <Notice kind="success">Issued. Everyone in scope is asked to acknowledge it at their next sign-in.</Notice> : null}
      <label className="flex flex-col text-sm">
        Title
        <input className={field} value={title} onChange={(e) => setTitle(e.target.value)} aria-invalid={Boolean(fields.title)} />
        {fields.title ? <span role="alert" className="font-bold text-alarm">⚠ {fields.title}</span> : null}
      </label>
      <RichTextEditor label="Order text" onChange={setBody} />
      {fields.bodyHtml ? <span role="alert" className="text-sm font-bold text-alarm">⚠ {fields.bodyHtml}</span> : null}
      <div className="flex flex-wrap gap-3 text-sm">
        <StationTimeInput label="In force from (empty = now)" field={from} timeZone={timeZone} error={fields.effectiveFrom} />
        <StationTimeInput label="Until (empty = until withdrawn)" field={to} timeZone={timeZone} error={fields.effectiveTo} />
      </div>
      <fieldset className="flex flex-wrap gap-3 text-sm">
        <legend className="font-bold">Crews (none ticked = all)</legend>
        {crews.data?.map((c) => (
          <label key={c.id} className="flex items-center gap-1">
            <input type="checkbox" checked={crewIds.includes(c.id)} onChange={() => setCrewIds(toggle(crewIds, c.id))} /> Crew {c.name}
          </label>
        ))}
      </fieldset>
      <fieldset className="flex flex-wrap gap-3 text-sm">
        <legend className="font-bold">Positions (none ticked = all)</legend>
        {positions.map((p) => (
          <label key={p.key} className="flex items-center gap-1">
            <input type="checkbox" checked={scopePositions.includes(p.key)} onChange={() => setScopePositions(toggle(scopePositions, p.key))} /> {p.label}
          </label>
        ))}
      </fieldset>
      <button type="submit" className="self-start rounded-md bg-accent px-4 py-1 font-bold text-on-accent" disabled={issue.isPending}>
        Issue order
      </button>
    </form>
  );
}
