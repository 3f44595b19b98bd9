import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { TokenPasswordSchema, type TokenPasswordInput } from '../../../../shared/schemas/auth';
import { LIMITS } from '../../../../shared/limits';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';

/** New password twice, for an invitation or a reset link. */
export function SetPasswordForm({ token, submitLabel, busy, error, onSubmit }: { token: string; submitLabel: string; busy: boolean; error: Error | null; onSubmit: (v: TokenPasswordInput) => void }) {
  const form = useForm<z.input<typeof TokenPasswordSchema>, unknown, z.output<typeof TokenPasswordSchema>>({
    resolver: zodResolver(TokenPasswordSchema),
    defaultValues: { token, password: '', confirmPassword: '' },
  });
  return (
    <form onSubmit={form.handleSubmit(onSubmit)} noValidate className="flex flex-col gap-4">
      <TextField label="New password" type="password" autoComplete="new-password" hint={`At least ${LIMITS.passwordMin} characters.`} error={form.formState.errors.password?.message} {...form.register('password')} />
      <TextField label="The same password again" type="password" autoComplete="new-password" error={form.formState.errors.confirmPassword?.message} {...form.register('confirmPassword')} />
      {error ? <p role="alert" className="text-sm text-clay">{error.message}</p> : null}
      <Button type="submit" busy={busy}>
        {submitLabel}
      </Button>
    </form>
  );
}
