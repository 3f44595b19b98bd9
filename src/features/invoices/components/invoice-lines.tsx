import type { ReactNode } from 'react';
import type { InvoiceDto } from '../../../../shared/schemas/invoice';
import { formatCents } from '../../../../shared/domain/money';

const money = (c: number) => (c < 0 ? `−${formatCents(-c)}` : formatCents(c));

/** The lines and totals of an invoice as the client reads them; `lineAction` adds a control per line (drafts). */
export function InvoiceLines({ invoice, lineAction }: { invoice: InvoiceDto; lineAction?: (line: InvoiceDto['lines'][number]) => ReactNode }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm tabular-nums" aria-label="Invoice lines">
        <thead>
          <tr className="border-b border-slate text-left text-xs text-slate">
            <th scope="col" className="py-2 pr-2 font-semibold">Description</th>
            <th scope="col" className="hidden py-2 px-2 text-right font-semibold sm:table-cell">Quantity</th>
            <th scope="col" className="py-2 pl-2 text-right font-semibold">Amount</th>
            {lineAction ? <th scope="col" className="py-2 pl-2"><span className="sr-only">Actions</span></th> : null}
          </tr>
        </thead>
        <tbody>
          {invoice.lines.map((l) => (
            <tr key={l.id} className="border-b border-rule align-top">
              <td className="py-2 pr-2">
                {l.description}
                {l.taxable ? <span className="ml-1 text-xs text-slate">(taxable)</span> : null}
              </td>
              <td className="hidden py-2 px-2 text-right sm:table-cell">{l.source === 'manual' ? `${l.quantity} ${l.unit} × ${formatCents(l.unitPriceCents)}` : '—'}</td>
              <td className="py-2 pl-2 text-right whitespace-nowrap">{money(l.amountCents)}</td>
              {lineAction ? <td className="py-2 pl-2 text-right">{lineAction(l)}</td> : null}
            </tr>
          ))}
        </tbody>
      </table>
      <dl className="ml-auto mt-3 grid max-w-xs grid-cols-[1fr_auto] gap-x-4 gap-y-1 text-sm tabular-nums">
        <dt className="text-slate">Subtotal</dt>
        <dd className="text-right">{money(invoice.subtotalCents)}</dd>
        {invoice.taxCents > 0 ? (
          <>
            <dt className="text-slate">Sales tax ({invoice.taxRatePct} %)</dt>
            <dd className="text-right">{money(invoice.taxCents)}</dd>
          </>
        ) : null}
        <dt className="font-semibold">Total</dt>
        <dd className="text-right font-heading font-bold" data-testid="invoice-total">{money(invoice.totalCents)}</dd>
        {invoice.amountPaidCents > 0 ? (
          <>
            <dt className="text-slate">Paid</dt>
            <dd className="text-right">−{formatCents(invoice.amountPaidCents)}</dd>
          </>
        ) : null}
        <dt className="font-semibold">Balance due</dt>
        <dd className="text-right font-heading font-bold text-moss-deep" data-testid="invoice-balance">{money(invoice.balanceCents)}</dd>
      </dl>
    </div>
  );
}
