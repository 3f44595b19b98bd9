import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import type { InvoiceDto } from '../../../../shared/schemas/invoice';
import { useMe } from '../../../features/auth/api/get-me';
import { useInvoice } from '../../../features/invoices/api/get-invoice';
import { useRefundPayment, useRemoveInvoiceLine, useSendInvoice, useUpdateInvoice, useVoidInvoice } from '../../../features/invoices/api/invoice-actions';
import { InvoiceLines } from '../../../features/invoices/components/invoice-lines';
import { InvoiceStatusChip } from '../../../features/invoices/components/invoice-status-chip';
import { ManualLineForm } from '../../../features/invoices/components/manual-line-form';
import { PaymentsList } from '../../../features/invoices/components/payments-list';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button, buttonClasses } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { MissingRecord } from '../../../components/ui/missing-record';
import { PageHeader } from '../../../components/ui/page-header';
import { TextButton } from '../../../components/ui/text-button';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';
import { parseDollarsToCents } from '../../../../shared/domain/money';
import { formatDay } from '../../../lib/firm-clock';

const KIND = { deposit: 'Deposit invoice', progress: 'Progress invoice', final: 'Final invoice' } as const;

function Terms({ invoice }: { invoice: InvoiceDto }) {
  const update = useUpdateInvoice();
  const toast = useToast();
  const [days, setDays] = useState(String(invoice.termsDays));
  const valid = /^\d{1,3}$/.test(days) && Number(days) <= 365;
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        update.mutate({ id: invoice.id, termsDays: Number(days) }, { onSuccess: () => toast('success', 'Terms saved.'), onError: (err) => toast('error', `Terms not saved: ${err.message}`) });
      }}
    >
      <TextField label="Payment terms (days; 0 = due on receipt)" inputMode="numeric" value={days} onChange={(e) => setDays(e.target.value)} error={valid ? undefined : 'a whole number of days from 0 to 365'} className="w-64" />
      <Button type="submit" variant="secondary" size="sm" disabled={!valid} busy={update.isPending}>
        Save terms
      </Button>
    </form>
  );
}

function RefundControl({ invoiceId, payment }: { invoiceId: number; payment: InvoiceDto['payments'][number] }) {
  const refund = useRefundPayment();
  const toast = useToast();
  const [open, setOpen] = useState(false);
  const [amount, setAmount] = useState('');
  const [error, setError] = useState<string | undefined>();
  // One key per refund the owner means to make: kept through retries of it, new once it is done or the amount changes.
  const [requestKey, setRequestKey] = useState(() => `refund-${crypto.randomUUID()}`);
  const left = payment.amountCents - payment.refundedCents;
  if (left <= 0) return <span className="text-xs text-slate">Refunded in full</span>;
  if (!open) return <TextButton onClick={() => setOpen(true)}>Refund…</TextButton>;
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        let cents: number;
        try {
          cents = parseDollarsToCents(amount);
        } catch (err) {
          return setError((err as Error).message);
        }
        if (cents <= 0 || cents > left) return setError(`between $0.01 and ${formatCents(left)}`);
        refund.mutate({ id: invoiceId, paymentId: payment.id, amountCents: cents, requestKey }, { onSuccess: () => { toast('success', `${formatCents(cents)} refunded.`); setOpen(false); setRequestKey(`refund-${crypto.randomUUID()}`); }, onError: (err) => toast('error', err.message) });
      }}
    >
      <TextField label={`Refund amount ($, at most ${formatCents(left)})`} inputMode="decimal" value={amount} onChange={(e) => { setAmount(e.target.value); setError(undefined); setRequestKey(`refund-${crypto.randomUUID()}`); }} error={error} className="w-56" />
      <Button type="submit" variant="danger" size="sm" busy={refund.isPending}>Refund</Button>
      <Button type="button" variant="ghost" size="sm" onClick={() => setOpen(false)}>Cancel</Button>
    </form>
  );
}

/** One invoice for staff: lines (manual lines on drafts), send, void, payments and the owner's refunds, the PDF. */
export function InvoicePage() {
  const id = parseId(useParams().id);
  const invoice = useInvoice(id ?? 0);
  const me = useMe();
  const send = useSendInvoice();
  const voidIt = useVoidInvoice();
  const removeLine = useRemoveInvoiceLine();
  const toast = useToast();
  const [voiding, setVoiding] = useState(false);
  const [confirmingSend, setConfirmingSend] = useState(false);
  const [voidReason, setVoidReason] = useState('');
  if (id === null || (invoice.isError && invoice.error instanceof ApiError && invoice.error.status === 404)) return <MissingRecord what="invoice" backTo={paths.invoices} backLabel="All invoices" />;
  if (invoice.isPending) return <Loading label="Loading invoice…" />;
  if (invoice.isError) return <ErrorPanel error={invoice.error} onRetry={() => void invoice.refetch()} />;
  const inv = invoice.data;
  const isDraft = inv.status === 'draft';
  const canVoid = (inv.status === 'draft' || inv.status === 'open') && inv.amountPaidCents === 0;
  const doSend = () =>
    send.mutate(inv.id, {
      onSuccess: (next) => {
        setConfirmingSend(false);
        toast('success', `${next.number} ${isDraft ? 'issued and e-mailed' : 'e-mailed again'} to ${next.clientName}.`);
      },
      onError: (e) => {
        setConfirmingSend(false);
        toast('error', `Not sent: ${e.message}`);
      },
    });
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={<span className="flex flex-wrap items-center gap-2">{inv.number} <InvoiceStatusChip status={inv.status} daysOverdue={inv.daysOverdue} /></span>}
        crumbs={[{ label: 'Invoices', to: paths.invoices }]}
        actions={
          <>
            {isDraft || inv.status === 'open' ? (
              <Button onClick={() => setConfirmingSend(true)} busy={send.isPending}>
                {isDraft ? 'Send…' : 'Send again…'}
              </Button>
            ) : null}
            <a className={buttonClasses('secondary')} href={`/api/invoices/${inv.id}/pdf`} target="_blank" rel="noreferrer">
              PDF
            </a>
            {canVoid ? (
              <Button variant="danger-outline" onClick={() => setVoiding(true)}>
                Void
              </Button>
            ) : null}
          </>
        }
      >
        {KIND[inv.kind]} for {inv.clientName}
        {inv.propertyName ? `, ${inv.propertyName}` : ''}
        {inv.proposalId ? (
          <>
            {' '}· proposal <Link className="text-moss-deep underline" to={paths.proposal(inv.proposalId)}>{inv.proposalNumber}</Link>
          </>
        ) : null}
        {inv.dueOn ? ` · due ${formatDay(inv.dueOn)}` : ''}
        {inv.voidReason ? ` · void: ${inv.voidReason}` : ''}
      </PageHeader>
      <Card title="Lines">
        <InvoiceLines
          invoice={inv}
          lineAction={isDraft ? (l) => (l.source === 'manual' ? <TextButton tone="clay" aria-label={`Remove ${l.description}`} onClick={() => removeLine.mutate({ id: inv.id, lineId: l.id }, { onError: (e) => toast('error', `Not removed: ${e.message}`) })}>Remove</TextButton> : null) : undefined}
        />
      </Card>
      {isDraft ? (
        <Card title="Draft: add a line, set the terms">
          <div className="flex flex-col gap-4">
            <ManualLineForm invoiceId={inv.id} />
            <Terms invoice={inv} />
          </div>
        </Card>
      ) : null}
      <Card title="Payments">
        <PaymentsList invoice={inv} action={me.data?.role === 'owner' ? (p) => <RefundControl invoiceId={inv.id} payment={p} /> : undefined} />
      </Card>
      <ConfirmDialog
        open={confirmingSend}
        title={isDraft ? `Send ${inv.number} to ${inv.clientName}?` : `E-mail ${inv.number} to ${inv.clientName} again?`}
        confirmLabel={isDraft ? 'Send invoice' : 'Send again'}
        busy={send.isPending}
        onConfirm={doSend}
        onCancel={() => setConfirmingSend(false)}
      >
        {isDraft ? (
          <>
            <p>
              It is issued today for <span className="figure">{formatCents(inv.totalCents)}</span>, {inv.termsDays === 0 ? 'due on receipt' : `due in ${inv.termsDays} days`}, and e-mailed with the PDF and a link to pay in their portal.
            </p>
            <p className="mt-2 text-slate">Once sent, its lines cannot change; void it and make a new one to correct it.</p>
          </>
        ) : (
          <p>They get the same invoice again, with the PDF and the link to pay. Nothing on it changes.</p>
        )}
      </ConfirmDialog>
      <ConfirmDialog
        open={voiding}
        title={`Void ${inv.number}?`}
        confirmLabel="Void invoice"
        destructive
        busy={voidIt.isPending}
        onCancel={() => setVoiding(false)}
        onConfirm={() => {
          if (voidReason.trim().length < 3) return toast('error', 'Say briefly why the invoice is void.');
          voidIt.mutate({ id: inv.id, reason: voidReason.trim() }, { onSuccess: () => { setVoiding(false); toast('success', `${inv.number} is void.`); }, onError: (e) => toast('error', `Not voided: ${e.message}`) });
        }}
      >
        <p className="mb-2">Nothing will be due on it. Its tasks can be billed again on a new invoice. The number stays used.</p>
        <TextField label="Why" value={voidReason} onChange={(e) => setVoidReason(e.target.value)} />
      </ConfirmDialog>
    </div>
  );
}
