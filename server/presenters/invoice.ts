/** The JSON shapes of invoices (typed by shared/schemas/invoice.ts, which the client reads too). */
import type { Invoice, InvoiceLine, InvoicePayment, InvoiceRefund } from '../models';
import type { InvoiceDto, InvoiceRowDto } from '../../shared/schemas/invoice';
import { daysPastDue } from '../../shared/domain/invoicing';

export interface InvoiceNames {
  clientName: string;
  propertyName: string;
  proposalNumber: string | null;
}

/** A list row: numbers, dates and money without lines. */
export function presentInvoiceRow(invoice: Invoice, names: InvoiceNames, today: string): InvoiceRowDto {
  const balanceCents = Math.max(0, invoice.totalCents - invoice.amountPaidCents);
  const overdue = invoice.status === 'open' && invoice.dueOn ? Math.max(0, daysPastDue(invoice.dueOn, today)) : 0;
  return {
    id: invoice.id,
    number: invoice.number,
    kind: invoice.kind,
    status: invoice.status,
    clientId: invoice.clientId,
    clientName: names.clientName,
    propertyId: invoice.propertyId,
    propertyName: names.propertyName,
    proposalId: invoice.proposalId,
    proposalNumber: names.proposalNumber,
    issuedOn: invoice.issuedOn,
    dueOn: invoice.dueOn,
    totalCents: invoice.totalCents,
    amountPaidCents: invoice.amountPaidCents,
    amountRefundedCents: invoice.amountRefundedCents,
    balanceCents,
    daysOverdue: overdue,
    updatedAt: invoice.updatedAt.toISOString(),
  };
}

/** The whole invoice: lines, payments with their refunds, and the totals. */
export function presentInvoice(invoice: Invoice, names: InvoiceNames, today: string, lines: readonly InvoiceLine[], payments: readonly InvoicePayment[], refunds: readonly InvoiceRefund[]): InvoiceDto {
  return {
    ...presentInvoiceRow(invoice, names, today),
    currency: invoice.currency,
    taxRatePct: invoice.taxRatePct,
    termsDays: invoice.termsDays,
    notes: invoice.notes,
    subtotalCents: invoice.subtotalCents,
    taxCents: invoice.taxCents,
    billedCents: invoice.billedCents,
    sentAt: invoice.sentAt?.toISOString() ?? null,
    paidAt: invoice.paidAt?.toISOString() ?? null,
    voidedAt: invoice.voidedAt?.toISOString() ?? null,
    voidReason: invoice.voidReason,
    lines: lines.map((l) => ({
      id: l.id,
      position: l.position,
      source: l.source,
      taskId: l.taskId,
      description: l.description,
      quantity: Number(l.quantity).toString(),
      unit: l.unit,
      unitPriceCents: l.unitPriceCents,
      amountCents: l.amountCents,
      taxable: l.taxable,
    })),
    payments: payments.map((p) => ({
      id: p.id,
      amountCents: p.amountCents,
      refundedCents: p.refundedCents,
      receivedAt: p.receivedAt.toISOString(),
      refunds: refunds.filter((r) => r.paymentId === p.id).map((r) => ({ id: r.id, amountCents: r.amountCents, reason: r.reason, createdAt: r.createdAt.toISOString() })),
    })),
  };
}
