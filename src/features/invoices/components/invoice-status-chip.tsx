import type { InvoiceStatus } from '../../../../shared/domain/invoicing';

/** How each invoice state reads. */
export const INVOICE_STATUS_LABELS: Record<InvoiceStatus, string> = { draft: 'Draft', open: 'Open', paid: 'Paid', void: 'Void' };

// Ink on ochre 5.9, white on sky 4.7, white on moss 6.2, slate on card 5.7 (WCAG AA for small text).
const STYLES: Record<InvoiceStatus | 'overdue', string> = {
  draft: 'border-ochre bg-ochre text-ink',
  open: 'border-sky bg-sky text-white',
  overdue: 'border-clay bg-card text-clay',
  paid: 'border-moss bg-moss text-white',
  void: 'border-dashed border-slate bg-card text-slate',
};

/** An invoice's state as a small chip; an open invoice past its due date reads "Overdue". */
export function InvoiceStatusChip({ status, daysOverdue = 0 }: { status: InvoiceStatus; daysOverdue?: number }) {
  const overdue = status === 'open' && daysOverdue > 0;
  return (
    <span data-status={status} className={`inline-flex items-center whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold leading-5 ${STYLES[overdue ? 'overdue' : status]}`}>
      {overdue ? `Overdue ${daysOverdue} d` : INVOICE_STATUS_LABELS[status]}
    </span>
  );
}
