import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { signInSchema, type SignInInput } from '../../../../shared/schemas/auth';
import { TextField } from '../../../components/ui/form-field';
import { Button } from '../../../components/ui/button';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { applyServerErrors } from '../../../lib/form-errors';
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
  const form = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } });
  const next = safeNext(params.get('next'));

  if (me) return <Navigate to={next} replace />;

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, {
      onSuccess: (user) => navigate(user.mustChangePassword ? '/account/password' : next, { replace: true }),
      onError: (error) => form.setError('root', { message: applyServerErrors(error, form.setError) }),
    }),
  );
  const { errors } = form.formState;

  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-4">
      <div>
        <h1 className="text-4xl font-bold">Hotwell</h1>
        <p className="mt-1 text-muted">Condenser and cooling-water rounds, shift log and handover.</p>
      </div>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded-lg border border-line bg-panel p-6">
        <h2 className="text-xl font-bold">Sign in</h2>
        {errors.root?.message ? <Notice kind="error">{errors.root.message}</Notice> : null}
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
