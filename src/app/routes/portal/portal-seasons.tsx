import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useSeasonComparison } from '../../../features/seasons/api/get-season-comparison';
import { SeasonComparisonList } from '../../../features/seasons/components/season-comparison';
import { PageHeader } from '../../../components/ui/page-header';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { MissingRecord } from '../../../components/ui/missing-record';
import { ApiError } from '../../../lib/api-client';
import { parseId } from '../../../lib/route-params';
import { usePortalScope } from '../../../features/portal/api/portal-scope';

/** The landowner's seasons side by side: this season and last, per unit, read-only (also in the consultant's preview as client). */
export function PortalSeasonsPage() {
  const { links } = usePortalScope();
  const id = parseId(useParams().id) ?? 0;
  const [search] = useSearchParams();
  const asked = /^\d{4}$/.test(search.get('season') ?? '') ? Number(search.get('season')) : null;
  const comparison = useSeasonComparison(id, asked);
  if (id === 0 || (comparison.error instanceof ApiError && comparison.error.status === 404)) {
    return <MissingRecord what="property" backTo={links.home} backLabel="Your land" />;
  }
  if (comparison.isPending) return <Loading label="Loading the seasons…" />;
  if (comparison.isError) return <ErrorPanel error={comparison.error} onRetry={() => void comparison.refetch()} />;
  const d = comparison.data;
  const seasonLink = (season: number) => `${links.seasons(id)}?season=${season}`;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title={`${d.previousSeason} and ${d.season}`} crumbs={[{ label: 'Your land', to: links.home }, { label: d.propertyName, to: links.property(id) }]}>
        Each place side by side: how the plantings came up, how hard deer used them, the soil&rsquo;s pH and the work done
      </PageHeader>
      <nav className="flex gap-4 text-sm" aria-label="Other seasons">
        <Link to={seasonLink(d.season - 1)} className="font-semibold text-moss-deep underline">
          ← {d.previousSeason - 1} and {d.previousSeason}
        </Link>
        <Link to={seasonLink(d.season + 1)} className="font-semibold text-moss-deep underline">
          {d.season} and {d.season + 1} →
        </Link>
      </nav>
      <SeasonComparisonList data={d} />
    </div>
  );
}
