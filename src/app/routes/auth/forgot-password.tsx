import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Link } from 'react-router-dom';
import { PasswordResetRequestSchema } from '../../../../shared/schemas/auth';
import { useRequestPasswordReset } from '../../../features/auth/api/tokens';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { paths } from '../../../config/paths';

export function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const form = useForm<z.input<typeof PasswordResetRequestSchema>, unknown, z.output<typeof PasswordResetRequestSchema>>({ resolver: zodResolver(PasswordResetRequestSchema), defaultValues: { email: '' } });
  return (
    <AuthCard title="Reset your password">
      {request.isSuccess ? (
        <div className="flex flex-col gap-4 text-sm">
          <p role="status">{request.data.data.message}</p>
          <Link to={paths.login} className="text-moss-deep underline">
            Back to sign in
          </Link>
        </div>
      ) : (
        <form onSubmit={form.handleSubmit((v) => request.mutate(v))} noValidate className="flex flex-col gap-4">
          <p className="text-sm text-slate">Enter the e-mail address of your account and we will send a link to choose a new password.</p>
          <TextField label="E-mail" type="email" autoComplete="email" error={form.formState.errors.email?.message} {...form.register('email')} />
          {request.error ? <p role="alert" className="text-sm text-clay">{request.error.message}</p> : null}
          <Button type="submit" busy={request.isPending}>
            Send the link
          </Button>
          <Link to={paths.login} className="text-center text-sm text-moss-deep hover:underline">
            Back to sign in
          </Link>
        </form>
      )}
    </AuthCard>
  );
}
