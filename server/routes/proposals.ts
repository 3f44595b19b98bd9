/** Proposals: drafted from a plan's prescriptions, sent, and approved or declined by the landowner. */
import type { Request } from 'express';
import { Op, type WhereOptions } from 'sequelize';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { waitForJob } from '../services/jobs/job-queue';
import { presentJob } from '../presenters/job';
import { Client, Property, Proposal } from '../models';
import { IdParamsSchema, pageOf } from '../../shared/schemas/common';
import { ApproveSchema, DeclineSchema, ProposalCreateSchema, ProposalListQuerySchema, ProposalUpdateSchema } from '../../shared/schemas/proposal';
import { actor, findInFirm } from '../policies/firm-scope';
import { draftProposal, noteProposalViewed, reviseProposal, sendProposal, updateProposal, withdrawProposal } from '../commands/proposal-writer';
import { approveProposal, declineProposal } from '../commands/proposal-approver';
import { readProposal } from '../services/proposals/proposal-reader';
import { renderProposalPdfFor } from '../services/proposals/proposal-pdf';
import { displayStatus } from '../presenters/proposal';
import { notFound } from '../errors';
import { todayInZone } from '../services/clock';
import type { ProposalRowDto } from '../../shared/schemas/proposal-dto';

const perProperty = defineRoutes('/properties');
const r = defineRoutes('/proposals');
const STAFF_AND_CLIENT = ['owner', 'consultant', 'client'] as const;

/** A proposal the signed-in person may read: staff of its firm, or its client once it is sent. */
async function readable(req: Request, id: number): Promise<Proposal> {
  const me = actor(req);
  const proposal = await findInFirm(Proposal, id, me.firmId, 'That proposal');
  if (me.role === 'client' && (proposal.clientId !== me.clientId || proposal.status === 'draft')) throw notFound('That proposal');
  return proposal;
}

const ctx = (req: Request) => ({ ip: req.ip ?? null, userAgent: req.get('user-agent') ?? null });

/** List rows: numbers and totals without lines. */
async function listRows(where: WhereOptions, today: string, page?: { limit: number; offset: number }) {
  const rows = await Proposal.findAll({ where, order: [['createdAt', 'DESC'], ['version', 'DESC'], ['id', 'DESC']], limit: page?.limit, offset: page?.offset });
  const [properties, clients] = await Promise.all([
    Property.findAll({ where: { id: [...new Set(rows.map((p) => p.propertyId))] }, attributes: ['id', 'name'] }),
    Client.findAll({ where: { id: [...new Set(rows.map((p) => p.clientId))] }, attributes: ['id', 'name'] }),
  ]);
  const propertyName = new Map(properties.map((p) => [p.id, p.name]));
  const clientName = new Map(clients.map((c) => [c.id, c.name]));
  return rows.map((p): ProposalRowDto => ({
    id: p.id,
    seriesId: p.seriesId ?? p.id,
    number: p.number,
    version: p.version,
    status: displayStatus(p, today),
    title: p.title,
    propertyId: p.propertyId,
    propertyName: propertyName.get(p.propertyId) ?? '',
    clientId: p.clientId,
    clientName: clientName.get(p.clientId) ?? '',
    totalCents: p.totalCents,
    depositCents: p.depositCents,
    expiresOn: p.expiresOn,
    sentAt: p.sentAt?.toISOString() ?? null,
    firstViewedAt: p.firstViewedAt?.toISOString() ?? null,
    decidedAt: p.decidedAt?.toISOString() ?? null,
    updatedAt: p.updatedAt.toISOString(),
  }));
}

perProperty.get('/:id/proposals', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const property = await findInFirm(Property, params.id, firmId, 'That property');
  res.json({ data: await listRows({ firmId, propertyId: property.id }, todayInZone(actor(req).firmTimezone)) });
}));

perProperty.post('/:id/proposals', STAFF, ...typed({ params: IdParamsSchema, body: ProposalCreateSchema }, async ({ params, body }, req, res) => {
  const proposal = await draftProposal(actor(req), params.id, body, req.ip ?? null);
  res.status(201).json({ data: await readProposal(proposal) });
}));

r.get('/', STAFF_AND_CLIENT, ...typed({ query: ProposalListQuerySchema }, async ({ query }, req, res) => {
  const me = actor(req);
  const { status, propertyId } = query;
  const where: Record<string | symbol, unknown> = { firmId: me.firmId };
  if (me.role === 'client') Object.assign(where, { clientId: me.clientId, status: { [Op.ne]: 'draft' } });
  if (propertyId) where.propertyId = propertyId;
  const today = todayInZone(me.firmTimezone);
  if (status === 'expired') Object.assign(where, { status: 'sent', expiresOn: { [Op.lt]: today } });
  else if (status) {
    if (me.role === 'client' && status === 'draft') return res.json({ data: [], page: pageOf(query, 0) });
    where.status = status;
    if (status === 'sent') where.expiresOn = { [Op.or]: [{ [Op.gte]: today }, { [Op.is]: null }] };
  }
  const [total, data] = await Promise.all([Proposal.count({ where: where as WhereOptions }), listRows(where as WhereOptions, today, query)]);
  res.json({ data, page: pageOf(query, total) });
}));

r.get('/:id', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const proposal = await readable(req, params.id);
  const me = actor(req);
  if (me.role === 'client') await noteProposalViewed(me, proposal, req.ip ?? null);
  res.json({ data: await readProposal(proposal) });
}));

r.get('/:id/versions', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const proposal = await findInFirm(Proposal, params.id, firmId, 'That proposal');
  res.json({ data: await listRows({ firmId, seriesId: proposal.seriesId ?? proposal.id }, todayInZone(actor(req).firmTimezone)) });
}));

r.get('/:id/pdf', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const proposal = await readable(req, params.id);
  const pdf = await renderProposalPdfFor(proposal);
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `inline; filename="${proposal.number}-v${proposal.version}.pdf"`);
  res.send(pdf);
}));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: ProposalUpdateSchema }, async ({ params, body }, req, res) => {
  const proposal = await updateProposal(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: await readProposal(proposal) });
}));

r.post('/:id/send', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { proposal, job } = await sendProposal(actor(req), params.id, req.ip ?? null);
  // The PDF and e-mail are a job; a quick one is finished before the answer, which names it either way.
  const settled = await waitForJob(job.id);
  res.json({ data: await readProposal(proposal), job: presentJob(settled ?? job) });
}));

r.post('/:id/revise', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const proposal = await reviseProposal(actor(req), params.id, req.ip ?? null);
  res.status(201).json({ data: await readProposal(proposal) });
}));

r.post('/:id/withdraw', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const proposal = await withdrawProposal(actor(req), params.id, req.ip ?? null);
  res.json({ data: await readProposal(proposal) });
}));

r.post('/:id/approve', ['client'], ...typed({ params: IdParamsSchema, body: ApproveSchema }, async ({ params, body }, req, res) => {
  const proposal = await approveProposal(actor(req), params.id, body, ctx(req));
  res.json({ data: await readProposal(proposal) });
}));

r.post('/:id/decline', ['client'], ...typed({ params: IdParamsSchema, body: DeclineSchema }, async ({ params, body }, req, res) => {
  const proposal = await declineProposal(actor(req), params.id, body.reason, ctx(req));
  res.json({ data: await readProposal(proposal) });
}));

export const propertyProposalsRouter = perProperty.router;
export const proposalsRouter = r.router;
