import { useEffect, useState, type FormEvent } from 'react';
import { login, getMe } from '../../../features/auth/api/session-requests';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { homeFor, paths } from '../../../config/paths';
import { clearPersistedCache } from '../../../lib/persisted-cache';

/** Only same-site paths are followed after sign-in. */
export const safeNext = (next: string | null) => (next && next.startsWith('/') && !next.startsWith('//') ? next : null);

/** The shared schema (zod), fetched once the person starts typing so the form shows before it has downloaded. */
const loadSchema = () => import('../../../../shared/schemas/auth');

type FieldErrors = Partial<Record<'email' | 'password', string>>;

/**
 * The sign-in page. It is its own small entry (index.html: React and this form — no router, no
 * query cache, no form library, zod only once the person types), so it shows quickly on a slow
 * phone; a successful sign-in opens the app at the person's home (or the page they asked for).
 */
export function LoginPage() {
  const query = new URLSearchParams(window.location.search);
  const next = safeNext(query.get('next'));
  // The confirmation page sends the new owner here with their address filled in.
  const initialEmail = query.get('email') ?? '';
  const [errors, setErrors] = useState<FieldErrors>({});
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    // Already signed in: straight to the home page.
    getMe()
      .then((user) => user && window.location.replace(next ?? homeFor(user.role)))
      .catch(() => undefined);
  }, [next]);

  const submit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    setError(null);
    setBusy(true);
    try {
      const { LoginSchema } = await loadSchema();
      const parsed = LoginSchema.safeParse({ email: String(data.get('email') ?? ''), password: String(data.get('password') ?? '') });
      if (!parsed.success) {
        const found: FieldErrors = {};
        for (const issue of parsed.error.issues) {
          const key = issue.path[0];
          if ((key === 'email' || key === 'password') && !found[key]) found[key] = issue.message;
        }
        setErrors(found);
        setBusy(false);
        return;
      }
      setErrors({});
      const user = await login(parsed.data);
      // Whatever the last person on this browser saw is not this person's.
      await clearPersistedCache();
      window.location.assign(next ?? homeFor(user.role));
    } catch (err) {
      setError((err as Error).message);
      setBusy(false);
    }
  };

  return (
    <AuthCard title="Sign in">
      <form onSubmit={(e) => void submit(e)} onFocus={() => void loadSchema()} noValidate className="flex flex-col gap-4">
        <TextField label="E-mail" name="email" type="email" autoComplete="username" defaultValue={initialEmail} error={errors.email} />
        <TextField label="Password" name="password" type="password" autoComplete="current-password" error={errors.password} />
        {error ? (
          <p role="alert" className="rounded border border-clay/40 bg-clay/5 px-3 py-2 text-sm text-clay">
            {error}
          </p>
        ) : null}
        <Button type="submit" busy={busy}>
          Sign in
        </Button>
        <a href={paths.forgotPassword} className="text-center text-sm text-moss-deep underline-offset-2 hover:underline">
          Forgot password
        </a>
        <a href={paths.signup} className="text-center text-sm text-moss-deep underline-offset-2 hover:underline">
          New here? Set up your firm
        </a>
      </form>
    </AuthCard>
  );
}
