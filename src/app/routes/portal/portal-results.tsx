import { Link, useParams } from 'react-router-dom';
import { usePortalHome } from '../../../features/portal/api/get-portal-home';
import { useResults } from '../../../features/results/api/get-results';
import { SurveyEstimatesCard } from '../../../features/results/components/survey-estimates-card';
import { HarvestTable } from '../../../features/results/components/harvest-table';
import { AgeStructureChart, BuckDoeTrendChart } from '../../../features/results/components/lazy-results-charts';
import { SurveyTrendCard } from '../../../features/results/components/survey-trend-card';
import { PortalSeasonReports } from '../../../features/results/components/season-reports-card';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { MissingRecord } from '../../../components/ui/missing-record';
import { buttonClasses } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { formatAcres } from '../../../lib/format';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';
import { PortalBuckPhotos } from '../../../features/cameras/components/portal-buck-photos';
import { PortalObservations } from '../../../features/observations/components/portal-observations';
import { usePortalProperty } from '../../../features/portal/api/get-portal-property';
import { usePortalProperties } from '../../../features/portal/api/get-portal-properties';
import { useMe } from '../../../features/auth/api/get-me';
import type { MultiPolygon, Polygon } from 'geojson';

/** The observation map on the client's Results; "Log sign" when the consultant turned it on for this client. */
function PortalResultsObservations({ propertyId, propertyName }: { propertyId: number; propertyName: string }) {
  const home = usePortalProperties();
  const me = useMe();
  const detail = usePortalProperty(propertyId);
  const canLog = me.data?.role === 'client' && Boolean(home.data?.client.portalObservationsAllowed);
  return <PortalObservations propertyId={propertyId} propertyName={propertyName} boundary={(detail.data?.property.boundary ?? null) as Polygon | MultiPolygon | null} logAs={canLog ? me.data?.id : null} />;
}

/** The landowner's choice of property for results (one property goes straight to its results). */
export function PortalResultsPage() {
  const home = usePortalHome();
  if (home.isPending) return <Loading />;
  if (home.isError) return <ErrorPanel error={home.error} />;
  const properties = home.data.properties;
  return (
    <div className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Results</h1>
        <p className="text-slate">Camera surveys, the harvest and season reports for your land.</p>
      </div>
      {properties.length === 0 ? (
        <EmptyState title="No property shared with you yet">{home.data.firm.name} will add your land once it is mapped.</EmptyState>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2">
          {properties.map((p) => (
            <li key={p.id}>
              <Card>
                <h2 className="text-lg font-bold">{p.name}</h2>
                <p className="text-sm text-slate">{formatAcres(p.acres)}</p>
                <Link to={paths.portalPropertyResults(p.id)} className={buttonClasses('primary', 'mt-3')}>
                  See the results<span className="sr-only"> for {p.name}</span>
                </Link>
              </Card>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

/** One property's results for the landowner, read-only. */
export function PortalPropertyResultsPage() {
  const id = parseId(useParams().id) ?? 0;
  const results = useResults(id);
  if (id === 0 || (results.isError && results.error instanceof ApiError && results.error.status === 404)) {
    return <MissingRecord what="property" backTo={paths.portalResults} backLabel="All results" />;
  }
  if (results.isPending) return <Loading label="Loading results…" />;
  if (results.isError) return <ErrorPanel error={results.error} onRetry={() => void results.refetch()} />;
  const r = results.data;
  const [latest] = r.surveys;
  return (
    <div className="flex flex-col gap-5">
      <div>
        <p className="text-sm">
          <Link to={paths.portalResults} className="text-moss-deep underline">
            Results
          </Link>
        </p>
        <h1 className="text-2xl font-bold">{r.property.name}</h1>
        <p className="text-slate">What the deer have been doing, season by season.</p>
      </div>
      <PortalSeasonReports reports={r.reports} />
      <section aria-labelledby="portal-surveys" className="flex flex-col gap-3">
        <h2 id="portal-surveys" className="text-lg font-bold">
          Camera surveys
        </h2>
        {latest ? <SurveyEstimatesCard survey={latest} cautions={r.cautions} /> : <EmptyState title="No camera survey yet">Your consultant adds each survey’s figures here.</EmptyState>}
        <PortalBuckPhotos propertyId={id} />
        <SurveyTrendCard trend={r.surveyTrend} />
      </section>
      <PortalResultsObservations propertyId={r.property.id} propertyName={r.property.name} />
      <section aria-labelledby="portal-harvest" className="flex flex-col gap-3">
        <h2 id="portal-harvest" className="text-lg font-bold">
          Harvest
        </h2>
        <Card>
          <div className="grid gap-6 md:grid-cols-2">
            <AgeStructureChart summary={r.harvestSummary} />
            <BuckDoeTrendChart seasons={r.harvestSummary.seasons} />
          </div>
        </Card>
        <Card title={`Deer taken (${r.harvests.length})`}>
          <HarvestTable harvests={r.harvests} />
        </Card>
      </section>
      <p>
        <Link to={paths.portal} className={buttonClasses('secondary')}>
          Back to your land
        </Link>
      </p>
    </div>
  );
}
