import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

export interface Crumb {
  label: string;
  to: string;
}

/** A page's title with the way back above it and its main actions beside it. */
export function PageHeader({ title, crumbs = [], actions, children }: { title: ReactNode; crumbs?: Crumb[]; actions?: ReactNode; children?: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      {crumbs.length > 0 ? (
        <nav aria-label="Breadcrumb">
          <ol className="flex flex-wrap items-center gap-1 text-sm text-slate">
            {crumbs.map((c) => (
              <li key={c.to} className="flex items-center gap-1">
                <Link to={c.to} className="text-moss-deep hover:underline">
                  {c.label}
                </Link>
                <span aria-hidden>›</span>
              </li>
            ))}
          </ol>
        </nav>
      ) : null}
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <h1 className="break-words text-2xl font-bold">{title}</h1>
          {children ? <div className="mt-1 text-slate">{children}</div> : null}
        </div>
        {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
      </div>
    </div>
  );
}
