import { NavLink, Outlet, useMatches } from 'react-router-dom';
import { Brand } from '../../components/layouts/brand';
import { HeaderSearch } from '../../features/search/components/header-search';
import { UserMenu } from './user-menu';
import { useMe } from '../../features/auth/api/get-me';
import { paths } from '../../config/paths';

const PLACES = [
  { to: paths.desk, label: 'Desk' },
  { to: paths.clients, label: 'Clients' },
  { to: paths.properties, label: 'Properties' },
  { to: paths.schedule, label: 'Schedule' },
  { to: paths.sprayRecords, label: 'Spray records' },
  { to: paths.proposals, label: 'Proposals' },
  { to: paths.invoices, label: 'Invoices' },
  { to: paths.library, label: 'Library' },
  { to: paths.team, label: 'Settings' },
];

/** The consultant's shell: a slim top bar with the header search, and a left column of places. */
export function ConsultantLayout() {
  const me = useMe();
  // A page whose route has `handle: { fullBleed: true }` (the plan map) fills the content area edge to edge.
  const fullBleed = useMatches().some((m) => (m.handle as { fullBleed?: boolean } | undefined)?.fullBleed);
  return (
    <div className={`flex flex-col ${fullBleed ? 'h-screen' : 'min-h-screen'}`}>
      <header className="flex items-center gap-4 border-b border-rule bg-card px-4 py-2">
        <Brand />
        <span className="hidden border-l border-rule pl-4 text-sm text-slate md:inline">{me.data?.firmName}</span>
        <HeaderSearch />
        <UserMenu />
      </header>
      <div className={`flex flex-1 flex-col md:flex-row ${fullBleed ? 'min-h-0' : ''}`}>
        <nav aria-label="Places" className="shrink-0 border-b border-rule bg-paper px-2 py-2 md:w-44 md:border-r md:border-b-0 md:py-4">
          <ul className="flex gap-1 overflow-x-auto md:flex-col">
            {PLACES.map((p) => (
              <li key={p.to}>
                <NavLink
                  to={p.to}
                  className={({ isActive }) =>
                    `block whitespace-nowrap rounded px-3 py-2 text-sm ${isActive ? 'bg-moss/10 font-semibold text-moss-deep' : 'text-ink hover:bg-rule/40'}`
                  }
                >
                  {p.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <main className={fullBleed ? 'flex min-h-0 min-w-0 flex-1 flex-col' : 'min-w-0 flex-1 px-4 py-4 sm:px-6 sm:py-6'}>
          <Outlet />
        </main>
      </div>
    </div>
  );
}
