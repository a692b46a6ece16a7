import { checkCatalog, checkKeys } from '../../../../shared/calc/check-catalog';
import { raiseFlagSchema } from '../../../../shared/schemas/flags';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, useSchemaForm } from '../../../components/form/schema-form';
import { useFlagAction } from '../api/flags';

const selectClass = 'rounded-md border border-line bg-field px-2 py-1';

export function RaiseFlagForm({ unitId }: { unitId: number }) {
  const action = useFlagAction();
  const form = useSchemaForm(raiseFlagSchema, { defaultValues: { parameter: 'ttd', severity: 'watch', comment: '' } });
  return (
    <form
      aria-label="Raise a flag"
      noValidate
      className="grid gap-3 rounded-lg border border-line bg-panel p-3 sm:grid-cols-3"
      onSubmit={form.submit(async (input) => {
        await action.mutateAsync({ kind: 'raise', unitId, input });
        form.reset({ ...form.getValues(), comment: '' });
      })}
    >
      <h2 className="font-bold sm:col-span-3">Raise a flag</h2>
      <FormFailure form={form} className="sm:col-span-3" />
      <label className="flex flex-col text-sm">
        Parameter
        <select className={selectClass} {...form.register('parameter')} {...form.describe('parameter')}>
          {checkKeys.map((key) => (
            <option key={key} value={key}>
              {checkCatalog[key].label}
            </option>
          ))}
        </select>
        <FieldMessage {...form.messageFor('parameter')} />
      </label>
      <label className="flex flex-col text-sm">
        Severity
        <select className={selectClass} {...form.register('severity')} {...form.describe('severity')}>
          <option value="watch">Watch</option>
          <option value="alarm">Alarm</option>
        </select>
        <FieldMessage {...form.messageFor('severity')} />
      </label>
      <label className="flex flex-col text-sm sm:col-span-3">
        Comment
        <textarea className="rounded-md border border-line bg-field p-2" rows={2} {...form.register('comment')} {...form.describe('comment')} />
        <FieldMessage {...form.messageFor('comment')} />
      </label>
      <Button type="submit" className="sm:col-span-1" disabled={action.isPending}>
        Raise flag
      </Button>
    </form>
  );
}
