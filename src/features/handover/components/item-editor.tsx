import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { useHandoverAction, type BoardItem } from '../api/handover';

const field = 'rounded-md border border-line bg-field px-2 py-1';

/** Edits a draft item. An automatic item keeps its source's title and priority; only its detail is the crew's. */
export function ItemEditor({ item, unitId, onDone }: { item: BoardItem; unitId: number; onDone: () => void }) {
  const action = useHandoverAction(unitId);
  const [title, setTitle] = useState(item.title);
  const [detail, setDetail] = useState(item.detail ?? '');
  const [priority, setPriority] = useState(item.priority);
  const fields = action.error instanceof ApiError ? action.error.fields : {};
  return (
    <form
      aria-label={`Edit: ${item.title}`}
      className="mt-2 grid gap-2 text-sm sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        const body = item.automatic ? { detail: detail || null, version: item.version } : { title, detail: detail || null, priority, version: item.version };
        action.mutate({ kind: 'edit-item', itemId: item.id, body }, { onSuccess: onDone });
      }}
    >
      {!item.automatic ? (
        <>
          <label className="flex flex-col sm:col-span-2">
            What
            <input className={field} value={title} onChange={(e) => setTitle(e.target.value)} />
            {fields.title ? <span role="alert" className="text-alarm">⚠ {fields.title}</span> : null}
          </label>
          <label className="flex flex-col">
            Priority
            <select className={field} value={priority} onChange={(e) => setPriority(e.target.value as BoardItem['priority'])}>
              <option value="high">High</option>
              <option value="normal">Normal</option>
              <option value="low">Low</option>
            </select>
          </label>
        </>
      ) : null}
      <label className="flex flex-col">
        Detail
        <input className={field} value={detail} onChange={(e) => setDetail(e.target.value)} />
        {fields.detail ? <span role="alert" className="text-alarm">⚠ {fields.detail}</span> : null}
      </label>
      {action.error && !Object.keys(fields).length ? <p role="alert" className="font-bold text-alarm sm:col-span-2">⚠ {action.error.message}</p> : null}
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit" className="px-3 py-1" disabled={action.isPending}>
          Save the item
        </Button>
        <Button tone="plain" className="px-3 py-1" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
