import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { SignupSchema } from '../../../../shared/schemas/auth';
import { useSignup } from '../../../features/auth/api/signup';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { HomeAreaPicker } from '../../../features/plan-map/components/home-area-picker';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { paths } from '../../../config/paths';

/** A new firm signs itself up; the owner confirms the e-mail address before the first sign-in. */
export function SignupPage() {
  const signup = useSignup();
  const form = useForm<z.input<typeof SignupSchema>, unknown, z.output<typeof SignupSchema>>({ resolver: zodResolver(SignupSchema), defaultValues: { firmName: '', name: '', email: '', password: '' } });
  const err = form.formState.errors;
  const homeArea = form.watch('homeArea') ?? null;
  return (
    <AuthCard title="Set up your firm">
      {signup.isSuccess ? (
        <div className="flex flex-col gap-4 text-sm">
          <p role="status">{signup.data.data.message}</p>
          <a href={paths.login} className="text-moss-deep underline">
            Go to sign in
          </a>
        </div>
      ) : (
        <form onSubmit={form.handleSubmit((v) => signup.mutate(v))} noValidate className="flex flex-col gap-4">
          <TextField label="Firm name" autoComplete="organization" error={err.firmName?.message} {...form.register('firmName')} />
          <TextField label="Your name" autoComplete="name" error={err.name?.message} {...form.register('name')} />
          <TextField label="E-mail" type="email" autoComplete="email" error={err.email?.message} {...form.register('email')} />
          <TextField label="Password" type="password" autoComplete="new-password" hint="At least 10 characters." error={err.password?.message} {...form.register('password')} />
          <section aria-label="Home area" className="flex flex-col gap-2">
            <h2 className="text-sm font-semibold text-ink">Where the firm works (optional)</h2>
            <p className="text-sm text-slate">A new property’s map opens here. Find a county or town; you can change it later in Settings.</p>
            <HomeAreaPicker
              value={homeArea}
              source="/api/signup/places"
              emptyText="Not set: new maps open on the whole country."
              onChange={(area) => form.setValue('homeArea', area ?? undefined, { shouldDirty: true })}
            />
          </section>
          {signup.error ? (
            <p role="alert" className="text-sm text-clay">
              {signup.error.message}
            </p>
          ) : null}
          <Button type="submit" busy={signup.isPending}>
            Create the firm
          </Button>
          <a href={paths.login} className="text-center text-sm text-moss-deep hover:underline">
            I already have an account
          </a>
        </form>
      )}
    </AuthCard>
  );
}
