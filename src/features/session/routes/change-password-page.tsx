import { useNavigate } from 'react-router';
import { changePasswordSchema } from '../../../../shared/schemas/auth';
import { TextField } from '../../../components/ui/form-field';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { FormFailure, useSchemaForm } from '../../../components/form/schema-form';
import { useMe } from '../api/get-me';
import { useChangePassword } from '../api/change-password';

export function ChangePasswordPage() {
  const { data: me } = useMe();
  const navigate = useNavigate();
  const change = useChangePassword();
  const form = useSchemaForm(changePasswordSchema, {
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  const { errors } = form.formState;
  const onSubmit = form.submit(async (values) => {
    await change.mutateAsync(values);
    form.reset();
    if (me?.mustChangePassword) navigate('/', { replace: true });
  });

  return (
    <section className="max-w-md">
      <h1 className="mb-4 text-2xl font-bold">Change your password</h1>
      {me?.mustChangePassword ? (
        <div className="mb-4">
          <Notice kind="info">You signed in with a temporary password. Choose your own before you continue.</Notice>
        </div>
      ) : null}
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded-lg border border-line bg-panel p-6">
        <FormFailure form={form} />
        {change.isSuccess ? <Notice kind="success">Your password is changed. Any other browser signed in as you has been signed out.</Notice> : null}
        <TextField
          label="Current password"
          type="password"
          autoComplete="current-password"
          error={errors.currentPassword?.message}
          {...form.register('currentPassword')}
        />
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          hint="At least 12 characters, hard to guess: three or four unrelated words work well. Not a common password, not your name or e-mail. Changing it signs you out everywhere else."
          error={errors.newPassword?.message}
          {...form.register('newPassword')}
        />
        <Button type="submit" disabled={change.isPending}>
          Change password
        </Button>
      </form>
    </section>
  );
}
