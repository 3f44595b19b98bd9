import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { PropertyDto } from '../../../../shared/schemas/property';
import { useProperty } from '../../../features/properties/api/get-property';
import { useDeleteProperty } from '../../../features/properties/api/delete-property';
import { EditPropertyForm, regionLabel } from '../../../features/properties/components/property-form';
import { BoundaryPreview } from '../../../features/properties/components/boundary-preview';
import { PropertyProposalsCard } from '../../../features/proposals/components/property-proposals-card';
import { ProgressCard } from '../../../features/schedule/components/progress-card';
import { ObservationsCard } from '../../../features/observations/components/observations-card';
import { useMe } from '../../../features/auth/api/get-me';
import { useClients } from '../../../features/clients/api/get-clients';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { Button, buttonClasses } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { MissingRecord } from '../../../components/ui/missing-record';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { formatAcres, formatDate, formatFeet, formatHectares, formatNumber } from '../../../lib/format';
import { firmUnits } from '../../../lib/firm-units';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';

/** Field observations of the property, logged under the signed-in person. */
function PropertyObservations({ property }: { property: PropertyDto }) {
  const me = useMe();
  if (!me.data) return null;
  return <ObservationsCard userId={me.data.id} propertyId={property.id} propertyName={property.name} boundary={property.boundary} />;
}

function Figure({ label, value, big = false }: { label: string; value: string; big?: boolean }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs uppercase tracking-wide text-slate">{label}</dt>
      <dd className={`tabular-nums text-ink ${big ? 'figure text-2xl font-bold' : 'font-semibold'}`}>{value}</dd>
    </div>
  );
}

function BoundaryCard({ property }: { property: PropertyDto }) {
  const hasBoundary = property.boundary !== null;
  return (
    <Card title="Boundary">
      <div className="flex flex-col gap-3">
        <BoundaryPreview boundary={property.boundary} label={`Outline of ${property.name}, ${formatAcres(property.acres)}, north up`} />
        {hasBoundary ? (
          <dl className="grid grid-cols-2 gap-3">
            <Figure label="Area" value={formatAcres(property.acres)} big />
            {firmUnits().areaUnit === 'acres' ? <Figure label="Hectares" value={formatHectares(property.hectares)} /> : null}
            <Figure label="Perimeter" value={formatFeet(property.perimeterFt)} />
            <Figure label="Plan units" value={formatNumber(property.unitCount)} />
          </dl>
        ) : (
          <p className="text-sm text-slate">
            Draw the boundary on the plan map, or import it there from a GeoJSON, KML, GPX or zipped shapefile; the acres are measured from it.
          </p>
        )}
        <Link to={paths.planMap(property.id)} className={buttonClasses(hasBoundary ? 'secondary' : 'primary', 'self-start')}>
          {hasBoundary ? 'Edit on the plan map' : 'Draw or import the boundary'}
        </Link>
      </div>
    </Card>
  );
}

/** Where to go after deleting: back where the person came from, or the properties list. */
function useGoBack() {
  const navigate = useNavigate();
  return () => {
    const idx = (window.history.state as { idx?: number } | null)?.idx ?? 0;
    if (idx > 0) navigate(-1);
    else navigate(paths.properties, { replace: true });
  };
}

/** One property: its boundary at a glance, its details to edit, the way to its plan map, and deletion. */
export function PropertyPage() {
  const id = parseId(useParams().id);
  const property = useProperty(id ?? 0);
  const clients = useClients();
  const remove = useDeleteProperty();
  const toast = useToast();
  const goBack = useGoBack();
  const [confirming, setConfirming] = useState(false);

  if (id === null || (property.isError && property.error instanceof ApiError && property.error.status === 404)) {
    return <MissingRecord what="property" backTo={paths.properties} backLabel="All properties" />;
  }
  if (property.isPending) return <Loading label="Loading property…" />;
  if (property.isError) return <ErrorPanel error={property.error} onRetry={() => void property.refetch()} />;
  const p = property.data;

  const confirmDelete = () =>
    remove.mutate(p.id, {
      onSuccess: () => {
        setConfirming(false);
        toast('success', `${p.name} deleted.`);
        goBack();
      },
      onError: (e) => toast('error', `${p.name} was not deleted: ${e.message}`),
    });

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={p.name}
        crumbs={[
          { label: 'Properties', to: paths.properties },
          { label: p.clientName, to: paths.client(p.clientId) },
        ]}
        actions={
          <>
            <Link to={paths.planMap(p.id)} className={buttonClasses('primary')}>
              Open plan map
            </Link>
            <Link to={paths.propertyPrescriptions(p.id)} className={buttonClasses('secondary')}>
              Prescriptions
            </Link>
            <Link to={paths.propertyResults(p.id)} className={buttonClasses('secondary')}>
              Results
            </Link>
            <Link to={paths.propertyCameras(p.id)} className={buttonClasses('secondary')}>
              Cameras
            </Link>
            <Link to={paths.propertyStands(p.id)} className={buttonClasses('secondary')}>Stands &amp; wind</Link>
            <Link to={paths.propertySoilTests(p.id)} className={buttonClasses('secondary')}>
              Soil tests
            </Link>
            <Link to={`${paths.sprayRecords}?propertyId=${p.id}`} className={buttonClasses('secondary')}>
              Spray records
            </Link>
            <Button variant="danger-outline" onClick={() => setConfirming(true)}>
              Delete property
            </Button>
          </>
        }
      >
        {[p.county && `${p.county} County`, p.state, p.region && `${regionLabel(p.region)} region`].filter(Boolean).join(' · ') || 'Place not given yet'}
        <span className="block text-sm">Updated {formatDate(p.updatedAt)}</span>
      </PageHeader>

      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <BoundaryCard property={p} />
        <Card title="Details">
          {clients.isPending ? (
            <Loading label="Loading the form…" />
          ) : (
            <EditPropertyForm key={p.id} property={p} clients={clients.data ?? []} />
          )}
        </Card>
      </div>

      <PropertyProposalsCard propertyId={p.id} propertyName={p.name} />

      <ProgressCard propertyId={p.id} />

      <PropertyObservations property={p} />

      <ConfirmDialog
        open={confirming}
        title={`Delete ${p.name}?`}
        confirmLabel="Delete property"
        destructive
        busy={remove.isPending}
        onConfirm={confirmDelete}
        onCancel={() => setConfirming(false)}
      >
        <p>
          The boundary{p.unitCount > 0 ? ` and its ${formatNumber(p.unitCount)} plan ${p.unitCount === 1 ? 'unit' : 'units'}` : ''} go with it. This cannot be undone.
        </p>
        <p className="mt-2 text-slate">To keep a copy, export the plan from the plan map first.</p>
      </ConfirmDialog>
    </div>
  );
}
