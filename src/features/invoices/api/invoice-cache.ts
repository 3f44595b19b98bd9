import type { QueryClient } from '@tanstack/react-query';
import type { InvoiceDto } from '../../../../shared/schemas/invoice';

/** After a write: the answer becomes the cached detail; lists, receivables and billable tasks refetch. */
export function storeInvoice(qc: QueryClient, invoice: InvoiceDto): Promise<unknown> {
  qc.setQueryData(['invoices', 'detail', invoice.id], invoice);
  const isThis = (key: readonly unknown[]) => key[1] === 'detail' && key[2] === invoice.id;
  return qc.invalidateQueries({ queryKey: ['invoices'], predicate: (q) => !isThis(q.queryKey) });
}
