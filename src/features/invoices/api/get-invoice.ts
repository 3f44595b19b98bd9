import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { InvoiceDto } from '../../../../shared/schemas/invoice';

/** One invoice with its lines and payments. */
export const getInvoice = (id: number, signal?: AbortSignal) => getData<InvoiceDto>(`/api/invoices/${id}`, signal);

export const getInvoiceQueryOptions = (id: number) => queryOptions({ queryKey: ['invoices', 'detail', id], queryFn: ({ signal }) => getInvoice(id, signal), enabled: id > 0 });

/** One invoice; `pollMs` refetches while set (waiting for a payment to land). */
export const useInvoice = (id: number, pollMs: number | false = false) => useQuery({ ...getInvoiceQueryOptions(id), refetchInterval: pollMs });
