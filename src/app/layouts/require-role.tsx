import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { homeFor, paths } from '../../config/paths';
import { ErrorPanel, Loading } from '../../components/ui/card';
import type { Role } from '../../../shared/schemas/auth';

/** Renders its children for the given roles; others go to sign-in or to their own home. */
export function RequireRole({ roles, children }: { roles: readonly Role[]; children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Loading />;
  if (me.isError) return <div className="p-6"><ErrorPanel error={me.error} /></div>;
  if (!me.data) return <Navigate to={`${paths.login}?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  if (!roles.includes(me.data.role)) return <Navigate to={homeFor(me.data.role)} replace />;
  return <>{children}</>;
}
