/** Invoices: made from approved proposals by staff, paid by the client from the portal. */
import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import { defineRoutes, OWNER, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { waitForJob } from '../services/jobs/job-queue';
import { presentJob } from '../presenters/job';
import { Invoice, Task } from '../models';
import { sequelize } from '../db/sequelize';
import { IdParamsSchema, pageOf } from '../../shared/schemas/common';
import { BillableTasksQuerySchema, CheckoutSchema, InvoiceCreateSchema, InvoiceListQuerySchema, InvoiceUpdateSchema, LineParamsSchema, ManualLineSchema, RefundSchema, VoidSchema, type BillableTaskDto, type ReceivablesDto } from '../../shared/schemas/invoice';
import { actor, findIssuedInFirm } from '../policies/firm-scope';
import { addManualLine, createInvoice, removeManualLine, sendInvoice, updateInvoice, voidInvoice } from '../commands/invoice-writer';
import { refundPayment, startCheckout } from '../commands/payment-recorder';
import { listInvoiceRows, readInvoice, summarizeInvoices } from '../services/invoices/invoice-reader';
import { renderInvoicePdfFor } from '../services/invoices/invoice-pdf';
import { todayInZone, usableZone } from '../services/clock';
import { ageReceivables } from '../../shared/domain/invoicing';

const r = defineRoutes('/invoices');
const STAFF_AND_CLIENT = ['owner', 'consultant', 'client'] as const;

r.get('/', STAFF_AND_CLIENT, ...typed({ query: InvoiceListQuerySchema }, async ({ query }, req, res) => {
  const me = actor(req);
  const q = query;
  const where: Record<string | symbol, unknown> = { firmId: me.firmId };
  if (me.role === 'client') Object.assign(where, { clientId: me.clientId, status: { [Op.ne]: 'draft' } });
  else if (q.clientId) where.clientId = q.clientId;
  if (q.propertyId) where.propertyId = q.propertyId;
  if (q.proposalId) where.proposalId = q.proposalId;
  if (q.status) {
    if (me.role === 'client' && q.status === 'draft') return res.json({ data: [], page: pageOf(q, 0), summary: { count: 0, totalCents: 0, balanceCents: 0 } });
    where.status = q.status;
  }
  const [summary, data] = await Promise.all([summarizeInvoices(where as WhereOptions), listInvoiceRows(where as WhereOptions, todayInZone(me.firmTimezone), q)]);
  res.json({ data, page: pageOf(q, summary.count), summary });
}));

r.get('/receivables', STAFF, async (req, res) => {
  const { firmId, firmTimezone } = actor(req);
  const today = todayInZone(firmTimezone);
  const open = await Invoice.findAll({ where: { firmId, status: 'open' }, attributes: ['dueOn', 'totalCents', 'amountPaidCents'] });
  const items = open.map((i) => ({ dueOn: i.dueOn ?? today, balanceCents: Math.max(0, i.totalCents - i.amountPaidCents) }));
  const buckets = ageReceivables(items, today);
  const [paid] = await sequelize.query<{ cents: string | null }>(
    `SELECT sum(p.amount_cents - p.refunded_cents) AS cents FROM invoice_payments p WHERE p.firm_id = :firmId AND p.received_at >= (date_trunc('month', now() AT TIME ZONE :zone) AT TIME ZONE :zone)`,
    { replacements: { firmId, zone: usableZone(firmTimezone) }, type: QueryTypes.SELECT },
  );
  const answer: ReceivablesDto = {
    asOf: today,
    buckets,
    outstandingCents: buckets.reduce((s, b) => s + b.amountCents, 0),
    overdueCents: buckets.filter((b) => b.key !== 'current').reduce((s, b) => s + b.amountCents, 0),
    paidThisMonthCents: Number(paid?.cents ?? 0),
    draftCount: await Invoice.count({ where: { firmId, status: 'draft' } }),
  };
  res.json({ data: answer });
});

r.get('/billable-tasks', STAFF, ...typed({ query: BillableTasksQuerySchema }, async ({ query }, req, res) => {
  const { firmId } = actor(req);
  const { proposalId } = query;
  const tasks = await Task.findAll({ where: { firmId, proposalId, status: 'done', invoiceId: null }, order: [['position', 'ASC'], ['id', 'ASC']] });
  res.json({ data: tasks.map((t): BillableTaskDto => ({ id: t.id, name: t.name, unitName: t.unitName, doneOn: t.doneOn, costCents: t.costCents })) });
}));

r.post('/', STAFF, ...typed({ body: InvoiceCreateSchema }, async ({ body }, req, res) => {
  const { invoice, created } = await createInvoice(actor(req), body, req.ip ?? null);
  res.status(created ? 201 : 200).json({ data: await readInvoice(invoice) });
}));

r.get('/:id', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await readInvoice(await findIssuedInFirm(Invoice, params.id, actor(req), 'That invoice')) });
}));

r.get('/:id/pdf', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const invoice = await findIssuedInFirm(Invoice, params.id, actor(req), 'That invoice');
  const pdf = await renderInvoicePdfFor(invoice);
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `inline; filename="${invoice.number}.pdf"`);
  res.send(pdf);
}));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: InvoiceUpdateSchema }, async ({ params, body }, req, res) => {
  res.json({ data: await readInvoice(await updateInvoice(actor(req), params.id, body, req.ip ?? null)) });
}));

r.post('/:id/lines', STAFF, ...typed({ params: IdParamsSchema, body: ManualLineSchema }, async ({ params, body }, req, res) => {
  res.status(201).json({ data: await readInvoice(await addManualLine(actor(req), params.id, body, req.ip ?? null)) });
}));

r.delete('/:id/lines/:lineId', STAFF, ...typed({ params: LineParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await readInvoice(await removeManualLine(actor(req), params.id, params.lineId, req.ip ?? null)) });
}));

r.post('/:id/send', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { invoice, job } = await sendInvoice(actor(req), params.id, req.ip ?? null);
  // The PDF and e-mail are a job; a quick one is finished before the answer, which names it either way.
  const settled = await waitForJob(job.id);
  res.json({ data: await readInvoice(invoice), job: presentJob(settled ?? job) });
}));

r.post('/:id/void', STAFF, ...typed({ params: IdParamsSchema, body: VoidSchema }, async ({ params, body }, req, res) => {
  res.json({ data: await readInvoice(await voidInvoice(actor(req), params.id, body.reason, req.ip ?? null)) });
}));

r.post('/:id/refunds', OWNER, ...typed({ params: IdParamsSchema, body: RefundSchema }, async ({ params, body }, req, res) => {
  res.json({ data: await readInvoice(await refundPayment(actor(req), params.id, body, req.ip ?? null)) });
}));

r.post('/:id/checkout', ['client'], ...typed({ params: IdParamsSchema, body: CheckoutSchema }, async ({ params, body }, req, res) => {
  const { url, amountCents } = await startCheckout(actor(req), params.id, body);
  res.json({ data: { url, amountCents } });
}));

export const invoicesRouter = r.router;
