import { NavLink, Outlet } from 'react-router-dom';
import { Brand } from './brand';
import { UserMenu } from './user-menu';
import { paths } from '../../config/paths';

/** The landowner's calm, read-only shell. */
export function PortalLayout() {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-rule bg-card">
        <div className="mx-auto flex max-w-4xl items-center justify-between px-4 py-2">
          <Brand />
          <UserMenu />
        </div>
        <nav aria-label="Portal" className="mx-auto max-w-4xl px-4">
          <ul className="flex gap-4 text-sm">
            <li>
              <NavLink end to={paths.portal} className={({ isActive }) => `inline-block border-b-2 py-2 ${isActive ? 'border-moss font-semibold text-moss-deep' : 'border-transparent text-slate hover:text-ink'}`}>
                Your land
              </NavLink>
            </li>
            <li>
              <NavLink to={paths.portalProposals} className={({ isActive }) => `inline-block border-b-2 py-2 ${isActive ? 'border-moss font-semibold text-moss-deep' : 'border-transparent text-slate hover:text-ink'}`}>
                Proposals
              </NavLink>
            </li>
            <li>
              <NavLink to={paths.portalInvoices} className={({ isActive }) => `inline-block border-b-2 py-2 ${isActive ? 'border-moss font-semibold text-moss-deep' : 'border-transparent text-slate hover:text-ink'}`}>
                Invoices
              </NavLink>
            </li>
            <li>
              <NavLink to={paths.portalResults} className={({ isActive }) => `inline-block border-b-2 py-2 ${isActive ? 'border-moss font-semibold text-moss-deep' : 'border-transparent text-slate hover:text-ink'}`}>
                Results
              </NavLink>
            </li>
          </ul>
        </nav>
      </header>
      <main className="mx-auto w-full max-w-4xl flex-1 px-4 py-6">
        <Outlet />
      </main>
    </div>
  );
}
