import { Link, useParams } from 'react-router-dom';
import { useCheckedUnit, useCreateUnitCheck, useUnitChecks } from '../../../features/checks/api/get-unit-checks';
import { CheckForm } from '../../../features/checks/components/check-form';
import { CheckList } from '../../../features/checks/components/check-list';
import { SoilTestsCard } from '../../../features/checks/components/soil-tests-card';
import { SoilTestForm } from '../../../features/checks/components/soil-test-form';
import { UnitHistoryCard } from '../../../features/checks/components/unit-history-card';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { MissingRecord } from '../../../components/ui/missing-record';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { formatAcres } from '../../../lib/format';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';
import type { CheckKind } from '../../../../shared/schemas/checks';

/** Which checks suit a unit: timber cruises on timber, stand and browse checks on plantings. */
function kindsFor(unitKind: string): CheckKind[] {
  if (unitKind === 'timber' || unitKind === 'bedding-area') return ['timber', 'browse'];
  return ['establishment', 'browse'];
}

/** A unit's page: its checks with their figures, a form for a new one, and the re-seeding a thin or failed stand drafts. */
export function UnitChecksPage() {
  const params = useParams();
  const propertyId = parseId(params.id) ?? 0;
  const unitId = parseId(params.unitId) ?? 0;
  const unit = useCheckedUnit(unitId);
  const checks = useUnitChecks(unitId);
  const create = useCreateUnitCheck();
  const toast = useToast();

  if (unitId === 0 || (unit.isError && unit.error instanceof ApiError && unit.error.status === 404)) {
    return <MissingRecord what="unit" backTo={paths.planMap(propertyId)} backLabel="Back to the plan map" />;
  }
  if (unit.isPending) return <Loading label="Loading the unit…" />;
  if (unit.isError) return <ErrorPanel error={unit.error} onRetry={() => void unit.refetch()} />;
  const u = unit.data;

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={u.name}
        crumbs={[
          { label: 'Properties', to: paths.properties },
          { label: 'Property', to: paths.property(propertyId) },
          { label: 'Plan map', to: paths.planMap(propertyId) },
        ]}
      >
        {u.acres ? `${formatAcres(u.acres)} · ` : ''}checks on this unit
      </PageHeader>
      <div className="grid gap-4 lg:grid-cols-[1fr_26rem]">
        <section aria-labelledby="checks-heading" className="flex flex-col gap-3">
          <h2 id="checks-heading" className="text-lg font-bold">
            Checks
          </h2>
          {checks.isPending ? (
            <Loading />
          ) : checks.isError ? (
            <ErrorPanel error={checks.error} onRetry={() => void checks.refetch()} />
          ) : checks.data.length === 0 ? (
            <EmptyState title="No checks yet">Count a few frames a few weeks after seeding, or set exclusion cages to measure browse.</EmptyState>
          ) : (
            <CheckList checks={checks.data} canDecide />
          )}
          <UnitHistoryCard unitId={unitId} />
        </section>
        <div className="flex flex-col gap-4">
        <Card title="Record a check">
          <CheckForm
            kinds={kindsFor(u.kind)}
            saving={create.isPending}
            onSubmit={async (input) => {
              const saved = await create.mutateAsync({ unitId, input });
              toast('success', 'Check saved.');
              return saved;
            }}
          />
        </Card>
        <SoilTestForm propertyId={propertyId} unitId={unitId} />
        <SoilTestsCard unitId={unitId} />
        <p className="text-sm">
          <Link to={paths.propertySoilTests(propertyId)} className="font-semibold text-moss underline">
            Import a lab’s results file for several units
          </Link>
        </p>
        </div>
      </div>
    </div>
  );
}

/** Route module for React Router's lazy loading. */
export const Component = UnitChecksPage;
