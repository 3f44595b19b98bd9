import { useEffect, useRef } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useVerifyEmail } from '../../../features/auth/api/signup';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { Loading } from '../../../components/ui/card';
import { paths } from '../../../config/paths';

/** Opens the confirmation link once, then offers sign-in. */
export function VerifyEmailPage() {
  const { token = '' } = useParams();
  const verify = useVerifyEmail();
  const sent = useRef(false);
  useEffect(() => {
    if (sent.current) return;
    sent.current = true;
    verify.mutate(token);
  }, [token, verify]);
  return (
    <AuthCard title="Confirm your e-mail">
      {verify.isSuccess ? (
        <div className="flex flex-col gap-4 text-sm">
          <p role="status">{verify.data.data.message}</p>
          <a href={`${paths.login}?email=${encodeURIComponent(verify.data.data.email)}`} className="text-moss-deep underline">
            Sign in
          </a>
        </div>
      ) : verify.isError ? (
        <div className="flex flex-col gap-4 text-sm">
          <p role="alert" className="text-clay">
            {verify.error.message}
          </p>
          <Link to={paths.signup} className="text-moss-deep underline">
            Sign up again
          </Link>
        </div>
      ) : (
        <Loading />
      )}
    </AuthCard>
  );
}
