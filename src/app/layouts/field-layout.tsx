import { Outlet } from 'react-router-dom';
import { Brand } from '../../components/layouts/brand';
import { UserMenu } from './user-menu';

/** The crew's phone-first shell. */
export function FieldLayout() {
  return (
    <div className="mx-auto flex min-h-screen max-w-xl flex-col">
      <header className="sticky top-0 z-10 flex items-center justify-between border-b border-rule bg-card px-4 py-2">
        <Brand />
        <UserMenu compact />
      </header>
      <main className="flex-1 px-4 py-4">
        <Outlet />
      </main>
    </div>
  );
}
