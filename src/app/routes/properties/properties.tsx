import { useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import type { PropertyDto } from '../../../../shared/schemas/property';
import type { ClientDto } from '../../../../shared/schemas/client';
import { NewPropertyForm } from '../../../features/properties/components/property-form';
import { useProperties } from '../../../features/properties/api/get-properties';
import { useClients } from '../../../features/clients/api/get-clients';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { DataTable, type DataColumn } from '../../../components/ui/data-table';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';
import { Button } from '../../../components/ui/button';
import { formatAcres, formatDate } from '../../../lib/format';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';

const COLUMNS: DataColumn<PropertyDto>[] = [
  { id: 'name', header: 'Property', value: (p) => p.name },
  {
    id: 'client',
    header: 'Client',
    value: (p) => p.clientName,
    hideBelow: 'sm',
    cell: (p) => (
      <Link to={paths.client(p.clientId)} className="text-ink hover:text-moss-deep hover:underline">
        {p.clientName}
      </Link>
    ),
  },
  { id: 'place', header: 'County / state', value: (p) => [p.county, p.state].filter(Boolean).join(', '), hideBelow: 'md', className: 'text-slate' },
  { id: 'acres', header: 'Acres', value: (p) => p.acres, cell: (p) => formatAcres(p.acres), align: 'right', className: 'whitespace-nowrap' },
  { id: 'units', header: 'Units', value: (p) => p.unitCount, align: 'right', hideBelow: 'lg' },
  { id: 'updated', header: 'Updated', value: (p) => p.updatedAt, cell: (p) => formatDate(p.updatedAt), searchable: false, hideBelow: 'lg', className: 'whitespace-nowrap text-slate' },
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

/** A new property: first the client it belongs to, then its details. */
function NewPropertyFlow({ clients, initialClientId, onCreated, onCancel }: { clients: readonly ClientDto[]; initialClientId?: number; onCreated: (p: PropertyDto) => void; onCancel: () => void }) {
  const [clientId, setClientId] = useState<number | undefined>(initialClientId);
  return (
    <div className="flex flex-col gap-3">
      <SelectField label="Client" className="sm:max-w-sm" value={clientId ?? ''} onChange={(e) => setClientId(parseId(e.target.value) ?? undefined)}>
        <option value="">Choose the client who owns it…</option>
        {clients.map((c) => (
          <option key={c.id} value={c.id}>
            {c.name}
          </option>
        ))}
      </SelectField>
      {clientId ? (
        <NewPropertyForm key={clientId} clientId={clientId} onCreated={onCreated} onCancel={onCancel} />
      ) : (
        <div className="flex flex-wrap items-center gap-3">
          <p className="text-sm text-slate">
            Every property belongs to a client. Not listed? Add them on <Link className="font-semibold text-moss-deep underline" to={paths.clients}>Clients</Link> first.
          </p>
          <Button type="button" variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        </div>
      )}
    </div>
  );
}

/** All properties of the firm, with a client filter; each leads to its page and its plan map. */
export function PropertiesPage() {
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);
  const clientId = parseId(params.get('client') ?? undefined) ?? undefined;
  const q = params.get('q') ?? '';
  const properties = useProperties({ clientId });
  const clients = useClients();
  const setParam = (name: string, value: string) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value) next.set(name, value);
        else next.delete(name);
        return next;
      },
      { replace: true },
    );
  const clientName = clients.data?.find((c) => c.id === clientId)?.name;

  const clientFilter = (
    <SelectField label="Client" className="w-full sm:w-64" value={clientId ?? ''} onChange={(e) => setParam('client', e.target.value)} disabled={clients.isPending}>
      <option value="">All clients</option>
      {(clients.data ?? []).map((c) => (
        <option key={c.id} value={c.id}>
          {c.name}
        </option>
      ))}
    </SelectField>
  );

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Properties"
        actions={!adding ? <Button onClick={() => setAdding(true)}>New property</Button> : null}
      >
        Every property of the firm. Open one to edit it, or go straight to its plan map.
      </PageHeader>
      {adding ? (
        <Card title="New property">
          <NewPropertyFlow
            clients={clients.data ?? []}
            initialClientId={clientId}
            onCreated={(p) => navigate(paths.planMap(p.id))}
            onCancel={() => setAdding(false)}
          />
        </Card>
      ) : null}
      <Card>
        {properties.isPending ? (
          <Loading label="Loading properties…" />
        ) : properties.isError ? (
          <ErrorPanel error={properties.error} onRetry={() => void properties.refetch()} />
        ) : (
          <div className={properties.isPlaceholderData ? 'opacity-60 transition-opacity' : undefined} aria-busy={properties.isPlaceholderData || undefined}>
            <DataTable
              key={clientId ?? 'all'}
              data={properties.data}
              columns={COLUMNS}
              label={clientName ? `Properties of ${clientName}` : 'Properties'}
              noun={['property', 'properties']}
              rowKey={(p) => p.id}
              rowHref={(p) => paths.property(p.id)}
              search={q}
              onSearchChange={(v) => setParam('q', v)}
              searchPlaceholder="Property, client or county…"
              toolbar={clientFilter}
              initialSort={{ id: 'name' }}
              empty={
                <div className="flex flex-col gap-3">
                  {clientFilter}
                  <EmptyState title={clientId ? `${clientName ?? 'This client'} has no properties yet` : 'No properties yet'}>
                    {clientId ? 'Add one with “New property”, or choose “All clients”.' : 'Add the first with “New property”; then draw or import its boundary on the plan map.'}
                  </EmptyState>
                </div>
              }
            />
          </div>
        )}
      </Card>
    </div>
  );
}
