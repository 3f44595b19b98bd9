import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Link } from 'react-router-dom';
import { PasswordChangeSchema } from '../../../../shared/schemas/auth';
import { LIMITS } from '../../../../shared/limits';
import { useChangePassword } from '../../../features/auth/api/change-password';
import { useMe } from '../../../features/auth/api/get-me';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { homeFor } from '../../../config/paths';

/** The signed-in "change password" page, for every role; other sessions of the person end. */
export function ChangePasswordPage() {
  const me = useMe();
  const change = useChangePassword();
  const form = useForm<z.input<typeof PasswordChangeSchema>, unknown, z.output<typeof PasswordChangeSchema>>({
    resolver: zodResolver(PasswordChangeSchema),
    defaultValues: { currentPassword: '', password: '', confirmPassword: '' },
  });
  const back = me.data ? homeFor(me.data.role) : '/';
  return (
    <AuthCard title="Change your password">
      {change.isSuccess ? (
        <div className="flex flex-col gap-3 text-sm">
          <p role="status">{change.data.data.message}</p>
          <Link to={back} className="text-moss-deep underline">Back to Browseline</Link>
        </div>
      ) : (
        <form onSubmit={form.handleSubmit((v) => change.mutate(v))} noValidate className="flex flex-col gap-4">
          {me.data ? <p className="text-sm text-slate">For {me.data.email}</p> : null}
          <TextField label="Current password" type="password" autoComplete="current-password" error={form.formState.errors.currentPassword?.message} {...form.register('currentPassword')} />
          <TextField
            label="New password"
            type="password"
            autoComplete="new-password"
            hint={`At least ${LIMITS.passwordMin} characters, not a common password. A few unrelated words work well.`}
            error={form.formState.errors.password?.message}
            {...form.register('password')}
          />
          <TextField label="The same password again" type="password" autoComplete="new-password" error={form.formState.errors.confirmPassword?.message} {...form.register('confirmPassword')} />
          <p className="text-xs text-slate">You stay signed in here; every other device you use is signed out.</p>
          {change.error ? <p role="alert" className="text-sm text-clay">{change.error.message}</p> : null}
          <div className="flex items-center gap-3">
            <Button type="submit" busy={change.isPending}>Change password</Button>
            <Link to={back} className="text-sm text-slate underline">Cancel</Link>
          </div>
        </form>
      )}
    </AuthCard>
  );
}
