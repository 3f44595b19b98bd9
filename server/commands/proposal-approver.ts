/**
 * The client's decision on a sent proposal. Approval fixes the chosen options, re-prices, and keeps
 * the signed name, time, IP address, user agent and the SHA-256 of the canonical content — all in
 * one transaction with the e-mail to the consultant.
 */
import { Op, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Client, Firm, Property, Proposal, ProposalApproval, ProposalLine, User } from '../models';
import type { ApproveInput } from '../../shared/schemas/proposal';
import type { SessionUser } from '../../shared/schemas/auth';
import { conflict, forbidden, notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { proposalContentHash } from '../services/proposals/pricing';
import { reprice } from './proposal-writer';
import { takePlanSnapshot } from '../services/proposals/plan-snapshot';
import { enqueueEmail } from '../services/mail/outbox';
import { proposalDecidedEmail } from '../../templates/email/proposal-sent';
import { config } from '../config';
import { firmToday, now, usableZone } from '../services/clock';
import { formatDate } from '../../shared/domain/clock';
import { generateTasksForProposal } from './task-generator';
import { draftDepositInvoice } from './invoice-writer';

interface RequestContext {
  ip: string | null;
  userAgent: string | null;
}

async function lockForClient(actor: SessionUser, id: number, transaction: Transaction) {
  const proposal = await Proposal.findOne({ where: { id, firmId: actor.firmId }, lock: transaction.LOCK.UPDATE, transaction });
  if (!proposal || proposal.clientId !== actor.clientId || proposal.status === 'draft') throw notFound('That proposal');
  return proposal;
}

async function assertOpen(proposal: Proposal, transaction: Transaction): Promise<void> {
  if (proposal.status === 'approved') throw conflict('This proposal is approved already.');
  if (proposal.status === 'declined') throw conflict('This proposal was declined. Ask your consultant for a new version.');
  if (proposal.status === 'withdrawn') throw conflict('This version was withdrawn by your consultant. Look for the newer version in your portal.');
  // Expired means past its date in the firm's time zone: at 11:30 pm in Chicago it is still that day.
  if (proposal.expiresOn && proposal.expiresOn < (await firmToday(proposal.firmId, transaction))) throw conflict(`This proposal expired on ${formatDate(proposal.expiresOn)}. Ask your consultant to renew it.`);
}

async function notifyFirm(proposal: Proposal, decision: 'approved' | 'declined', extra: { signedName?: string; reason?: string }, transaction: Transaction) {
  const [firm, client, property, staff] = await Promise.all([
    Firm.findByPk(proposal.firmId, { transaction }),
    Client.findByPk(proposal.clientId, { transaction }),
    Property.findByPk(proposal.propertyId, { transaction }),
    User.findAll({ where: { firmId: proposal.firmId, active: true, [Op.or]: [{ id: proposal.createdById ?? 0 }, { role: 'owner' }] }, transaction }),
  ]);
  for (const user of staff) {
    await enqueueEmail(
      {
        firmId: proposal.firmId,
        kind: `proposal-${decision}`,
        to: user.email,
        email: proposalDecidedEmail({ firmName: firm?.name ?? '', clientName: client?.name ?? '', propertyName: property?.name ?? '', number: proposal.number, version: proposal.version, decision, totalCents: proposal.totalCents, url: `${config.publicUrl}/proposals/${proposal.id}`, decidedAt: proposal.decidedAt ?? undefined, timeZone: usableZone(firm?.timezone), ...extra }),
      },
      transaction,
    );
  }
}

/** Approves a sent proposal of the client's own, with the options they chose. */
export async function approveProposal(actor: SessionUser, id: number, input: ApproveInput, ctx: RequestContext): Promise<Proposal> {
  if (actor.role !== 'client' || !actor.clientId) throw forbidden('Only the landowner can approve a proposal.');
  return sequelize.transaction(async (transaction) => {
    const proposal = await lockForClient(actor, id, transaction);
    await assertOpen(proposal, transaction);
    const lines = await ProposalLine.findAll({ where: { proposalId: proposal.id }, order: [['position', 'ASC']], transaction });
    const optionIds = new Set(input.optionIds ?? []);
    const optional = lines.filter((l) => l.optional);
    const unknown = [...optionIds].filter((oid) => !optional.some((l) => l.id === oid));
    if (unknown.length) throw unprocessable(`optionIds: ${unknown.join(', ')} ${unknown.length === 1 ? 'is' : 'are'} not options of this proposal.`);
    // Two updates, whatever the number of options; the in-memory lines follow for the hash below.
    await ProposalLine.update({ selected: true }, { where: { proposalId: proposal.id, optional: true, id: [...optionIds] }, transaction });
    await ProposalLine.update({ selected: false }, { where: { proposalId: proposal.id, optional: true, id: { [Op.notIn]: [...optionIds, 0] } }, transaction });
    for (const line of optional) line.selected = optionIds.has(line.id);
    await reprice(proposal, transaction);
    // A version sent before plans were frozen is frozen now, at approval.
    if (!proposal.planSnapshot) await proposal.update({ planSnapshot: await takePlanSnapshot(proposal, transaction) }, { transaction });
    const { content, hash } = proposalContentHash(proposal, lines);
    const signedAt = now();
    await ProposalApproval.create({ proposalId: proposal.id, userId: actor.id, signedName: input.signedName, signedAt, ip: ctx.ip, userAgent: ctx.userAgent?.slice(0, 500) ?? null, contentHash: hash, content, selectedOptionIds: [...optionIds] }, { transaction });
    await proposal.update({ status: 'approved', decidedAt: signedAt }, { transaction });
    await generateTasksForProposal(proposal, transaction);
    await draftDepositInvoice(proposal, transaction);
    await notifyFirm(proposal, 'approved', { signedName: input.signedName }, transaction);
    await recordAudit({ firmId: proposal.firmId, userId: actor.id, action: 'proposal.approved', subjectType: 'Proposal', subjectId: proposal.id, data: { contentHash: hash, totalCents: proposal.totalCents }, ip: ctx.ip }, transaction);
    return proposal;
  });
}

/** Declines a sent proposal of the client's own, with a reason for the consultant. */
export async function declineProposal(actor: SessionUser, id: number, reason: string, ctx: RequestContext): Promise<Proposal> {
  if (actor.role !== 'client' || !actor.clientId) throw forbidden('Only the landowner can decline a proposal.');
  return sequelize.transaction(async (transaction) => {
    const proposal = await lockForClient(actor, id, transaction);
    await assertOpen(proposal, transaction);
    await proposal.update({ status: 'declined', decidedAt: new Date(), declineReason: reason }, { transaction });
    await notifyFirm(proposal, 'declined', { reason }, transaction);
    await recordAudit({ firmId: proposal.firmId, userId: actor.id, action: 'proposal.declined', subjectType: 'Proposal', subjectId: proposal.id, ip: ctx.ip }, transaction);
    return proposal;
  });
}
