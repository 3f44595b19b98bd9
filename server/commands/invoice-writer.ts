/**
 * Drafts, edits, sends and voids invoices. Numbers come from the firm's counter inside the same
 * transaction (no gaps, no duplicates); every computation is in shared/domain/invoicing.ts.
 */
import { Op, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Firm, Invoice, InvoiceLine, Proposal, Task, type BackgroundJob } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import type { InvoiceCreateInput, InvoiceUpdateInput, ManualLineInput } from '../../shared/schemas/invoice';
import { conflict, notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { nextFirmNumber } from './proposal-writer';
import { clientRecipients } from '../services/mail/client-recipients';
import { firmToday } from '../services/clock';
import { DEFAULT_TERMS_DAYS, dueDate, finalInvoiceCents, invoiceAmounts, progressInvoicePlan, remainingToBillCents, type InvoiceKind, type InvoiceLineSource } from '../../shared/domain/invoicing';
import { invoiceDocumentSnapshot } from '../services/invoices/invoice-pdf';
import { enqueueJob } from '../services/jobs/job-queue';

/** Locks an invoice of the firm for update, or 404. */
export async function lockInvoice(id: number, firmId: number, transaction: Transaction): Promise<Invoice> {
  const invoice = await Invoice.findOne({ where: { id, firmId }, lock: transaction.LOCK.UPDATE, transaction });
  if (!invoice) throw notFound('That invoice');
  return invoice;
}

/** Recomputes an invoice's totals from its lines by the shared rule and saves them. */
export async function recalcInvoice(invoice: Invoice, transaction: Transaction): Promise<void> {
  const lines = await InvoiceLine.findAll({ where: { invoiceId: invoice.id }, transaction });
  const amounts = invoiceAmounts(
    lines.map((l) => ({ id: String(l.id), source: l.source, quantity: l.quantity, unitPriceCents: l.unitPriceCents, amountCents: l.amountCents, taxable: l.taxable })),
    invoice.taxRatePct,
  );
  for (const line of lines) {
    const amount = amounts.lineAmounts.get(String(line.id))!;
    if (amount !== line.amountCents) await line.update({ amountCents: amount }, { transaction });
  }
  await invoice.update({ subtotalCents: amounts.subtotalCents, taxCents: amounts.taxCents, totalCents: amounts.totalCents, billedCents: amounts.billedCents }, { transaction });
}

async function newInvoice(proposal: Proposal, kind: InvoiceKind, createdById: number | null, transaction: Transaction): Promise<Invoice> {
  const seq = await nextFirmNumber(proposal.firmId, 'invoice', transaction);
  const firm = await Firm.findByPk(proposal.firmId, { attributes: ['settings'], transaction });
  const settings = (firm?.settings ?? {}) as { invoiceTermsDays?: number };
  return Invoice.create(
    {
      firmId: proposal.firmId,
      clientId: proposal.clientId,
      propertyId: proposal.propertyId,
      proposalId: proposal.id,
      kind,
      number: `INV-${(await firmToday(proposal.firmId, transaction)).slice(0, 4)}-${String(seq).padStart(4, '0')}`,
      currency: proposal.currency,
      taxRatePct: proposal.taxRatePct,
      termsDays: settings.invoiceTermsDays ?? DEFAULT_TERMS_DAYS,
      createdById,
    },
    { transaction },
  );
}

/** Invoices of a proposal that are not void, with what they billed from it. */
async function liveInvoices(proposalId: number, transaction: Transaction): Promise<Invoice[]> {
  return Invoice.findAll({ where: { proposalId, status: { [Op.ne]: 'void' } }, transaction });
}

/**
 * Drafts the deposit invoice of a just-approved proposal, inside the approval's transaction (when
 * the proposal asks for a deposit and none is drafted yet). Answers the invoice, or null.
 */
export async function draftDepositInvoice(proposal: Proposal, transaction: Transaction, createdById: number | null = proposal.createdById): Promise<Invoice | null> {
  if (proposal.depositCents <= 0) return null;
  const existing = await Invoice.findOne({ where: { proposalId: proposal.id, kind: 'deposit', status: { [Op.ne]: 'void' } }, transaction });
  if (existing) return existing;
  const invoice = await newInvoice(proposal, 'deposit', createdById, transaction);
  await InvoiceLine.create(
    {
      invoiceId: invoice.id,
      position: 0,
      source: 'deposit',
      taskId: null,
      description: `Deposit on approval of proposal ${proposal.number} (${Number(proposal.depositPct)} % of the approved total)`,
      quantity: '1',
      unitPriceCents: proposal.depositCents,
      amountCents: proposal.depositCents,
    },
    { transaction },
  );
  await recalcInvoice(invoice, transaction);
  await recordAudit({ firmId: proposal.firmId, userId: createdById, action: 'invoice.drafted', subjectType: 'Invoice', subjectId: invoice.id, data: { number: invoice.number, kind: 'deposit' } }, transaction);
  return invoice;
}

/**
 * Creates an invoice from an approved proposal: the deposit (answers the existing draft), a
 * progress invoice for done tasks not billed yet, or the final invoice for the rest.
 */
export async function createInvoice(actor: SessionUser, input: InvoiceCreateInput, ip: string | null): Promise<{ invoice: Invoice; created: boolean }> {
  return sequelize.transaction(async (transaction) => {
    // The proposal row lock serializes every invoice made from it, so remainders stay exact.
    const proposal = await Proposal.findOne({ where: { id: input.proposalId, firmId: actor.firmId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!proposal) throw notFound('That proposal');
    if (proposal.status !== 'approved') throw conflict(`Proposal ${proposal.number} is ${proposal.status}; only an approved proposal can be invoiced.`);
    const live = await liveInvoices(proposal.id, transaction);

    if (input.kind === 'deposit') {
      const deposit = live.find((i) => i.kind === 'deposit');
      if (deposit && deposit.status !== 'draft') throw conflict(`The deposit invoice ${deposit.number} is issued already (${deposit.status}). Void it first to bill the deposit again.`);
      if (deposit) return { invoice: deposit, created: false };
      if (proposal.depositCents <= 0) throw unprocessable(`Proposal ${proposal.number} asks for no deposit. Make a progress or final invoice instead.`);
      const invoice = (await draftDepositInvoice(proposal, transaction, actor.id))!;
      return { invoice, created: true };
    }

    if (live.some((i) => i.kind === 'final')) throw conflict(`The final invoice of proposal ${proposal.number} exists already; it bills everything left. Void it first to bill more.`);
    const billedBefore = live.map((i) => i.billedCents);

    if (input.kind === 'final') {
      let rest: number;
      try {
        rest = finalInvoiceCents(proposal.totalCents, billedBefore);
      } catch {
        throw conflict(`Nothing is left to bill on proposal ${proposal.number}: its invoices already come to its total.`);
      }
      const invoice = await newInvoice(proposal, 'final', actor.id, transaction);
      await InvoiceLine.create(
        { invoiceId: invoice.id, position: 0, source: 'final', taskId: null, description: `Balance of proposal ${proposal.number}: the approved total less the invoices before this one`, quantity: '1', unitPriceCents: rest, amountCents: rest },
        { transaction },
      );
      await recalcInvoice(invoice, transaction);
      await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'invoice.drafted', subjectType: 'Invoice', subjectId: invoice.id, data: { number: invoice.number, kind: 'final', amountCents: rest }, ip }, transaction);
      return { invoice, created: true };
    }

    // Progress: done tasks of this proposal that no invoice has billed, locked against a parallel invoice.
    const where = { firmId: actor.firmId, proposalId: proposal.id, status: 'done', invoiceId: null, ...(input.taskIds ? { id: input.taskIds } : {}) };
    const tasks = await Task.findAll({ where, order: [['position', 'ASC'], ['id', 'ASC']], lock: transaction.LOCK.UPDATE, transaction });
    if (input.taskIds) {
      const found = new Set(tasks.map((t) => t.id));
      const missing = input.taskIds.filter((tid) => !found.has(tid));
      if (missing.length) throw unprocessable(`taskIds: ${missing.join(', ')} ${missing.length === 1 ? 'is not a done, unbilled task' : 'are not done, unbilled tasks'} of proposal ${proposal.number}.`);
    }
    const depositBilled = live.filter((i) => i.kind === 'deposit').reduce((s, i) => s + i.billedCents, 0);
    const credited = live.filter((i) => i.kind === 'progress').length
      ? -((await InvoiceLine.sum('amountCents', { where: { source: 'deposit-credit', invoiceId: live.filter((i) => i.kind === 'progress').map((i) => i.id) }, transaction })) ?? 0)
      : 0;
    let plan;
    try {
      plan = progressInvoicePlan({
        tasks: tasks.map((t) => ({ id: t.id, description: `${t.name} — ${t.unitName}`, costCents: t.costCents })),
        depositPct: proposal.depositPct.toFixed(4),
        depositUncreditedCents: Math.max(0, depositBilled - credited),
        remainingCents: remainingToBillCents(proposal.totalCents, billedBefore),
      });
    } catch (err) {
      throw conflict((err as Error).message);
    }
    const invoice = await newInvoice(proposal, 'progress', actor.id, transaction);
    const rows: { invoiceId: number; position: number; source: InvoiceLineSource; taskId: number | null; description: string; quantity: string; unitPriceCents: number; amountCents: number }[] = plan.taskLines.map((l, position) => ({ invoiceId: invoice.id, position, source: 'task' as const, taskId: l.taskId, description: l.description, quantity: '1', unitPriceCents: l.amountCents, amountCents: l.amountCents }));
    if (plan.creditCents > 0) {
      rows.push({ invoiceId: invoice.id, position: rows.length, source: 'deposit-credit', taskId: null, description: 'Less the deposit already billed, applied in proportion to this work', quantity: '1', unitPriceCents: -plan.creditCents, amountCents: -plan.creditCents });
    }
    await InvoiceLine.bulkCreate(rows, { transaction });
    await Task.update({ invoiceId: invoice.id }, { where: { id: tasks.map((t) => t.id) }, transaction });
    await recalcInvoice(invoice, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'invoice.drafted', subjectType: 'Invoice', subjectId: invoice.id, data: { number: invoice.number, kind: 'progress', taskIds: tasks.map((t) => t.id) }, ip }, transaction);
    return { invoice, created: true };
  });
}

function assertDraft(invoice: Invoice): void {
  if (invoice.status !== 'draft') throw conflict(`Invoice ${invoice.number} is ${invoice.status}; only a draft can change. Void it and make a new one to change what it bills.`);
}

/** Edits a draft's terms and notes. */
export async function updateInvoice(actor: SessionUser, id: number, input: InvoiceUpdateInput, ip: string | null): Promise<Invoice> {
  return sequelize.transaction(async (transaction) => {
    const invoice = await lockInvoice(id, actor.firmId, transaction);
    assertDraft(invoice);
    await invoice.update({ ...(input.termsDays !== undefined ? { termsDays: input.termsDays } : {}), ...(input.notes !== undefined ? { notes: input.notes } : {}) }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'invoice.edited', subjectType: 'Invoice', subjectId: invoice.id, ip }, transaction);
    return invoice;
  });
}

/** Adds a manual line to a draft (priced and taxed by the proposal rule). */
export async function addManualLine(actor: SessionUser, id: number, input: ManualLineInput, ip: string | null): Promise<Invoice> {
  return sequelize.transaction(async (transaction) => {
    const invoice = await lockInvoice(id, actor.firmId, transaction);
    assertDraft(invoice);
    const position = ((await InvoiceLine.max<number, InvoiceLine>('position', { where: { invoiceId: invoice.id }, transaction })) ?? -1) + 1;
    await InvoiceLine.create({ invoiceId: invoice.id, position, source: 'manual', taskId: null, description: input.description, quantity: input.quantity, unit: input.unit, unitPriceCents: input.unitPriceCents, amountCents: 0, taxable: input.taxable }, { transaction });
    await recalcInvoice(invoice, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'invoice.line-added', subjectType: 'Invoice', subjectId: invoice.id, data: { description: input.description }, ip }, transaction);
    return invoice;
  });
}

/** Removes a manual line from a draft; lines billed from the proposal stay (void the invoice instead). */
export async function removeManualLine(actor: SessionUser, id: number, lineId: number, ip: string | null): Promise<Invoice> {
  return sequelize.transaction(async (transaction) => {
    const invoice = await lockInvoice(id, actor.firmId, transaction);
    assertDraft(invoice);
    const line = await InvoiceLine.findOne({ where: { id: lineId, invoiceId: invoice.id }, transaction });
    if (!line) throw notFound('That invoice line');
    if (line.source !== 'manual') throw conflict('This line is billed from the proposal and cannot be removed on its own. Void the invoice to bill it differently.');
    await line.destroy({ transaction });
    await recalcInvoice(invoice, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'invoice.line-removed', subjectType: 'Invoice', subjectId: invoice.id, ip }, transaction);
    return invoice;
  });
}

/**
 * Issues a draft (draft → open, dated, due by its terms) or re-sends an open invoice; the PDF and
 * its e-mail are a background job handed over in the same transaction. Answers the invoice and the job.
 */
export async function sendInvoice(actor: SessionUser, id: number, ip: string | null): Promise<{ invoice: Invoice; job: BackgroundJob }> {
  return sequelize.transaction(async (transaction) => {
    const invoice = await lockInvoice(id, actor.firmId, transaction);
    if (invoice.status !== 'draft' && invoice.status !== 'open') throw conflict(`Invoice ${invoice.number} is ${invoice.status} and cannot be sent.`);
    if (invoice.totalCents <= 0) throw unprocessable('This invoice comes to nothing. Add a line before sending it.');
    const recipients = await clientRecipients(invoice.clientId, transaction);
    if (recipients.length === 0) throw unprocessable('The client has no e-mail address or portal contact. Add one on the client’s page, then send.');
    if (invoice.status === 'draft') {
      const issuedOn = await firmToday(invoice.firmId, transaction);
      await invoice.update({ status: 'open', issuedOn, dueOn: dueDate(issuedOn, invoice.termsDays), sentAt: new Date() }, { transaction });
      // Issued: what the PDF shows is kept, so the sent invoice reads the same forever.
      await invoice.update({ documentSnapshot: await invoiceDocumentSnapshot(invoice, transaction) }, { transaction });
    }
    const job = await enqueueJob(
      {
        kind: 'document-email',
        firmId: invoice.firmId,
        createdById: actor.id,
        title: `E-mail invoice ${invoice.number} with its PDF`,
        subject: { type: 'Invoice', id: invoice.id },
        data: { document: 'invoice', id: invoice.id, firmId: invoice.firmId, recipients, consultantName: actor.name },
      },
      transaction,
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'invoice.sent', subjectType: 'Invoice', subjectId: invoice.id, data: { to: recipients, totalCents: invoice.totalCents }, ip }, transaction);
    return { invoice, job };
  });
}

/** Voids a draft or an open invoice with no payments; its tasks can be billed again. */
export async function voidInvoice(actor: SessionUser, id: number, reason: string, ip: string | null): Promise<Invoice> {
  return sequelize.transaction(async (transaction) => {
    const invoice = await lockInvoice(id, actor.firmId, transaction);
    if (invoice.status === 'void') throw conflict(`Invoice ${invoice.number} is void already.`);
    if (invoice.status === 'paid' || invoice.amountPaidCents > 0) throw conflict(`Invoice ${invoice.number} has payments. Refund them first; a paid invoice cannot be voided.`);
    await invoice.update({ status: 'void', voidedAt: new Date(), voidReason: reason }, { transaction });
    await Task.update({ invoiceId: null }, { where: { invoiceId: invoice.id }, transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'invoice.voided', subjectType: 'Invoice', subjectId: invoice.id, data: { reason }, ip }, transaction);
    return invoice;
  });
}
