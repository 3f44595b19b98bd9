import { Outlet } from 'react-router-dom';
import { Brand } from '../../components/layouts/brand';
import { UserMenu } from './user-menu';
import { PortalNav } from '../../features/portal/components/portal-nav';
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
        <PortalNav extra={[{ to: paths.portalInvoices, label: 'Invoices' }, { to: paths.portalResults, label: 'Results' }]} />
      </header>
      <main className="mx-auto w-full max-w-4xl flex-1 px-4 py-6">
        <Outlet />
      </main>
    </div>
  );
}
