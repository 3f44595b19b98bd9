/** Reads invoices with the names they show (client, property, proposal). */
import { fn, literal, type Transaction, type WhereOptions } from 'sequelize';
import { Client, Invoice, InvoiceLine, InvoicePayment, InvoiceRefund, Property, Proposal } from '../../models';
import { presentInvoice, presentInvoiceRow, type InvoiceNames } from '../../presenters/invoice';
import type { InvoiceDto, InvoiceListSummaryDto, InvoiceRowDto } from '../../../shared/schemas/invoice';
import { firmToday } from '../clock';

async function namesFor(invoices: readonly Invoice[], transaction?: Transaction): Promise<(i: Invoice) => InvoiceNames> {
  const ids = (pick: (i: Invoice) => number | null) => [...new Set(invoices.map(pick).filter((v): v is number => v !== null))];
  const [clients, properties, proposals] = await Promise.all([
    Client.findAll({ where: { id: ids((i) => i.clientId) }, attributes: ['id', 'name'], transaction }),
    Property.findAll({ where: { id: ids((i) => i.propertyId) }, attributes: ['id', 'name'], transaction }),
    Proposal.findAll({ where: { id: ids((i) => i.proposalId) }, attributes: ['id', 'number'], transaction }),
  ]);
  const c = new Map(clients.map((x) => [x.id, x.name]));
  const p = new Map(properties.map((x) => [x.id, x.name]));
  const n = new Map(proposals.map((x) => [x.id, x.number]));
  return (i) => ({ clientName: c.get(i.clientId) ?? '', propertyName: (i.propertyId && p.get(i.propertyId)) || '', proposalNumber: (i.proposalId && n.get(i.proposalId)) || null });
}

/** The invoice answer: totals, lines, payments and refunds. */
export async function readInvoice(invoice: Invoice, transaction?: Transaction): Promise<InvoiceDto> {
  const [names, lines, payments, refunds, today] = await Promise.all([
    namesFor([invoice], transaction),
    InvoiceLine.findAll({ where: { invoiceId: invoice.id }, order: [['position', 'ASC'], ['id', 'ASC']], transaction }),
    InvoicePayment.findAll({ where: { invoiceId: invoice.id }, order: [['receivedAt', 'ASC'], ['id', 'ASC']], transaction }),
    InvoiceRefund.findAll({ where: { invoiceId: invoice.id }, order: [['id', 'ASC']], transaction }),
    firmToday(invoice.firmId, transaction),
  ]);
  return presentInvoice(invoice, names(invoice), today, lines, payments, refunds);
}

/** The columns a list row shows (`presentInvoiceRow`). */
const ROW_ATTRIBUTES = ['id', 'number', 'kind', 'status', 'clientId', 'propertyId', 'proposalId', 'issuedOn', 'dueOn', 'totalCents', 'amountPaidCents', 'amountRefundedCents', 'updatedAt', 'createdAt'] as const;

/**
 * List rows, newest first; `today` is the firm's (overdue is read against it). Plain rows of the
 * columns a row shows, not model instances: a long page costs little more than a short one.
 */
export async function listInvoiceRows(where: WhereOptions, today: string, page?: { limit: number; offset: number }): Promise<InvoiceRowDto[]> {
  const rows = (await Invoice.findAll({ where, attributes: [...ROW_ATTRIBUTES], order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: page?.limit, offset: page?.offset, raw: true })) as unknown as Invoice[];
  const names = await namesFor(rows);
  return rows.map((i) => presentInvoiceRow(i, names(i), today));
}

/**
 * The count and money of every invoice `where` matches, in one aggregate query (not from a page):
 * `totalCents` sums the matching invoices' totals, `balanceCents` what is still owed on the open ones
 * (each one's total less what was paid, never below zero, as a row shows it). The count is the page's total.
 */
export async function summarizeInvoices(where: WhereOptions): Promise<InvoiceListSummaryDto> {
  const [row] = (await Invoice.findAll({
    where,
    attributes: [
      [fn('count', literal('*')), 'count'],
      [literal('COALESCE(SUM("total_cents"), 0)'), 'totalCents'],
      [literal(`COALESCE(SUM(GREATEST(0, "total_cents" - "amount_paid_cents")) FILTER (WHERE "status" = 'open'), 0)`), 'balanceCents'],
    ],
    raw: true,
  })) as unknown as { count: string; totalCents: string; balanceCents: string }[];
  return { count: Number(row?.count ?? 0), totalCents: Number(row?.totalCents ?? 0), balanceCents: Number(row?.balanceCents ?? 0) };
}
