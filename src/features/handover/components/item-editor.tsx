import { editHandoverItemContract } from '../lib/contracts';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useHandoverAction, type BoardItem } from '../api/handover';

const field = 'rounded-md border border-line bg-field px-2 py-1';

type Values = { title: string; detail: string; priority: BoardItem['priority'] };

/** Edits a draft item. An automatic item keeps its source's title and priority; only its detail is the crew's. */
export function ItemEditor({ item, unitId, onDone }: { item: BoardItem; unitId: number; onDone: () => void }) {
  const action = useHandoverAction(unitId);
  const schema = throughContract(
    (v: Values) => (item.automatic ? { detail: v.detail || null, version: item.version } : { title: v.title, detail: v.detail || null, priority: v.priority, version: item.version }),
    editHandoverItemContract,
  );
  const form = useSchemaForm(schema, { defaultValues: { title: item.title, detail: item.detail ?? '', priority: item.priority } });
  return (
    <form
      aria-label={`Edit: ${item.title}`}
      noValidate
      className="mt-2 grid gap-2 text-sm sm:grid-cols-2"
      onSubmit={form.submit(async (body) => {
        await action.mutateAsync({ kind: 'edit-item', itemId: item.id, body });
        onDone();
      })}
    >
      {!item.automatic ? (
        <>
          <label className="flex flex-col sm:col-span-2">
            What
            <input className={field} {...form.register('title')} {...form.describe('title')} />
            <FieldMessage {...form.messageFor('title')} />
          </label>
          <label className="flex flex-col">
            Priority
            <select className={field} {...form.register('priority')} {...form.describe('priority')}>
              <option value="high">High</option>
              <option value="normal">Normal</option>
              <option value="low">Low</option>
            </select>
            <FieldMessage {...form.messageFor('priority')} />
          </label>
        </>
      ) : null}
      <label className="flex flex-col">
        Detail
        <input className={field} {...form.register('detail')} {...form.describe('detail')} />
        <FieldMessage {...form.messageFor('detail')} />
      </label>
      <FormFailure form={form} className="sm:col-span-2" />
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit" size="sm" disabled={action.isPending}>
          Save the item
        </Button>
        <Button tone="plain" size="sm" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
