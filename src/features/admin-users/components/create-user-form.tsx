import { createUserSchema } from '../../../../shared/schemas/auth';
import { roleLabels, roles } from '../../../../shared/roles';
import { SelectField, TextField } from '../../../components/ui/form-field';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { FormFailure, useSchemaForm } from '../../../components/form/schema-form';
import type { CrewSummary } from '../../../components/plant/crews';
import { useChangeUser } from '../api/change-user';

export function CreateUserForm({ crews }: { crews: CrewSummary[] }) {
  const change = useChangeUser();
  const form = useSchemaForm(createUserSchema, {
    defaultValues: { name: '', email: '', role: 'operator', crewId: null, temporaryPassword: '' },
  });
  const { errors } = form.formState;
  const onSubmit = form.submit(async (input) => {
    await change.mutateAsync({ kind: 'create', input });
    form.reset();
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add a person" className="grid gap-4 rounded-lg border border-line bg-panel p-4 sm:grid-cols-2">
      <h2 className="text-lg font-bold sm:col-span-2">Add a person</h2>
      <FormFailure form={form} className="sm:col-span-2" />
      {change.isSuccess ? (
        <div className="sm:col-span-2">
          <Notice kind="success">Added {change.data.name}. They must choose their own password at first sign-in.</Notice>
        </div>
      ) : null}
      <TextField label="Full name" error={errors.name?.message} {...form.register('name')} />
      <TextField label="E-mail" type="email" error={errors.email?.message} {...form.register('email')} />
      <SelectField label="Role" error={errors.role?.message} {...form.register('role')}>
        {roles.map((role) => (
          <option key={role} value={role}>
            {roleLabels[role]}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Crew"
        error={errors.crewId?.message}
        {...form.register('crewId', { setValueAs: (v: string) => (v === '' || v === null ? null : Number(v)) })}
      >
        <option value="">No crew (day staff)</option>
        {crews.map((crew) => (
          <option key={crew.id} value={crew.id}>
            Crew {crew.name}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Temporary password"
        type="text"
        autoComplete="off"
        hint="At least 12 characters, hard to guess, not the person’s name or e-mail; give it to the person directly."
        error={errors.temporaryPassword?.message}
        {...form.register('temporaryPassword')}
      />
      <div className="flex items-end">
        <Button type="submit" disabled={change.isPending}>
          Add person
        </Button>
      </div>
    </form>
  );
}
