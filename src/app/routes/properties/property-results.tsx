import { useState } from 'react';
import { useParams } from 'react-router-dom';
import type { HarvestDto, SurveyDto } from '../../../../shared/schemas/results';
import { useResults } from '../../../features/results/api/get-results';
import { useDeleteSurvey } from '../../../features/results/api/delete-survey';
import { useDeleteHarvest } from '../../../features/results/api/delete-harvest';
import { SurveyForm } from '../../../features/results/components/survey-form';
import { HarvestForm } from '../../../features/results/components/harvest-form';
import { HarvestTable } from '../../../features/results/components/harvest-table';
import { SurveyEstimatesCard } from '../../../features/results/components/survey-estimates-card';
import { AgeStructureChart, BuckDoeTrendChart } from '../../../features/results/components/lazy-results-charts';
import { SurveyTrendCard } from '../../../features/results/components/survey-trend-card';
import { SeasonReportsCard } from '../../../features/results/components/season-reports-card';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { MissingRecord } from '../../../components/ui/missing-record';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { formatAcres } from '../../../lib/format';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';
import { formatDay } from '../../../lib/firm-clock';

/** A property's results: camera surveys with estimates and charts, harvest records, and the season report. */
export function PropertyResultsPage() {
  const id = parseId(useParams().id) ?? 0;
  const results = useResults(id);
  const removeSurvey = useDeleteSurvey(id);
  const removeHarvest = useDeleteHarvest(id);
  const toast = useToast();
  const [surveyFormOpen, setSurveyFormOpen] = useState(false);
  const [harvestFormOpen, setHarvestFormOpen] = useState(false);
  const [deletingSurvey, setDeletingSurvey] = useState<SurveyDto | null>(null);
  const [deletingHarvest, setDeletingHarvest] = useState<HarvestDto | null>(null);

  if (id === 0 || (results.isError && results.error instanceof ApiError && results.error.status === 404)) {
    return <MissingRecord what="property" backTo={paths.properties} backLabel="All properties" />;
  }
  if (results.isPending) return <Loading label="Loading results…" />;
  if (results.isError) return <ErrorPanel error={results.error} onRetry={() => void results.refetch()} />;
  const r = results.data;
  const [latest, ...older] = r.surveys;
  const seasons = [...new Set([...r.surveys.map((s) => s.season), ...r.harvests.map((h) => h.season)])];

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={`Results — ${r.property.name}`}
        crumbs={[
          { label: 'Properties', to: paths.properties },
          { label: r.property.name, to: paths.property(r.property.id) },
        ]}
        actions={
          <>
            <Button onClick={() => setSurveyFormOpen((o) => !o)} aria-expanded={surveyFormOpen}>
              {surveyFormOpen ? 'Close the survey form' : 'Record a camera survey'}
            </Button>
            <Button variant="secondary" onClick={() => setHarvestFormOpen((o) => !o)} aria-expanded={harvestFormOpen}>
              {harvestFormOpen ? 'Close the harvest form' : 'Record a harvest'}
            </Button>
          </>
        }
      >
        {r.property.acres ? `${formatAcres(r.property.acres)} · ` : ''}camera surveys, harvest and the season report
      </PageHeader>

      {surveyFormOpen ? (
        <Card title="New camera survey">
          <SurveyForm propertyId={id} cameraSites={r.cameraSites} onSaved={() => setSurveyFormOpen(false)} />
        </Card>
      ) : null}

      <section aria-labelledby="surveys-heading" className="flex flex-col gap-3">
        <h2 id="surveys-heading" className="text-lg font-bold">
          Camera surveys
        </h2>
        {latest ? (
          <SurveyEstimatesCard
            survey={latest}
            cautions={r.cautions}
            action={
              <Button variant="ghost" size="sm" onClick={() => setDeletingSurvey(latest)}>
                Delete
              </Button>
            }
          />
        ) : (
          <EmptyState title="No camera survey yet">Record one with “Record a camera survey”: the tallies give the herd estimates.</EmptyState>
        )}
        <SurveyTrendCard trend={r.surveyTrend} />
        {older.length > 0 ? (
          <details className="rounded-md border border-rule bg-card p-3">
            <summary className="cursor-pointer font-semibold">Earlier surveys ({older.length})</summary>
            <div className="mt-3 flex flex-col gap-3">
              {older.map((s) => (
                <SurveyEstimatesCard
                  key={s.id}
                  survey={s}
                  cautions={[]}
                  action={
                    <Button variant="ghost" size="sm" onClick={() => setDeletingSurvey(s)}>
                      Delete
                    </Button>
                  }
                />
              ))}
            </div>
          </details>
        ) : null}
      </section>

      <section aria-labelledby="harvest-heading" className="flex flex-col gap-3">
        <h2 id="harvest-heading" className="text-lg font-bold">
          Harvest
        </h2>
        {harvestFormOpen ? (
          <Card title="New harvest record">
            <HarvestForm propertyId={id} units={r.units} onSaved={() => setHarvestFormOpen(false)} />
          </Card>
        ) : null}
        <Card>
          <div className="grid gap-6 md:grid-cols-2">
            <AgeStructureChart summary={r.harvestSummary} />
            <BuckDoeTrendChart seasons={r.harvestSummary.seasons} />
          </div>
        </Card>
        <Card title={`Harvest records (${r.harvests.length})`}>
          <HarvestTable harvests={r.harvests} onDelete={setDeletingHarvest} busyId={removeHarvest.isPending ? (removeHarvest.variables ?? null) : null} />
        </Card>
      </section>

      <SeasonReportsCard propertyId={id} reports={r.reports} seasons={seasons} />

      <ConfirmDialog
        open={deletingSurvey !== null}
        title={`Delete ${deletingSurvey?.name ?? 'the survey'}?`}
        confirmLabel="Delete survey"
        destructive
        busy={removeSurvey.isPending}
        onConfirm={() =>
          deletingSurvey &&
          removeSurvey.mutate(deletingSurvey.id, {
            onSuccess: () => {
              toast('success', `${deletingSurvey.name} deleted.`);
              setDeletingSurvey(null);
            },
            onError: (e) => toast('error', `The survey was not deleted: ${e.message}`),
          })
        }
        onCancel={() => setDeletingSurvey(null)}
      >
        <p>Its tallies and estimates go with it; season reports already made keep their figures.</p>
      </ConfirmDialog>
      <ConfirmDialog
        open={deletingHarvest !== null}
        title="Delete this harvest record?"
        confirmLabel="Delete record"
        destructive
        busy={removeHarvest.isPending}
        onConfirm={() =>
          deletingHarvest &&
          removeHarvest.mutate(deletingHarvest.id, {
            onSuccess: () => {
              toast('success', 'Harvest record deleted.');
              setDeletingHarvest(null);
            },
            onError: (e) => toast('error', `The record was not deleted: ${e.message}`),
          })
        }
        onCancel={() => setDeletingHarvest(null)}
      >
        <p>The deer taken on {deletingHarvest ? formatDay(deletingHarvest.date) : ''} leaves the charts.</p>
      </ConfirmDialog>
    </div>
  );
}
