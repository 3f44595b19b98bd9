import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { InvoiceListDto, InvoiceRowDto } from '../../../../shared/schemas/invoice';
import type { InvoiceStatus } from '../../../../shared/domain/invoicing';

export interface InvoiceListFilter {
  status?: InvoiceStatus;
  proposalId?: number;
  clientId?: number;
  propertyId?: number;
  /** Rows to answer; the server's default (the 50 newest) when left out. */
  limit?: number;
}

const listUrl = (filter: InvoiceListFilter) => {
  const query = new URLSearchParams();
  for (const [k, v] of Object.entries(filter)) if (v !== undefined) query.set(k, String(v));
  const qs = query.toString();
  return `/api/invoices${qs ? `?${qs}` : ''}`;
};

/** Invoices the signed-in person may see: staff the firm's, a client their own issued ones. */
export const getInvoices = (filter: InvoiceListFilter = {}, signal?: AbortSignal) => getData<InvoiceRowDto[]>(listUrl(filter), signal);

export const getInvoicesQueryOptions = (filter: InvoiceListFilter = {}) => queryOptions({ queryKey: ['invoices', 'list', filter], queryFn: ({ signal }) => getInvoices(filter, signal) });

/** The invoice list, filtered. */
export const useInvoices = (filter: InvoiceListFilter = {}) => useQuery(getInvoicesQueryOptions(filter));

/** One page of the invoice list with its place in the whole (`page.total`) and the whole's money (`summary`). */
export const getInvoicePage = (filter: InvoiceListFilter, signal?: AbortSignal) => api.get<InvoiceListDto>(listUrl(filter), signal);

export const getInvoicePageQueryOptions = (filter: InvoiceListFilter) =>
  queryOptions({ queryKey: ['invoices', 'list', 'page', filter], queryFn: ({ signal }) => getInvoicePage(filter, signal), placeholderData: keepPreviousData });

/** A page of invoices with totals; the previous answer stays on screen while a longer page loads. */
export const useInvoicePage = (filter: InvoiceListFilter) => useQuery(getInvoicePageQueryOptions(filter));
