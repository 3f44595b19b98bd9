import { Link } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { useInvoices } from '../../../features/invoices/api/get-invoices';
import { LIST_PAGE } from '../../../../shared/schemas/common';
import { InvoiceStatusChip } from '../../../features/invoices/components/invoice-status-chip';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { paths } from '../../../config/paths';

const KIND = { deposit: 'Deposit', progress: 'Progress', final: 'Final' } as const;

/** The landowner's invoices as documents: those to pay first. */
export function PortalInvoicesPage() {
  // All of the landowner's own invoices (the list's usual 500, not the staff screen's page of 50).
  const invoices = useInvoices({ limit: LIST_PAGE.defaultLimit });
  if (invoices.isPending) return <Loading label="Loading your invoices…" />;
  if (invoices.isError) return <ErrorPanel error={invoices.error} onRetry={() => void invoices.refetch()} />;
  const toPay = invoices.data.filter((i) => i.status === 'open');
  const others = invoices.data.filter((i) => i.status !== 'open');
  const list = (rows: typeof invoices.data) => (
    <ul className="grid gap-3 sm:grid-cols-2">
      {rows.map((i) => (
        <li key={i.id}>
          <Link to={paths.portalInvoice(i.id)} className="flex flex-col gap-1 rounded-md border border-rule bg-card p-4 hover:border-moss focus-visible:outline-2 focus-visible:outline-moss">
            <span className="flex items-center justify-between gap-2">
              <span className="font-heading font-bold">{i.number}</span>
              <InvoiceStatusChip status={i.status} daysOverdue={i.daysOverdue} />
            </span>
            <span className="text-sm text-slate">
              {KIND[i.kind]} · {i.propertyName}
            </span>
            <span className="tabular-nums">
              {i.status === 'open' ? `${formatCents(i.balanceCents)} to pay${i.dueOn ? ` by ${i.dueOn}` : ''}` : formatCents(i.totalCents)}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
  return (
    <div className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Invoices</h1>
        <p className="text-slate">What your consultant has billed, and what is left to pay.</p>
      </div>
      {invoices.data.length === 0 ? <EmptyState title="No invoices yet">When your consultant sends an invoice, it appears here and in your e-mail.</EmptyState> : null}
      {toPay.length ? (
        <section aria-labelledby="to-pay" className="flex flex-col gap-3">
          <h2 id="to-pay" className="text-lg font-bold">To pay</h2>
          {list(toPay)}
        </section>
      ) : null}
      {others.length ? (
        <section aria-labelledby="earlier" className="flex flex-col gap-3">
          <h2 id="earlier" className="text-lg font-bold">{toPay.length ? 'Earlier invoices' : 'Your invoices'}</h2>
          {list(others)}
        </section>
      ) : null}
    </div>
  );
}
