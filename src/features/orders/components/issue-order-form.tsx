import { useState } from 'react';
import { useWatch } from 'react-hook-form';
import { standingOrderSchema } from '../../../../shared/schemas/log';
import { RichTextEditor } from '../../../components/ui/rich-text-editor';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useCrews } from '../../../components/plant/crews';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { emptyStationTime, StationTimeInput, stationTimeToWire, useStationTimeFormField, type StationTimeValue } from '../../../components/station-time/station-time-input';
import { useIssueOrder } from '../api/orders';

const field = 'rounded-md border border-line bg-field px-2 py-1';

type Values = { title: string; bodyHtml: string; effectiveFrom: StationTimeValue; effectiveTo: StationTimeValue; crewIds: number[]; positions: string[] };
const blank: Values = { title: '', bodyHtml: '', effectiveFrom: emptyStationTime, effectiveTo: emptyStationTime, crewIds: [], positions: [] };

export function IssueOrderForm({ positions, timeZone }: { positions: { key: string; label: string }[]; timeZone: string }) {
  const issue = useIssueOrder();
  const crews = useCrews();
  // The editor keeps its own text: a new key gives a fresh, empty one after an order is issued.
  const [formKey, setFormKey] = useState(0);
  const schema = throughContract(
    (v: Values, fail) => ({
      ...v,
      // Empty "from" is now; empty "until" is until withdrawn.
      effectiveFrom: stationTimeToWire(v.effectiveFrom, timeZone, fail, 'effectiveFrom') ?? new Date().toISOString(),
      effectiveTo: stationTimeToWire(v.effectiveTo, timeZone, fail, 'effectiveTo') ?? null,
    }),
    standingOrderSchema,
  );
  const form = useSchemaForm(schema, { defaultValues: blank, placed: ['title', 'bodyHtml', 'effectiveFrom', 'effectiveTo'] });
  const from = useStationTimeFormField(form, 'effectiveFrom');
  const to = useStationTimeFormField(form, 'effectiveTo');
  const [crewIds, scopePositions] = useWatch({ control: form.control, name: ['crewIds', 'positions'] });
  const toggle = <T,>(list: T[], item: T) => (list.includes(item) ? list.filter((x) => x !== item) : [...list, item]);

  return (
    <form
      key={formKey}
      aria-label="Issue a standing order"
      noValidate
      className="flex flex-col gap-3 rounded-lg border border-line bg-panel p-3"
      onSubmit={form.submit(async (order) => {
        await issue.mutateAsync(order);
        form.reset(blank);
        setFormKey((k) => k + 1);
      })}
    >
      <h2 className="font-bold">Issue a standing order</h2>
      <FormFailure form={form} />
      {issue.isSuccess ? <Notice kind="success">Issued. Everyone in scope is asked to acknowledge it at their next sign-in.</Notice> : null}
      <label className="flex flex-col text-sm">
        Title
        <input className={field} {...form.register('title')} {...form.describe('title')} />
        <FieldMessage {...form.messageFor('title')} className="font-bold text-alarm" />
      </label>
      <RichTextEditor label="Order text" onChange={(html) => form.setValue('bodyHtml', html, { shouldDirty: true })} />
      <FieldMessage {...form.messageFor('bodyHtml')} className="text-sm font-bold text-alarm" />
      <div className="flex flex-wrap gap-3 text-sm">
        <StationTimeInput label="In force from (empty = now)" field={from} timeZone={timeZone} error={form.error('effectiveFrom')} />
        <StationTimeInput label="Until (empty = until withdrawn)" field={to} timeZone={timeZone} error={form.error('effectiveTo')} />
      </div>
      <fieldset className="flex flex-wrap gap-3 text-sm">
        <legend className="font-bold">Crews (none ticked = all)</legend>
        {crews.data?.map((c) => (
          <label key={c.id} className="flex items-center gap-1">
            <input type="checkbox" checked={crewIds.includes(c.id)} onChange={() => form.setValue('crewIds', toggle(crewIds, c.id), { shouldDirty: true })} /> Crew {c.name}
          </label>
        ))}
      </fieldset>
      <fieldset className="flex flex-wrap gap-3 text-sm">
        <legend className="font-bold">Positions (none ticked = all)</legend>
        {positions.map((p) => (
          <label key={p.key} className="flex items-center gap-1">
            <input type="checkbox" checked={scopePositions.includes(p.key)} onChange={() => form.setValue('positions', toggle(scopePositions, p.key), { shouldDirty: true })} /> {p.label}
          </label>
        ))}
      </fieldset>
      <Button type="submit" size="sm" className="self-start" disabled={issue.isPending}>
        Issue order
      </Button>
    </form>
  );
}
