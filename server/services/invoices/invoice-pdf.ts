/** Assembles an invoice's document input and renders its PDF. */
import type { Transaction } from 'sequelize';
import { Client, Firm, Invoice, InvoiceLine, InvoicePayment, Property, Proposal, type InvoiceDocumentSnapshot } from '../../models';
import { renderInvoicePdf } from '../documents/render-documents';
import { config } from '../../config';
import { usableZone } from '../clock';
import { todayIn } from '../../../shared/domain/clock';
import { documentFirm } from '../firm-profile';
import { letterheadFirm } from '../documents/firm-letterhead';

/** The issued part of the invoice's document as it stands now (firm, client, property, dates, lines, totals). */
export async function invoiceDocumentSnapshot(invoice: Invoice, transaction?: Transaction): Promise<InvoiceDocumentSnapshot> {
  const [firm, client, property, proposal, lines] = await Promise.all([
    Firm.findByPk(invoice.firmId, { transaction }),
    Client.findByPk(invoice.clientId, { attributes: ['name', 'address'], transaction }),
    invoice.propertyId ? Property.findByPk(invoice.propertyId, { attributes: ['name'], transaction }) : null,
    invoice.proposalId ? Proposal.findByPk(invoice.proposalId, { attributes: ['number'], transaction }) : null,
    InvoiceLine.findAll({ where: { invoiceId: invoice.id }, order: [['position', 'ASC'], ['id', 'ASC']], transaction }),
  ]);
  return {
    firm: documentFirm(firm!),
    client: { name: client?.name ?? '', address: client?.address ?? null },
    property: property ? { name: property.name } : null,
    invoice: {
      number: invoice.number,
      kind: invoice.kind,
      status: invoice.status,
      proposalNumber: proposal?.number ?? null,
      issuedOn: invoice.issuedOn,
      dueOn: invoice.dueOn,
      termsDays: invoice.termsDays,
      notes: invoice.notes,
      currency: invoice.currency,
      taxRatePct: invoice.taxRatePct,
      portalUrl: `${config.publicUrl}/portal/invoices/${invoice.id}`,
    },
    lines: lines.map((l) => ({ description: l.description, quantity: String(l.quantity), unit: l.unit, unitPriceCents: l.unitPriceCents, amountCents: l.amountCents, taxable: l.taxable })),
    totals: { subtotalCents: invoice.subtotalCents, taxCents: invoice.taxCents, totalCents: invoice.totalCents },
  };
}

/**
 * The PDF of an invoice. Once sent, the issued part comes from the snapshot kept at sending, so later
 * changes to the firm, client or property never alter it; status, payments and balance are live.
 */
export async function renderInvoicePdfFor(invoice: Invoice, transaction?: Transaction): Promise<Buffer> {
  // An invoice issued before snapshots were kept is frozen the first time its PDF is made.
  if (invoice.status !== 'draft' && !invoice.documentSnapshot) await invoice.update({ documentSnapshot: await invoiceDocumentSnapshot(invoice, transaction) }, { transaction });
  const [issued, payments, firm] = await Promise.all([
    invoice.documentSnapshot ? Promise.resolve(invoice.documentSnapshot) : invoiceDocumentSnapshot(invoice, transaction),
    InvoicePayment.findAll({ where: { invoiceId: invoice.id }, order: [['receivedAt', 'ASC']], transaction }),
    Firm.findByPk(invoice.firmId, { attributes: ['id', 'timezone'], transaction }),
  ]);
  const zone = usableZone(firm?.timezone);
  return renderInvoicePdf({
    ...issued,
    firm: await letterheadFirm(issued.firm),
    invoice: { ...issued.invoice, status: invoice.status },
    totals: { ...issued.totals, amountPaidCents: invoice.amountPaidCents, balanceCents: Math.max(0, issued.totals.totalCents - invoice.amountPaidCents) },
    payments: payments.map((p) => ({ receivedOn: todayIn(zone, p.receivedAt), amountCents: p.amountCents, refundedCents: p.refundedCents })),
  });
}
