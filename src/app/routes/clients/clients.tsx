import { useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import type { ClientDto } from '../../../../shared/schemas/client';
import { useClients } from '../../../features/clients/api/get-clients';
import { NewClientForm } from '../../../features/clients/components/client-form';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { DataTable, type DataColumn } from '../../../components/ui/data-table';
import { PageHeader } from '../../../components/ui/page-header';
import { Button } from '../../../components/ui/button';
import { formatAcres } from '../../../lib/format';
import { paths } from '../../../config/paths';

const COLUMNS: DataColumn<ClientDto>[] = [
  { id: 'name', header: 'Name', value: (c) => c.name },
  { id: 'email', header: 'E-mail', value: (c) => c.email, hideBelow: 'md', className: 'break-all text-slate' },
  { id: 'phone', header: 'Phone', value: (c) => c.phone, hideBelow: 'lg', className: 'whitespace-nowrap text-slate' },
  { id: 'properties', header: 'Properties', value: (c) => c.propertyCount, align: 'right', hideBelow: 'sm' },
  { id: 'acres', header: 'Acres', value: (c) => c.totalAcres, cell: (c) => (c.propertyCount ? formatAcres(c.totalAcres) : '—'), align: 'right', className: 'whitespace-nowrap' },
];

/** The firm's clients: a searchable table (the top bar's search lands here with ?q=) and the form for a new one. */
export function ClientsPage() {
  const clients = useClients();
  const navigate = useNavigate();
  const [params, setParams] = useSearchParams();
  const [adding, setAdding] = useState(false);
  const q = params.get('q') ?? '';
  const setQ = (value: string) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value) next.set('q', value);
        else next.delete('q');
        return next;
      },
      { replace: true },
    );

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Clients"
        actions={
          !adding ? (
            <Button onClick={() => setAdding(true)}>
              New client
            </Button>
          ) : null
        }
      >
        The landowners and clubs you plan for. Open one to see their properties and portal contacts.
      </PageHeader>
      {adding ? (
        <Card title="New client">
          <NewClientForm onCreated={(client) => navigate(paths.client(client.id))} onCancel={() => setAdding(false)} />
        </Card>
      ) : null}
      <Card>
        {clients.isPending ? (
          <Loading label="Loading clients…" />
        ) : clients.isError ? (
          <ErrorPanel error={clients.error} onRetry={() => void clients.refetch()} />
        ) : (
          <DataTable
            data={clients.data}
            columns={COLUMNS}
            label="Clients"
            noun={['client', 'clients']}
            rowKey={(c) => c.id}
            rowHref={(c) => paths.client(c.id)}
            search={q}
            onSearchChange={setQ}
            searchPlaceholder="Name or e-mail…"
            initialSort={{ id: 'name' }}
            empty={
              <EmptyState title="No clients yet">
                Add your first client with “New client”, then add their property and draw its boundary on the plan map.
              </EmptyState>
            }
          />
        )}
      </Card>
    </div>
  );
}
