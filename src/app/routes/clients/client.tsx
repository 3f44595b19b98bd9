import { useState, type ReactNode } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { ClientDto } from '../../../../shared/schemas/client';
import type { PropertyDto } from '../../../../shared/schemas/property';
import { useClient } from '../../../features/clients/api/get-client';
import { EditClientForm } from '../../../features/clients/components/client-form';
import { ClientContacts } from '../../../features/clients/components/client-contacts';
import { useProperties } from '../../../features/properties/api/get-properties';
import { NewPropertyForm } from '../../../features/properties/components/property-form';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { DataTable, type DataColumn } from '../../../components/ui/data-table';
import { PageHeader } from '../../../components/ui/page-header';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { formatAcres, formatNumber } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { MissingRecord } from '../../../components/ui/missing-record';
import { parseId } from '../../../lib/route-params';
import { ClientFiles } from '../../../features/files/components/client-files';
import { PortalUploadsToggle } from '../../../features/clients/components/portal-uploads-toggle';
import { PortalObservationsToggle } from '../../../features/clients/components/portal-observations-toggle';
import { buttonClasses } from '../../../components/ui/button';

const PROPERTY_COLUMNS: DataColumn<PropertyDto>[] = [
  { id: 'name', header: 'Property', value: (p) => p.name },
  { id: 'county', header: 'County', value: (p) => [p.county, p.state].filter(Boolean).join(', '), hideBelow: 'sm', className: 'text-slate' },
  { id: 'acres', header: 'Acres', value: (p) => p.acres, cell: (p) => formatAcres(p.acres), align: 'right', className: 'whitespace-nowrap' },
  { id: 'units', header: 'Units', value: (p) => p.unitCount, align: 'right', hideBelow: 'md' },
  {
    id: 'map',
    header: 'Plan map',
    value: () => null,
    sortable: false,
    searchable: false,
    cell: (p) => (
      <Link to={paths.planMap(p.id)} className="whitespace-nowrap font-semibold text-moss-deep hover:underline" aria-label={`Plan map of ${p.name}`}>
        Plan map
      </Link>
    ),
  },
];

function Detail({ label, children, className = '' }: { label: string; children: ReactNode; className?: string }) {
  return (
    <div className={`min-w-0 ${className}`}>
      <dt className="text-xs uppercase tracking-wide text-slate">{label}</dt>
      <dd className="break-words text-ink">{children}</dd>
    </div>
  );
}

function ClientDetails({ client }: { client: ClientDto }) {
  const [editing, setEditing] = useState(false);
  return (
    <Card
      title="Details"
      action={
        !editing ? (
          <Button variant="secondary" size="sm" onClick={() => setEditing(true)}>
            Edit
          </Button>
        ) : null
      }
    >
      {editing ? (
        <EditClientForm client={client} onDone={() => setEditing(false)} />
      ) : (
        <dl className="grid gap-3 sm:grid-cols-2">
          <Detail label="E-mail">{client.email ? <a className="text-moss-deep hover:underline" href={`mailto:${client.email}`}>{client.email}</a> : <span className="text-slate">Not given</span>}</Detail>
          <Detail label="Phone">{client.phone ?? <span className="text-slate">Not given</span>}</Detail>
          <Detail label="Address">{client.address ? <span className="whitespace-pre-line">{client.address}</span> : <span className="text-slate">Not given</span>}</Detail>
          {client.notes ? (
            <Detail label="Notes" className="sm:col-span-2">
              <span className="whitespace-pre-line">{client.notes}</span>
            </Detail>
          ) : null}
        </dl>
      )}
    </Card>
  );
}

function ClientProperties({ client }: { client: ClientDto }) {
  const properties = useProperties({ clientId: client.id });
  const [adding, setAdding] = useState(false);
  // After "Add property" the consultant lands on the new property's plan map, where its boundary is drawn.
  const navigate = useNavigate();
  return (
    <Card
      title="Properties"
      action={
        !adding ? (
          <Button size="sm" onClick={() => setAdding(true)}>
            New property
          </Button>
        ) : null
      }
    >
      <div className="flex flex-col gap-4">
        {adding ? (
          <div className="rounded border border-rule bg-paper/60 p-3">
            <h3 className="mb-2 text-sm font-bold">New property for {client.name}</h3>
            <NewPropertyForm clientId={client.id} onCreated={(p) => navigate(paths.planMap(p.id))} onCancel={() => setAdding(false)} />
          </div>
        ) : null}
        {properties.isPending ? (
          <Loading label="Loading properties…" />
        ) : properties.isError ? (
          <ErrorPanel error={properties.error} onRetry={() => void properties.refetch()} />
        ) : (
          <DataTable
            data={properties.data}
            columns={PROPERTY_COLUMNS}
            label={`Properties of ${client.name}`}
            noun={['property', 'properties']}
            rowKey={(p) => p.id}
            rowHref={(p) => paths.property(p.id)}
            initialSort={{ id: 'name' }}
            empty={
              <EmptyState title="No properties yet">
                {adding ? 'Fill in the form above; the boundary follows on the plan map.' : 'Add one with “New property”, then draw or import its boundary on the plan map.'}
              </EmptyState>
            }
          />
        )}
      </div>
    </Card>
  );
}

function ClientFilesWithProperties({ clientId }: { clientId: number }) {
  const properties = useProperties({ clientId });
  return <ClientFiles clientId={clientId} properties={(properties.data ?? []).map((p) => ({ id: p.id, name: p.name }))} />;
}

/** One client: details, properties, portal contacts and shared files. */
export function ClientPage() {
  const id = parseId(useParams().id);
  const client = useClient(id ?? 0);
  if (id === null || (client.isError && client.error instanceof ApiError && client.error.status === 404)) {
    return <MissingRecord what="client" backTo={paths.clients} backLabel="All clients" />;
  }
  if (client.isPending) return <Loading label="Loading client…" />;
  if (client.isError) return <ErrorPanel error={client.error} onRetry={() => void client.refetch()} />;
  const c = client.data;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={c.name}
        crumbs={[{ label: 'Clients', to: paths.clients }]}
        actions={
          <Link to={paths.previewClient(c.id)} className={buttonClasses('secondary', '', 'sm')}>
            Preview as client
          </Link>
        }
      >
        <span className="tabular-nums">
          {c.propertyCount > 0 ? (
            <>
              {formatNumber(c.propertyCount)} {c.propertyCount === 1 ? 'property' : 'properties'}
              {' · '}
              {c.totalAcres > 0 ? <span className="figure font-bold text-ink">{formatAcres(c.totalAcres)}</span> : 'no boundary drawn yet'}
              {' · '}
            </>
          ) : null}
          client since {new Date(c.createdAt).toLocaleDateString('en-US', { month: 'long', year: 'numeric' })}
        </span>
      </PageHeader>
      <ClientProperties client={c} />
      <div className="grid items-start gap-4 lg:grid-cols-2">
        <ClientDetails client={c} />
        <Card title="Portal contacts">
          <ClientContacts clientId={c.id} clientName={c.name} />
        </Card>
      </div>
      <Card title="Files" action={<div className="flex flex-col gap-1"><PortalUploadsToggle client={c} /><PortalObservationsToggle client={c} /></div>}>
        <ClientFilesWithProperties clientId={c.id} />
      </Card>
    </div>
  );
}
