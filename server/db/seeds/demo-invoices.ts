/**
 * Demo invoices for Bluestem Ridge (club@browseline.test), so Receivables has something to show:
 * one paid this month and one open and overdue. Invented figures; idempotent (skipped when the
 * club has invoices already). Numbers come from the firm's counter like any other invoice.
 */
import type { Transaction } from 'sequelize';
import { Client, Invoice, InvoiceLine, InvoicePayment, Property, type Firm } from '../../models';
import { nextFirmNumber } from '../../commands/proposal-writer';
import { recalcInvoice } from '../../commands/invoice-writer';
import { addDays } from '../../../shared/domain/planting-windows';
import { firmToday } from '../../services/clock';

const DAY_MS = 24 * 3600 * 1000;

/** Seeds the club's two invoices when it has none; answers how many were made. */
export async function seedDemoInvoices(firm: Firm, transaction: Transaction): Promise<number> {
  const client = await Client.findOne({ where: { firmId: firm.id, name: 'Bluestem Ridge Hunting Club' }, transaction });
  if (!client) return 0;
  if (await Invoice.count({ where: { clientId: client.id }, transaction })) return 0;
  const property = await Property.findOne({ where: { firmId: firm.id, clientId: client.id, name: 'Bluestem Ridge' }, transaction });
  const today = await firmToday(firm.id, transaction);
  const year = today.slice(0, 4);
  const plans = [
    {
      issuedOn: addDays(today, -75),
      lines: [
        { description: 'Hinge-cutting along the east bedding edge (crew day)', quantity: '2', unit: 'day', unitPriceCents: 118_000, taxable: false },
        { description: 'Frost-seeding clover on the ridge-top plot', quantity: '1.6', unit: 'acre', unitPriceCents: 14_500, taxable: false },
      ],
      paid: false,
    },
    {
      issuedOn: addDays(today, -20),
      lines: [
        { description: 'Spring soil tests, three plots', quantity: '3', unit: 'sample', unitPriceCents: 3_800, taxable: false },
        { description: 'Pelletized lime, delivered and spread', quantity: '4', unit: 'ton', unitPriceCents: 9_200, taxable: true },
      ],
      paid: true,
    },
  ];
  for (const plan of plans) {
    const seq = await nextFirmNumber(firm.id, 'invoice', transaction);
    const invoice = await Invoice.create(
      { firmId: firm.id, clientId: client.id, propertyId: property?.id ?? null, proposalId: null, kind: 'progress', number: `INV-${year}-${String(seq).padStart(4, '0')}`, status: 'open', taxRatePct: 5.5, termsDays: 30, notes: 'Work billed as done (demo).', issuedOn: plan.issuedOn, dueOn: addDays(plan.issuedOn, 30), sentAt: new Date(Date.parse(`${plan.issuedOn}T15:00:00Z`)), createdById: null },
      { transaction },
    );
    await InvoiceLine.bulkCreate(plan.lines.map((l, position) => ({ invoiceId: invoice.id, position, source: 'manual' as const, taskId: null, amountCents: 0, ...l })), { transaction });
    await recalcInvoice(invoice, transaction);
    if (plan.paid) {
      const receivedAt = new Date(Math.max(Date.now() - 2 * DAY_MS, Date.parse(`${today.slice(0, 8)}01T12:00:00Z`)));
      await InvoicePayment.create({ firmId: firm.id, invoiceId: invoice.id, amountCents: invoice.totalCents, processorPaymentId: `pi_demo_${firm.id}_${invoice.id}`, processorSessionId: null, receivedAt }, { transaction });
      await invoice.update({ status: 'paid', amountPaidCents: invoice.totalCents, paidAt: receivedAt }, { transaction });
    }
  }
  return plans.length;
}
