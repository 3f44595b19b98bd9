/** Assembles an invoice's document input and renders its PDF. */
import type { Transaction } from 'sequelize';
import { Client, Firm, Invoice, InvoiceLine, InvoicePayment, Property, Proposal } from '../../models';
import { renderInvoicePdf } from '../../../templates/documents/invoice';
import { config } from '../../config';

/** The PDF of an invoice as it stands. */
export async function renderInvoicePdfFor(invoice: Invoice, transaction?: Transaction): Promise<Buffer> {
  const [firm, client, property, proposal, lines, payments] = await Promise.all([
    Firm.findByPk(invoice.firmId, { transaction }),
    Client.findByPk(invoice.clientId, { attributes: ['name', 'address'], transaction }),
    invoice.propertyId ? Property.findByPk(invoice.propertyId, { attributes: ['name'], transaction }) : null,
    invoice.proposalId ? Proposal.findByPk(invoice.proposalId, { attributes: ['number'], transaction }) : null,
    InvoiceLine.findAll({ where: { invoiceId: invoice.id }, order: [['position', 'ASC'], ['id', 'ASC']], transaction }),
    InvoicePayment.findAll({ where: { invoiceId: invoice.id }, order: [['receivedAt', 'ASC']], transaction }),
  ]);
  return renderInvoicePdf({
    firm: { name: firm!.name, phone: firm!.phone, email: firm!.email, address: firm!.address },
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
    totals: { subtotalCents: invoice.subtotalCents, taxCents: invoice.taxCents, totalCents: invoice.totalCents, amountPaidCents: invoice.amountPaidCents, balanceCents: Math.max(0, invoice.totalCents - invoice.amountPaidCents) },
    payments: payments.map((p) => ({ receivedOn: p.receivedAt.toISOString().slice(0, 10), amountCents: p.amountCents, refundedCents: p.refundedCents })),
  });
}
