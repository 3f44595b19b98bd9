import type { ReactNode } from 'react';
import type { InvoiceDto } from '../../../../shared/schemas/invoice';
import { formatCents } from '../../../../shared/domain/money';
import { formatDay } from '../../../lib/firm-clock';

/** Payments received on an invoice, with their refunds; `action` adds a control per payment (owner's refund). */
export function PaymentsList({ invoice, action }: { invoice: InvoiceDto; action?: (p: InvoiceDto['payments'][number]) => ReactNode }) {
  if (invoice.payments.length === 0) return <p className="text-sm text-slate">No payments yet.</p>;
  return (
    <ul className="flex flex-col divide-y divide-rule text-sm" aria-label="Payments">
      {invoice.payments.map((p) => (
        <li key={p.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
          <div>
            <span className="font-semibold tabular-nums">{formatCents(p.amountCents)}</span> received {formatDay(p.receivedAt)}
            {p.refunds.map((r) => (
              <div key={r.id} className="text-xs text-clay">
                Refunded {formatCents(r.amountCents)}
                {r.reason ? ` — ${r.reason}` : ''}
              </div>
            ))}
          </div>
          {action ? action(p) : null}
        </li>
      ))}
    </ul>
  );
}
