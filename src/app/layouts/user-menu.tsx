import { Link } from 'react-router-dom';
import { paths } from '../../config/paths';
import { useLogout } from '../../features/auth/api/login';
import { useMe } from '../../features/auth/api/get-me';

const ROLE_LABEL: Record<string, string> = { owner: 'Owner', consultant: 'Consultant', crew: 'Crew', client: 'Landowner' };

/** The signed-in person, a link to change the password, and a sign-out button. */
export function UserMenu({ compact = false }: { compact?: boolean }) {
  const me = useMe();
  const logout = useLogout();
  if (!me.data) return null;
  return (
    <div className="flex items-center gap-3 text-sm">
      {!compact ? (
        <span className="hidden text-right leading-tight sm:block">
          <span className="block font-semibold text-ink">{me.data.name}</span>
          <span className="block text-xs text-slate">{ROLE_LABEL[me.data.role]}</span>
        </span>
      ) : null}
      <Link to={paths.changePassword} className="text-slate underline-offset-2 hover:text-moss-deep hover:underline">
        Password
      </Link>
      <button
        className="rounded border border-rule px-3 py-1.5 text-slate hover:border-moss hover:text-moss-deep"
        onClick={() => logout.mutate()}
      >
        Sign out
      </button>
    </div>
  );
}
