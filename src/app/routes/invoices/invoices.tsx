import { lazy, Suspense } from 'react';
import { useSearchParams } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { INVOICE_STATUSES, type InvoiceStatus } from '../../../../shared/domain/invoicing';
import type { InvoiceRowDto } from '../../../../shared/schemas/invoice';
import { useInvoices } from '../../../features/invoices/api/get-invoices';
import { InvoiceStatusChip, INVOICE_STATUS_LABELS } from '../../../features/invoices/components/invoice-status-chip';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { DataTable, type DataColumn } from '../../../components/ui/data-table';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';

// The receivables chart (recharts) loads after the list of invoices.
const ReceivablesPanel = lazy(() => import('../../../features/invoices/components/receivables-panel').then((m) => ({ default: m.ReceivablesPanel })));
import { paths } from '../../../config/paths';
import { formatDay } from '../../../lib/firm-clock';

const KIND = { deposit: 'Deposit', progress: 'Progress', final: 'Final' } as const;

const COLUMNS: DataColumn<InvoiceRowDto>[] = [
  { id: 'number', header: 'Invoice', value: (i) => i.number, className: 'whitespace-nowrap' },
  { id: 'client', header: 'Client', value: (i) => i.clientName },
  { id: 'property', header: 'Property', value: (i) => i.propertyName, hideBelow: 'md' },
  { id: 'kind', header: 'Kind', value: (i) => KIND[i.kind], hideBelow: 'lg' },
  { id: 'status', header: 'Status', value: (i) => INVOICE_STATUS_LABELS[i.status], cell: (i) => <InvoiceStatusChip status={i.status} daysOverdue={i.daysOverdue} /> },
  { id: 'due', header: 'Due', value: (i) => i.dueOn, cell: (i) => (i.dueOn ? formatDay(i.dueOn) : '—'), hideBelow: 'sm', className: 'whitespace-nowrap', searchable: false },
  { id: 'total', header: 'Total', value: (i) => i.totalCents, cell: (i) => formatCents(i.totalCents), align: 'right', hideBelow: 'sm', className: 'whitespace-nowrap' },
  { id: 'balance', header: 'Balance', value: (i) => i.balanceCents, cell: (i) => formatCents(i.balanceCents), align: 'right', className: 'whitespace-nowrap' },
];

const isStatus = (v: string | null): v is InvoiceStatus => v !== null && (INVOICE_STATUSES as readonly string[]).includes(v);

/** The firm's invoices with the receivables panel above them. */
export function InvoicesPage() {
  const [params, setParams] = useSearchParams();
  const raw = params.get('status');
  const status = isStatus(raw) ? raw : undefined;
  const invoices = useInvoices(status ? { status } : {});
  const setStatus = (value: string) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value) next.set('status', value);
        else next.delete('status');
        return next;
      },
      { replace: true },
    );
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Invoices">Deposits, progress and final invoices. Make them from an approved proposal’s page.</PageHeader>
      <Suspense fallback={null}>
        <ReceivablesPanel />
      </Suspense>
      <Card>
        {invoices.isPending ? (
          <Loading label="Loading invoices…" />
        ) : invoices.isError ? (
          <ErrorPanel error={invoices.error} onRetry={() => void invoices.refetch()} />
        ) : (
          <DataTable
            data={invoices.data}
            columns={COLUMNS}
            label="Invoices"
            noun={['invoice', 'invoices']}
            rowKey={(i) => i.id}
            rowHref={(i) => paths.invoice(i.id)}
            searchPlaceholder="Number, client or property…"
            toolbar={
              <SelectField label="Status" value={status ?? ''} onChange={(e) => setStatus(e.target.value)} className="w-44">
                <option value="">All states</option>
                {INVOICE_STATUSES.map((s) => (
                  <option key={s} value={s}>
                    {INVOICE_STATUS_LABELS[s]}
                  </option>
                ))}
              </SelectField>
            }
            empty={
              <EmptyState title={status ? `No ${INVOICE_STATUS_LABELS[status].toLowerCase()} invoices` : 'No invoices yet'}>
                {status ? 'Choose “All states” to see the others.' : 'When a landowner approves a proposal, its deposit invoice is drafted here. Open it and press “Send” to issue it.'}
              </EmptyState>
            }
          />
        )}
      </Card>
    </div>
  );
}
