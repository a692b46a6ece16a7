import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { signInSchema } from '../../../../shared/schemas/auth';
import { TextField } from '../../../components/ui/form-field';
import { Button } from '../../../components/ui/button';
import { CautionNote } from '../../../components/ui/notice';
import { FormFailure, useSchemaForm } from '../../../components/form/schema-form';
import { useMe } from '../api/get-me';
import { useSignIn } from '../api/sign-in';

/** Only same-site paths are followed after sign-in. */
function safeNext(raw: string | null) {
  return raw && raw.startsWith('/') && !raw.startsWith('//') ? raw : '/';
}

export function SignInPage() {
  const { data: me } = useMe();
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const signIn = useSignIn();
  const form = useSchemaForm(signInSchema, { defaultValues: { email: '', password: '' } });
  const next = safeNext(params.get('next'));

  if (me) return <Navigate to={next} replace />;

  const onSubmit = form.submit(async (values) => {
    const user = await signIn.mutateAsync(values);
    navigate(user.mustChangePassword ? '/account/password' : next, { replace: true });
  });
  const { errors } = form.formState;

  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-4">
      <div>
        <h1 className="text-4xl font-bold">Hotwell</h1>
        <p className="mt-1 text-muted">Condenser and cooling-water rounds, shift log and handover.</p>
      </div>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded-lg border border-line bg-panel p-6">
        <h2 className="text-xl font-bold">Sign in</h2>
        <FormFailure form={form} />
        <TextField label="E-mail" type="email" autoComplete="username" error={errors.email?.message} {...form.register('email')} />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          {...form.register('password')}
        />
        <Button type="submit" disabled={signIn.isPending}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </Button>
      </form>
      <CautionNote />
    </main>
  );
}
