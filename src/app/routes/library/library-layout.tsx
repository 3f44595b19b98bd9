import { NavLink, Outlet } from 'react-router-dom';
import { paths } from '../../../config/paths';

const TABS = [
  { to: paths.libraryPractices, label: 'Practices' },
  { to: paths.libraryMaterials, label: 'Materials' },
  { to: paths.libraryRates, label: 'Rates' },
];

/** The practice library: practices, materials and rates, one tab each. */
export function LibraryLayout() {
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">Practice library</h1>
        <p className="text-slate">The practices, materials and rates every prescription is priced from.</p>
      </div>
      <nav aria-label="Library" className="flex gap-1 border-b border-rule">
        {TABS.map((t) => (
          <NavLink
            key={t.to}
            to={t.to}
            className={({ isActive }) =>
              `-mb-px rounded-t border px-4 py-2 text-sm ${isActive ? 'border-rule border-b-card bg-card font-semibold text-moss-deep' : 'border-transparent text-slate hover:text-ink'}`
            }
          >
            {t.label}
          </NavLink>
        ))}
      </nav>
      <Outlet />
    </div>
  );
}
