import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useClientKey, useHandoverAction } from '../api/handover';
import { kindLabels } from './board-item';

const field = 'rounded-md border border-line bg-field px-2 py-1';
const writableKinds = ['equipment', 'work_in_progress', 'chemistry', 'follow_up'];

export function AddItemForm({ handoverId, unitId }: { handoverId: number; unitId: number }) {
  const action = useHandoverAction(unitId);
  const [clientKey, newClientKey] = useClientKey();
  const [kind, setKind] = useState('follow_up');
  const [title, setTitle] = useState('');
  const [detail, setDetail] = useState('');
  const [reference, setReference] = useState('');
  const [priority, setPriority] = useState('normal');
  const fields = action.error instanceof ApiError ? action.error.fields : {};
  return (
    <form
      aria-label="Add a handover item"
      className="grid gap-2 rounded-lg border border-line bg-panel p-3 text-sm sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        // The same key until it succeeds: a double click or a retry makes one item.
        action.mutate(
          { kind: 'item', id: handoverId, body: { kind, title, detail: detail || undefined, reference: reference || undefined, priority, clientKey } },
          {
            onSuccess: () => {
              setTitle('');
              setDetail('');
              setReference('');
              newClientKey();
            },
          },
        );
      }}
    >
      <h3 className="font-bold sm:col-span-2">Add an item</h3>
      <label className="flex flex-col">
        Kind
        <select className={field} value={kind} onChange={(e) => setKind(e.target.value)}>
          {writableKinds.map((k) => (
            <option key={k} value={k}>
              {kindLabels[k]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col">
        Priority
        <select className={field} value={priority} onChange={(e) => setPriority(e.target.value)}>
          <option value="high">High</option>
          <option value="normal">Normal</option>
          <option value="low">Low</option>
        </select>
      </label>
      <label className="flex flex-col sm:col-span-2">
        What
        <input className={field} value={title} onChange={(e) => setTitle(e.target.value)} />
        {fields.title ? <span role="alert" className="text-alarm">⚠ {fields.title}</span> : null}
      </label>
      <label className="flex flex-col">
        Detail
        <input className={field} value={detail} onChange={(e) => setDetail(e.target.value)} />
        {fields.detail ? <span role="alert" className="text-alarm">⚠ {fields.detail}</span> : null}
      </label>
      <label className="flex flex-col">
        Permit / isolation reference
        <input className={field} value={reference} onChange={(e) => setReference(e.target.value)} />
        {fields.reference ? <span role="alert" className="text-alarm">⚠ {fields.reference}</span> : null}
      </label>
      {action.error && !Object.keys(fields).length ? <p role="alert" className="font-bold text-alarm sm:col-span-2">⚠ {action.error.message}</p> : null}
      <Button type="submit" className="px-3 py-1 sm:col-span-2" disabled={action.isPending}>
        Add item
      </Button>
    </form>
  );
}
