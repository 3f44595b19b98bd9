import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { LoginSchema } from '../../../../shared/schemas/auth';
import { useLogin } from '../../../features/auth/api/login';
import { useMe } from '../../../features/auth/api/get-me';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { homeFor, paths } from '../../../config/paths';

/** Only same-site paths are followed after sign-in. */
const safeNext = (next: string | null) => (next && next.startsWith('/') && !next.startsWith('//') ? next : null);

export function LoginPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  const login = useLogin();
  const form = useForm<z.input<typeof LoginSchema>, unknown, z.output<typeof LoginSchema>>({ resolver: zodResolver(LoginSchema), defaultValues: { email: params.get('email') ?? '', password: '' } });

  if (me.data) return <Navigate to={safeNext(params.get('next')) ?? homeFor(me.data.role)} replace />;

  const submit = form.handleSubmit((values) =>
    login.mutate(values, { onSuccess: (user) => navigate(safeNext(params.get('next')) ?? homeFor(user.role), { replace: true }) }),
  );

  return (
    <AuthCard title="Sign in">
      <form onSubmit={submit} noValidate className="flex flex-col gap-4">
        <TextField label="E-mail" type="email" autoComplete="username" error={form.formState.errors.email?.message} {...form.register('email')} />
        <TextField label="Password" type="password" autoComplete="current-password" error={form.formState.errors.password?.message} {...form.register('password')} />
        {login.error ? (
          <p role="alert" className="rounded border border-clay/40 bg-clay/5 px-3 py-2 text-sm text-clay">
            {login.error.message}
          </p>
        ) : null}
        <Button type="submit" busy={login.isPending}>
          Sign in
        </Button>
        <Link to={paths.forgotPassword} className="text-center text-sm text-moss-deep underline-offset-2 hover:underline">
          Forgot password
        </Link>
        <Link to={paths.signup} className="text-center text-sm text-moss-deep underline-offset-2 hover:underline">
          New here? Set up your firm
        </Link>
      </form>
    </AuthCard>
  );
}
