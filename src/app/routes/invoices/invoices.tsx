import { lazy, Suspense, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { INVOICE_STATUSES, type InvoiceStatus } from '../../../../shared/domain/invoicing';
import { INVOICE_PAGE, type InvoiceListSummaryDto, type InvoiceRowDto } from '../../../../shared/schemas/invoice';
import { LIST_PAGE } from '../../../../shared/schemas/common';
import { useInvoicePage } from '../../../features/invoices/api/get-invoices';
import { InvoiceStatusChip, INVOICE_STATUS_LABELS } from '../../../features/invoices/components/invoice-status-chip';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { DataTable, type DataColumn } from '../../../components/ui/data-table';
import { PageHeader } from '../../../components/ui/page-header';
import { StatusFilter } from '../../../components/ui/status-filter';

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
  // The list is paged (the 50 newest): "Show more" asks for a longer page; a new filter starts again at one page.
  const [more, setMore] = useState<{ status: InvoiceStatus | undefined; pages: number }>({ status, pages: 1 });
  const pages = more.status === status ? more.pages : 1;
  const limit = Math.min(LIST_PAGE.maxLimit, pages * INVOICE_PAGE.defaultLimit);
  const invoices = useInvoicePage(status ? { status, limit } : { limit });
  const rows = invoices.data?.data ?? [];
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
          <div className="flex flex-col gap-3" aria-busy={invoices.isFetching || undefined}>
            <InvoiceSummary summary={invoices.data.summary} status={status} />
            <DataTable
              data={rows}
              columns={COLUMNS}
              label="Invoices"
              noun={['invoice', 'invoices']}
              rowKey={(i) => i.id}
              rowHref={(i) => paths.invoice(i.id)}
              searchPlaceholder="Number, client or property…"
              toolbar={
                <StatusFilter value={status} states={INVOICE_STATUSES} labels={INVOICE_STATUS_LABELS} onChange={setStatus} />
              }
              empty={
                <EmptyState title={status ? `No ${INVOICE_STATUS_LABELS[status].toLowerCase()} invoices` : 'No invoices yet'}>
                  {status ? 'Choose “All states” to see the others.' : 'When a landowner approves a proposal, its deposit invoice is drafted here. Open it and press “Send” to issue it.'}
                </EmptyState>
              }
            />
            {invoices.data.page.total > rows.length ? (
              <p className="flex flex-wrap items-center gap-3 text-sm text-slate" role="status">
                <span className="tabular-nums">
                  Showing the newest {rows.length.toLocaleString('en-US')} of {invoices.data.page.total.toLocaleString('en-US')} invoices
                </span>
                {limit < LIST_PAGE.maxLimit ? (
                  <Button variant="secondary" size="sm" disabled={invoices.isFetching} onClick={() => setMore({ status, pages: pages + 1 })}>
                    Show more
                  </Button>
                ) : (
                  <span>Choose a state to see the rest.</span>
                )}
              </p>
            ) : null}
          </div>
        )}
      </Card>
    </div>
  );
}

/** Count and money of every invoice the filter matches (summed by the server, not from the page shown). */
function InvoiceSummary({ summary, status }: { summary: InvoiceListSummaryDto; status: InvoiceStatus | undefined }) {
  if (summary.count === 0) return null;
  const what = status ? `${INVOICE_STATUS_LABELS[status].toLowerCase()} ${summary.count === 1 ? 'invoice' : 'invoices'}` : summary.count === 1 ? 'invoice' : 'invoices';
  return (
    <p className="text-sm text-slate tabular-nums" aria-label="Invoice totals">
      {summary.count.toLocaleString('en-US')} {what} · {formatCents(summary.totalCents)} in total
      {status === undefined || status === 'open' ? ` · ${formatCents(summary.balanceCents)} still owed on open invoices` : ''}
    </p>
  );
}
