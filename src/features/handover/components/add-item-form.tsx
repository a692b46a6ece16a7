import { newHandoverItemContract } from '../lib/contracts';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useClientKey, useHandoverAction } from '../api/handover';
import { kindLabels } from './board-item';

const field = 'rounded-md border border-line bg-field px-2 py-1';
const writableKinds = ['equipment', 'work_in_progress', 'chemistry', 'follow_up'];

type Values = { kind: string; priority: string; title: string; detail: string; reference: string };

export function AddItemForm({ handoverId, unitId }: { handoverId: number; unitId: number }) {
  const action = useHandoverAction(unitId);
  const [clientKey, newClientKey] = useClientKey();
  // The same key until it succeeds: a double click or a retry makes one item.
  const schema = throughContract((v: Values) => ({ ...v, detail: v.detail || undefined, reference: v.reference || undefined, clientKey }), newHandoverItemContract);
  const form = useSchemaForm(schema, { defaultValues: { kind: 'follow_up', priority: 'normal', title: '', detail: '', reference: '' } });
  return (
    <form
      aria-label="Add a handover item"
      noValidate
      className="grid gap-2 rounded-lg border border-line bg-panel p-3 text-sm sm:grid-cols-2"
      onSubmit={form.submit(async (body) => {
        await action.mutateAsync({ kind: 'item', id: handoverId, body });
        form.reset({ ...form.getValues(), title: '', detail: '', reference: '' });
        newClientKey();
      })}
    >
      <h3 className="font-bold sm:col-span-2">Add an item</h3>
      <label className="flex flex-col">
        Kind
        <select className={field} {...form.register('kind')} {...form.describe('kind')}>
          {writableKinds.map((k) => (
            <option key={k} value={k}>
              {kindLabels[k]}
            </option>
          ))}
        </select>
        <FieldMessage {...form.messageFor('kind')} />
      </label>
      <label className="flex flex-col">
        Priority
        <select className={field} {...form.register('priority')}>
          <option value="high">High</option>
          <option value="normal">Normal</option>
          <option value="low">Low</option>
        </select>
      </label>
      <label className="flex flex-col sm:col-span-2">
        What
        <input className={field} {...form.register('title')} {...form.describe('title')} />
        <FieldMessage {...form.messageFor('title')} />
      </label>
      <label className="flex flex-col">
        Detail
        <input className={field} {...form.register('detail')} {...form.describe('detail')} />
        <FieldMessage {...form.messageFor('detail')} />
      </label>
      <label className="flex flex-col">
        Permit / isolation reference
        <input className={field} {...form.register('reference')} {...form.describe('reference')} />
        <FieldMessage {...form.messageFor('reference')} />
      </label>
      <FormFailure form={form} className="sm:col-span-2" />
      <Button type="submit" size="sm" className="sm:col-span-2" disabled={action.isPending}>
        Add item
      </Button>
    </form>
  );
}
