import { Link } from 'react-router-dom';
import { PressureWarnings } from '../../../features/hunting/components/pressure-warnings';
import { paths } from '../../../config/paths';
import { usePortalProperties } from '../../../features/portal/api/get-portal-properties';
import { usePortalScope } from '../../../features/portal/api/portal-scope';
import { ProgressRing } from '../../../features/portal/components/progress-ring';
import { OfflineNotice } from '../../../components/ui/offline-notice';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { buttonClasses } from '../../../components/ui/button';
import { formatAcres } from '../../../lib/format';

/** The landowner's home: each property with its acres, how far the season's work is, and who to reach. */
export function PortalHomePage() {
  const scope = usePortalScope();
  const home = usePortalProperties();
  if (home.isPending) return <Loading label="Loading your land…" />;
  if (home.isError && !home.data) return <ErrorPanel error={home.error} onRetry={() => void home.refetch()} />;
  const h = home.data;
  const total = h.properties.reduce((sum, p) => sum + (p.acres ?? 0), 0);
  return (
    <div className="flex flex-col gap-5">
      <OfflineNotice updatedAt={home.dataUpdatedAt} refreshFailed={home.isRefetchError} />
      {scope.readOnly ? null : <PressureWarnings linkTo={paths.portalPropertyStands} />}
      <div>
        <h1 className="text-2xl font-bold">Your land</h1>
        <p className="text-slate">
          {h.client.name} · planned with {h.firm.name}
        </p>
      </div>
      {h.properties.length === 0 ? (
        <EmptyState title="No property shared with you yet">{h.firm.name} will add your land once it is mapped.</EmptyState>
      ) : (
        <>
          <p className="text-sm text-slate">
            {h.properties.length} {h.properties.length === 1 ? 'property' : 'properties'}, <span className="figure text-ink">{formatAcres(total)}</span> in all.
          </p>
          <ul className="grid gap-4 sm:grid-cols-2">
            {h.properties.map((p) => (
              <li key={p.id}>
                <article aria-labelledby={`property-${p.id}`} className="flex h-full flex-col gap-2 rounded-md border border-rule bg-card p-4">
                  <div className="flex items-start justify-between gap-3">
                    <div className="min-w-0">
                      <h2 id={`property-${p.id}`} className="text-lg font-bold">
                        {p.name}
                      </h2>
                      <p className="figure text-2xl text-moss-deep">{formatAcres(p.acres)}</p>
                      <p className="text-sm text-slate">{[p.county && `${p.county} County`, p.state].filter(Boolean).join(', ')}</p>
                    </div>
                    {p.percentDone !== null ? <ProgressRing percent={p.percentDone} label={`${p.name} this season`} /> : null}
                  </div>
                  {p.objectives ? (
                    <p className="text-sm">
                      <span className="font-semibold">What we are working toward: </span>
                      {p.objectives}
                    </p>
                  ) : null}
                  <p className="text-sm text-slate">{p.unitCount === 0 ? 'The plan is not drawn yet.' : `${p.unitCount} ${p.unitCount === 1 ? 'place' : 'places'} on the plan.`}</p>
                  <div className="mt-auto flex flex-wrap gap-2 pt-1">
                    <Link to={scope.links.property(p.id)} className={buttonClasses('primary', 'flex-1 sm:flex-none')}>
                      See the plan<span className="sr-only"> of {p.name}</span>
                    </Link>
                    <Link to={scope.links.progress(p.id)} className={buttonClasses('secondary', 'flex-1 sm:flex-none')}>
                      Progress<span className="sr-only"> on {p.name}</span>
                    </Link>
                  </div>
                </article>
              </li>
            ))}
          </ul>
        </>
      )}
      <Card title="Your consultant">
        <p className="font-semibold">{h.firm.name}</p>
        <p className="text-sm text-slate">
          {h.firm.phone ? (
            <a className="text-moss-deep underline" href={`tel:${h.firm.phone.replace(/[^0-9+]/g, '')}`}>
              {h.firm.phone}
            </a>
          ) : null}
          {h.firm.phone && h.firm.email ? ' · ' : null}
          {h.firm.email ? (
            <a className="text-moss-deep underline" href={`mailto:${h.firm.email}`}>
              {h.firm.email}
            </a>
          ) : null}
        </p>
      </Card>
    </div>
  );
}
