/** The invoice writes: one fetcher and hook per operation; each answer refreshes the cache. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { InvoiceCreateInput, InvoiceDto, InvoiceUpdateInput, ManualLineInput, RefundInput } from '../../../../shared/schemas/invoice';
import { storeInvoice } from './invoice-cache';

type Answer = { data: InvoiceDto };

/** Creates (or, for a drafted deposit, finds) an invoice of an approved proposal. */
export const createInvoice = async (input: InvoiceCreateInput) => (await api.post<Answer>('/api/invoices', input)).data;
/** Edits a draft's terms and notes. */
export const updateInvoice = async ({ id, ...input }: InvoiceUpdateInput & { id: number }) => (await api.patch<Answer>(`/api/invoices/${id}`, input)).data;
/** Adds a manual line to a draft. */
export const addInvoiceLine = async ({ id, line }: { id: number; line: ManualLineInput }) => (await api.post<Answer>(`/api/invoices/${id}/lines`, line)).data;
/** Removes a manual line from a draft. */
export const removeInvoiceLine = async ({ id, lineId }: { id: number; lineId: number }) => (await api.delete<Answer>(`/api/invoices/${id}/lines/${lineId}`)).data;
/** Issues a draft (or re-sends an open invoice) by e-mail with its PDF. */
export const sendInvoice = async (id: number) => (await api.post<Answer>(`/api/invoices/${id}/send`)).data;
/** Voids an invoice without payments. */
export const voidInvoice = async ({ id, reason }: { id: number; reason: string }) => (await api.post<Answer>(`/api/invoices/${id}/void`, { reason })).data;
/** Refunds part of a payment (owner only). */
export const refundPayment = async ({ id, ...input }: RefundInput & { id: number }) => (await api.post<Answer>(`/api/invoices/${id}/refunds`, input)).data;
/** The hosted payment page's address for the client's own open invoice. */
export const checkoutInvoice = async ({ id, amountCents }: { id: number; amountCents?: number }) => (await api.post<{ data: { url: string; amountCents: number } }>(`/api/invoices/${id}/checkout`, amountCents ? { amountCents } : {})).data;

function useInvoiceWrite<V>(fn: (v: V) => Promise<InvoiceDto>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: (invoice) => storeInvoice(qc, invoice) });
}

export const useCreateInvoice = () => useInvoiceWrite(createInvoice);
export const useUpdateInvoice = () => useInvoiceWrite(updateInvoice);
export const useAddInvoiceLine = () => useInvoiceWrite(addInvoiceLine);
export const useRemoveInvoiceLine = () => useInvoiceWrite(removeInvoiceLine);
export const useSendInvoice = () => useInvoiceWrite(sendInvoice);
export const useVoidInvoice = () => useInvoiceWrite(voidInvoice);
export const useRefundPayment = () => useInvoiceWrite(refundPayment);
/** Opens the payment page (the caller sends the browser there). */
export const useCheckoutInvoice = () => useMutation({ mutationFn: checkoutInvoice });
