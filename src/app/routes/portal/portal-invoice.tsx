import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { formatCents, parseDollarsToCents } from '../../../../shared/domain/money';
import { MIN_CARD_PAYMENT_CENTS } from '../../../../shared/domain/invoicing';
import { useInvoice } from '../../../features/invoices/api/get-invoice';
import { useCheckoutInvoice } from '../../../features/invoices/api/invoice-actions';
import { InvoiceLines } from '../../../features/invoices/components/invoice-lines';
import { InvoiceStatusChip } from '../../../features/invoices/components/invoice-status-chip';
import { PaymentsList } from '../../../features/invoices/components/payments-list';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button, buttonClasses } from '../../../components/ui/button';
import { MissingRecord } from '../../../components/ui/missing-record';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';
import { formatDay } from '../../../lib/firm-clock';

const KIND = { deposit: 'Deposit invoice', progress: 'Progress invoice', final: 'Final invoice' } as const;

/** One invoice in the portal, with one clear action: Pay (all of it, or a part). Back from the payment page it watches for the payment to land. */
export function PortalInvoicePage() {
  const id = parseId(useParams().id);
  const [params] = useSearchParams();
  const returned = params.get('paid') === '1';
  const [polling, setPolling] = useState(returned);
  const invoice = useInvoice(id ?? 0, polling ? 1500 : false);
  const checkout = useCheckoutInvoice();
  const toast = useToast();
  const [part, setPart] = useState(false);
  const [amount, setAmount] = useState('');
  const [amountError, setAmountError] = useState<string | undefined>();
  if (polling && invoice.data && (invoice.data.status !== 'open' || invoice.data.payments.length > 0)) setPolling(false);
  if (id === null || (invoice.isError && invoice.error instanceof ApiError && invoice.error.status === 404)) return <MissingRecord what="invoice" backTo={paths.portalInvoices} backLabel="Your invoices" />;
  if (invoice.isPending) return <Loading label="Loading the invoice…" />;
  if (invoice.isError) return <ErrorPanel error={invoice.error} onRetry={() => void invoice.refetch()} />;
  const inv = invoice.data;

  const pay = () => {
    let amountCents: number | undefined;
    if (part) {
      try {
        amountCents = parseDollarsToCents(amount);
      } catch (e) {
        return setAmountError((e as Error).message);
      }
      if (amountCents < Math.min(MIN_CARD_PAYMENT_CENTS, inv.balanceCents) || amountCents > inv.balanceCents) return setAmountError(`between ${formatCents(Math.min(MIN_CARD_PAYMENT_CENTS, inv.balanceCents))} and ${formatCents(inv.balanceCents)}`);
    }
    checkout.mutate({ id: inv.id, amountCents }, { onSuccess: ({ url }) => window.location.assign(url), onError: (e) => toast('error', e.message) });
  };

  return (
    <div className="flex flex-col gap-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link to={paths.portalInvoices} className="text-moss-deep hover:underline">Your invoices</Link>
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h1 className="text-2xl font-bold">
          {KIND[inv.kind]} {inv.number}
        </h1>
        <InvoiceStatusChip status={inv.status} daysOverdue={inv.daysOverdue} />
      </div>
      <p className="text-slate">
        {inv.propertyName}
        {inv.issuedOn ? ` · issued ${formatDay(inv.issuedOn)}` : ''}
        {inv.dueOn && inv.status === 'open' ? ` · due ${formatDay(inv.dueOn)}` : ''}
      </p>
      {returned && polling ? (
        <p role="status" className="rounded-md border border-sky bg-card p-3">Thank you. We are waiting for the payment service to confirm your payment; this page updates by itself.</p>
      ) : null}
      {inv.status === 'paid' ? (
        <p role="status" className="rounded-md border border-moss bg-card p-3 font-semibold text-moss-deep">Paid — thank you. A receipt is on its way to your e-mail.</p>
      ) : null}
      {inv.status === 'void' ? <p className="rounded-md border border-slate bg-card p-3 text-slate">This invoice is void; nothing is due on it.</p> : null}
      {inv.status === 'open' ? (
        <Card title={`${formatCents(inv.balanceCents)} to pay`}>
          <div className="flex flex-col gap-3">
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" className="h-4 w-4 accent-moss" checked={part} onChange={(e) => setPart(e.target.checked)} /> Pay part of it now
            </label>
            {part ? <TextField label="Amount to pay ($)" inputMode="decimal" value={amount} onChange={(e) => { setAmount(e.target.value); setAmountError(undefined); }} error={amountError} className="max-w-xs" /> : null}
            <div>
              <Button onClick={pay} busy={checkout.isPending}>
                {part ? 'Pay this amount by card' : `Pay ${formatCents(inv.balanceCents)} by card`}
              </Button>
            </div>
            <p className="text-xs text-slate">You will pay on the payment service’s secure page and come back here.</p>
          </div>
        </Card>
      ) : null}
      <Card title="Lines">
        <InvoiceLines invoice={inv} />
      </Card>
      <Card title="Payments">
        <PaymentsList invoice={inv} />
      </Card>
      <div>
        <a className={buttonClasses('secondary')} href={`/api/invoices/${inv.id}/pdf`} target="_blank" rel="noreferrer">
          Download the PDF
        </a>
      </div>
    </div>
  );
}
