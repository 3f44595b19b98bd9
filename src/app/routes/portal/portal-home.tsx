import { usePortalHome } from '../../../features/portal/api/get-portal-home';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { formatAcres } from '../../../lib/format';

/** The landowner's home: their land and who to reach. */
export function PortalHomePage() {
  const home = usePortalHome();
  if (home.isPending) return <Loading />;
  if (home.isError) return <ErrorPanel error={home.error} />;
  const h = home.data;
  const total = h.properties.reduce((sum, p) => sum + (p.acres ?? 0), 0);
  return (
    <div className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Your land</h1>
        <p className="text-slate">{h.client.name} · planned with {h.firm.name}</p>
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
                <Card>
                  <h2 className="text-lg font-bold">{p.name}</h2>
                  <p className="figure text-2xl text-moss-deep">{formatAcres(p.acres)}</p>
                  <p className="text-sm text-slate">{[p.county && `${p.county} County`, p.state].filter(Boolean).join(', ')}</p>
                  {p.objectives ? <p className="mt-2 text-sm"><span className="font-semibold">What we are working toward: </span>{p.objectives}</p> : null}
                </Card>
              </li>
            ))}
          </ul>
        </>
      )}
      <Card title="Your consultant">
        <p className="font-semibold">{h.firm.name}</p>
        <p className="text-sm text-slate">
          {h.firm.phone ? <a className="text-moss-deep underline" href={`tel:${h.firm.phone.replace(/[^0-9+]/g, '')}`}>{h.firm.phone}</a> : null}
          {h.firm.phone && h.firm.email ? ' · ' : null}
          {h.firm.email ? <a className="text-moss-deep underline" href={`mailto:${h.firm.email}`}>{h.firm.email}</a> : null}
        </p>
      </Card>
    </div>
  );
}
