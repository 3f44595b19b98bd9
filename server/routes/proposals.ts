/** Proposals: drafted from a plan's prescriptions, sent, and approved or declined by the landowner. */
import type { Request } from 'express';
import { Op, type WhereOptions } from 'sequelize';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { waitForJob } from '../services/jobs/job-queue';
import { presentJob } from '../presenters/job';
import { Property, Proposal } from '../models';
import { IdParamsSchema, pageOf } from '../../shared/schemas/common';
import { ApproveSchema, DeclineSchema, ProposalCreateSchema, ProposalListQuerySchema, ProposalUpdateSchema } from '../../shared/schemas/proposal';
import { actor, findInFirm, findIssuedInFirm } from '../policies/firm-scope';
import { draftProposal, noteProposalViewed, reviseProposal, sendProposal, updateProposal, withdrawProposal } from '../commands/proposal-writer';
import { approveProposal, declineProposal } from '../commands/proposal-approver';
import { readProposal } from '../services/proposals/proposal-reader';
import { renderProposalPdfFor } from '../services/proposals/proposal-pdf';
import { todayInZone } from '../services/clock';
import { proposalRows } from '../queries/proposals';

const perProperty = defineRoutes('/properties');
const r = defineRoutes('/proposals');
const STAFF_AND_CLIENT = ['owner', 'consultant', 'client'] as const;

const ctx = (req: Request) => ({ ip: req.ip ?? null, userAgent: req.get('user-agent') ?? null });

perProperty.get('/:id/proposals', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const property = await findInFirm(Property, params.id, firmId, 'That property');
  res.json({ data: await proposalRows({ firmId, propertyId: property.id }, todayInZone(actor(req).firmTimezone)) });
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
  const [total, data] = await Promise.all([Proposal.count({ where: where as WhereOptions }), proposalRows(where as WhereOptions, today, query)]);
  res.json({ data, page: pageOf(query, total) });
}));

r.get('/:id', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const proposal = await findIssuedInFirm(Proposal, params.id, actor(req), 'That proposal');
  const me = actor(req);
  if (me.role === 'client') await noteProposalViewed(me, proposal, req.ip ?? null);
  res.json({ data: await readProposal(proposal) });
}));

r.get('/:id/versions', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const proposal = await findInFirm(Proposal, params.id, firmId, 'That proposal');
  res.json({ data: await proposalRows({ firmId, seriesId: proposal.seriesId ?? proposal.id }, todayInZone(actor(req).firmTimezone)) });
}));

r.get('/:id/pdf', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const proposal = await findIssuedInFirm(Proposal, params.id, actor(req), 'That proposal');
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
