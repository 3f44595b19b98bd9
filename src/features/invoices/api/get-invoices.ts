import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { InvoiceRowDto } from '../../../../shared/schemas/invoice';
import type { InvoiceStatus } from '../../../../shared/domain/invoicing';

export interface InvoiceListFilter {
  status?: InvoiceStatus;
  proposalId?: number;
  clientId?: number;
  propertyId?: number;
}

/** Invoices the signed-in person may see: staff the firm's, a client their own issued ones. */
export const getInvoices = (filter: InvoiceListFilter = {}, signal?: AbortSignal) => {
  const query = new URLSearchParams();
  for (const [k, v] of Object.entries(filter)) if (v !== undefined) query.set(k, String(v));
  const qs = query.toString();
  return getData<InvoiceRowDto[]>(`/api/invoices${qs ? `?${qs}` : ''}`, signal);
};

export const getInvoicesQueryOptions = (filter: InvoiceListFilter = {}) => queryOptions({ queryKey: ['invoices', 'list', filter], queryFn: ({ signal }) => getInvoices(filter, signal) });

/** The invoice list, filtered. */
export const useInvoices = (filter: InvoiceListFilter = {}) => useQuery(getInvoicesQueryOptions(filter));
