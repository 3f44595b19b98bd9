import { NavLink } from 'react-router-dom';
import { usePortalScope } from '../api/portal-scope';

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `inline-block whitespace-nowrap border-b-2 py-2 ${isActive ? 'border-moss font-semibold text-moss-deep' : 'border-transparent text-slate hover:text-ink'}`;

/** The portal's places: Your land, Progress, Proposals, Files (links stay inside the scope: own portal or preview). */
export function PortalNav({ extra = [] }: { extra?: { to: string; label: string }[] }) {
  const { links } = usePortalScope();
  const items = [
    { to: links.home, label: 'Your land', end: true },
    { to: links.progressHome, label: 'Progress', end: false },
    { to: links.proposals, label: 'Proposals', end: false },
    ...extra.map((e) => ({ ...e, end: false })),
    { to: links.files, label: 'Files', end: false },
  ];
  return (
    <nav aria-label="Portal" className="mx-auto max-w-4xl px-4">
      <ul className="flex gap-4 overflow-x-auto text-sm">
        {items.map((i) => (
          <li key={i.to}>
            <NavLink end={i.end} to={i.to} className={linkClass}>
              {i.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
