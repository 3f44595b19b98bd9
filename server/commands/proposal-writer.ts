/** Drafts, edits, revises, sends and withdraws proposals. Approved and sent versions are immutable. */
import { firmDefaults } from '../services/firm-profile';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { clientRecipients } from '../services/mail/client-recipients';
import { Firm, Prescription, Property, Proposal, ProposalLine, Unit, type BackgroundJob } from '../models';
import type { ProposalCreateInput, ProposalUpdateInput } from '../../shared/schemas/proposal';
import type { SessionUser } from '../../shared/schemas/auth';
import { conflict, notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { priceProposal, totalsColumns } from '../services/proposals/pricing';
import { firmToday } from '../services/clock';
import { takePlanSnapshot } from '../services/proposals/plan-snapshot';
import { formatDate } from '../../shared/domain/clock';
import { enqueueJob } from '../services/jobs/job-queue';
import { addDays } from '../../shared/domain/planting-windows';

export const DEFAULT_TERMS = [
  'Prices hold until the date above. Material prices follow the supplier’s price on the day of purchase when they rise more than 5 %; we tell you before we buy.',
  'A deposit is due on approval; the balance is invoiced as work is completed. Payment is due within 30 days of an invoice.',
  'Planting dates depend on weather and soil conditions; we schedule each step inside its seasonal window and tell you when it moves.',
  'Herbicide, chainsaw and burning work is done by trained, licensed people, following product labels, local codes and state rules.',
].join('\n');

/** The default terms with the firm's payment terms in place of the 30 days (0 days reads "on receipt of an invoice"). */
export function defaultTerms(paymentTermsDays: number): string {
  const due = paymentTermsDays === 0 ? 'Payment is due on receipt of an invoice.' : `Payment is due within ${paymentTermsDays} day${paymentTermsDays === 1 ? '' : 's'} of an invoice.`;
  return DEFAULT_TERMS.replace('Payment is due within 30 days of an invoice.', due);
}

/** The next number of a firm's counter, allocated inside the transaction (no gaps, no duplicates). */
export async function nextFirmNumber(firmId: number, name: string, transaction: Transaction): Promise<number> {
  const [row] = await sequelize.query<{ value: number }>(
    `INSERT INTO firm_counters (firm_id, name, value) VALUES (:firmId, :name, 1)
     ON CONFLICT (firm_id, name) DO UPDATE SET value = firm_counters.value + 1 RETURNING value`,
    { replacements: { firmId, name }, type: QueryTypes.SELECT, transaction },
  );
  return row.value;
}

async function lockProposal(id: number, firmId: number, transaction: Transaction): Promise<Proposal> {
  const proposal = await Proposal.findOne({ where: { id, firmId }, lock: transaction.LOCK.UPDATE, transaction });
  if (!proposal) throw notFound('That proposal');
  return proposal;
}

/** Re-prices a proposal from its stored lines and saves the totals. */
export async function reprice(proposal: Proposal, transaction: Transaction): Promise<void> {
  const lines = await ProposalLine.findAll({ where: { proposalId: proposal.id }, order: [['position', 'ASC']], transaction });
  await proposal.update(totalsColumns(priceProposal(proposal, lines)), { transaction });
}

/** Drafts a proposal for a property from its prescriptions (all, or those chosen). */
export async function draftProposal(actor: SessionUser, propertyId: number, input: ProposalCreateInput, ip: string | null): Promise<Proposal> {
  return sequelize.transaction(async (transaction) => {
    const property = await Property.findOne({ where: { id: propertyId, firmId: actor.firmId }, transaction });
    if (!property) throw notFound('That property');
    const where = { firmId: actor.firmId, propertyId, ...(input.prescriptionIds ? { id: { [Op.in]: input.prescriptionIds } } : {}) };
    const prescriptions = await Prescription.findAll({ where, order: [['unitId', 'ASC'], ['id', 'ASC']], transaction });
    if (input.prescriptionIds && prescriptions.length !== new Set(input.prescriptionIds).size) {
      throw unprocessable('prescriptionIds: some of the chosen prescriptions are not on this property.');
    }
    const units = await Unit.findAll({ where: { id: prescriptions.map((p) => p.unitId) }, attributes: ['id', 'name'], transaction });
    const unitName = new Map(units.map((u) => [u.id, u.name]));
    const firm = await Firm.findByPk(actor.firmId, { transaction });
    const defaults = firmDefaults(firm);
    const seq = await nextFirmNumber(actor.firmId, 'proposal', transaction);
    const today = await firmToday(actor.firmId, transaction);
    const proposal = await Proposal.create(
      {
        firmId: actor.firmId,
        propertyId,
        clientId: property.clientId,
        seriesId: null,
        number: `P-${today.slice(0, 4)}-${String(seq).padStart(3, '0')}`,
        title: input.title ?? `Habitat plan for ${property.name}`,
        introduction: input.introduction ?? null,
        terms: input.terms ?? defaultTerms(defaults.paymentTermsDays),
        discount: input.discount ?? { kind: 'none' },
        taxRatePct: input.taxRatePct ?? defaults.taxRatePct,
        depositPct: input.depositPct ?? defaults.defaultDepositPct,
        expiresOn: input.expiresOn ?? addDays(today, defaults.proposalValidDays),
        createdById: actor.id,
      },
      { transaction },
    );
    await proposal.update({ seriesId: proposal.id }, { transaction });
    let position = 0;
    const rows = prescriptions.flatMap((p) =>
      p.result.lines.map((line) => ({
        proposalId: proposal.id,
        position: position++,
        unitId: p.unitId,
        prescriptionId: p.id,
        groupLabel: unitName.get(p.unitId) ?? 'Work',
        category: line.category,
        description: line.description,
        quantity: line.quantity.toFixed(4),
        unit: line.unit,
        unitPriceCents: line.unitPriceCents,
        // Materials are taxable goods by default; labor and equipment services are not (the firm may change each line).
        taxable: line.category === 'materials',
        optional: false,
        selected: true,
      })),
    );
    await ProposalLine.bulkCreate(rows, { transaction });
    await reprice(proposal, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'proposal.drafted', subjectType: 'Proposal', subjectId: proposal.id, data: { number: proposal.number }, ip }, transaction);
    return proposal;
  });
}

/** Edits a draft: its fields and, when given, all its lines. Anything but a draft is 409. */
export async function updateProposal(actor: SessionUser, id: number, input: ProposalUpdateInput, ip: string | null): Promise<Proposal> {
  return sequelize.transaction(async (transaction) => {
    const proposal = await lockProposal(id, actor.firmId, transaction);
    if (proposal.status !== 'draft') {
      throw conflict(`This proposal is ${proposal.status} and cannot change. Revise it to make a new version.`);
    }
    const { lines, ...fields } = input;
    await proposal.update(fields, { transaction });
    if (lines) {
      const unitIds = [...new Set(lines.map((l) => l.unitId).filter((u): u is number => !!u))];
      if (unitIds.length) {
        const count = await Unit.count({ where: { id: unitIds, propertyId: proposal.propertyId }, transaction });
        if (count !== unitIds.length) throw unprocessable('lines: a line points at a unit of another property.');
      }
      await ProposalLine.destroy({ where: { proposalId: proposal.id }, transaction });
      await ProposalLine.bulkCreate(
        lines.map((l, position) => ({
          proposalId: proposal.id,
          position,
          unitId: l.unitId ?? null,
          prescriptionId: l.prescriptionId ?? null,
          groupLabel: l.groupLabel,
          category: l.category,
          description: l.description,
          quantity: l.quantity,
          unit: l.unit,
          unitPriceCents: l.unitPriceCents,
          taxable: l.taxable,
          optional: l.optional,
          selected: !l.optional,
        })),
        { transaction },
      );
    }
    await reprice(proposal, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'proposal.edited', subjectType: 'Proposal', subjectId: proposal.id, ip }, transaction);
    return proposal;
  });
}

/** A new draft version with the same lines; a sent earlier version is withdrawn. Earlier versions stay readable. */
export async function reviseProposal(actor: SessionUser, id: number, ip: string | null): Promise<Proposal> {
  return sequelize.transaction(async (transaction) => {
    const old = await lockProposal(id, actor.firmId, transaction);
    const [latest] = await sequelize.query<{ v: number }>('SELECT max(version) AS v FROM proposals WHERE series_id = :s', { replacements: { s: old.seriesId ?? old.id }, type: QueryTypes.SELECT, transaction });
    if (await Proposal.count({ where: { seriesId: old.seriesId ?? old.id, status: 'draft' }, transaction })) {
      throw conflict('A draft version of this proposal exists already. Edit that one.');
    }
    const today = await firmToday(actor.firmId, transaction);
    const next = await Proposal.create(
      {
        firmId: old.firmId,
        propertyId: old.propertyId,
        clientId: old.clientId,
        seriesId: old.seriesId ?? old.id,
        number: old.number,
        version: Number(latest.v) + 1,
        title: old.title,
        introduction: old.introduction,
        terms: old.terms,
        currency: old.currency,
        discount: old.discount,
        taxRatePct: old.taxRatePct,
        depositPct: old.depositPct,
        expiresOn: old.expiresOn && old.expiresOn >= today ? old.expiresOn : addDays(today, 30),
        createdById: actor.id,
      },
      { transaction },
    );
    const lines = await ProposalLine.findAll({ where: { proposalId: old.id }, order: [['position', 'ASC']], transaction });
    await ProposalLine.bulkCreate(
      lines.map((l) => ({ ...l.get({ plain: true }), id: undefined, proposalId: next.id, selected: !l.optional })),
      { transaction },
    );
    if (old.status === 'sent') await old.update({ status: 'withdrawn', withdrawnAt: new Date() }, { transaction });
    await reprice(next, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'proposal.revised', subjectType: 'Proposal', subjectId: next.id, data: { from: old.id, version: next.version }, ip }, transaction);
    return next;
  });
}

/**
 * Sends a draft: marks it sent and, in the same transaction, hands the PDF and its e-mail (with the
 * portal link) to a background job; answers the proposal and that job.
 */
export async function sendProposal(actor: SessionUser, id: number, ip: string | null): Promise<{ proposal: Proposal; job: BackgroundJob }> {
  return sequelize.transaction(async (transaction) => {
    const proposal = await lockProposal(id, actor.firmId, transaction);
    if (proposal.status !== 'draft') throw conflict(`This proposal is ${proposal.status}; only a draft can be sent. Revise it to send a new version.`);
    const lineCount = await ProposalLine.count({ where: { proposalId: proposal.id }, transaction });
    if (lineCount === 0) throw unprocessable('Add at least one line before sending the proposal.');
    if (proposal.expiresOn && proposal.expiresOn < (await firmToday(actor.firmId, transaction))) throw unprocessable(`expiresOn: the valid-until date (${formatDate(proposal.expiresOn)}) has passed. Set a later date, then send.`);
    const recipients = await clientRecipients(proposal.clientId, transaction);
    if (recipients.length === 0) throw unprocessable('The client has no e-mail address or portal contact. Add one on the client’s page, then send.');
    // The plan is frozen with the version: its PDF and its approval cover this geometry, whatever is drawn later.
    await proposal.update({ status: 'sent', sentAt: new Date(), planSnapshot: await takePlanSnapshot(proposal, transaction) }, { transaction });
    const job = await enqueueJob(
      {
        kind: 'document-email',
        firmId: actor.firmId,
        createdById: actor.id,
        title: `E-mail proposal ${proposal.number} v${proposal.version} with its PDF`,
        subject: { type: 'Proposal', id: proposal.id },
        data: { document: 'proposal', id: proposal.id, firmId: actor.firmId, recipients, consultantName: actor.name },
      },
      transaction,
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'proposal.sent', subjectType: 'Proposal', subjectId: proposal.id, data: { to: recipients }, ip }, transaction);
    return { proposal, job };
  });
}

/** Withdraws a draft or sent proposal. */
export async function withdrawProposal(actor: SessionUser, id: number, ip: string | null): Promise<Proposal> {
  return sequelize.transaction(async (transaction) => {
    const proposal = await lockProposal(id, actor.firmId, transaction);
    if (proposal.status !== 'draft' && proposal.status !== 'sent') throw conflict(`This proposal is ${proposal.status} and cannot be withdrawn.`);
    await proposal.update({ status: 'withdrawn', withdrawnAt: new Date() }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'proposal.withdrawn', subjectType: 'Proposal', subjectId: proposal.id, ip }, transaction);
    return proposal;
  });
}

/**
 * Notes when the client first opened a sent proposal (shown on the Desk), with its audit record;
 * later views change nothing. A conditional update, so two first views at once store one time.
 */
export async function noteProposalViewed(actor: SessionUser, proposal: Proposal, ip: string | null): Promise<void> {
  if (proposal.firstViewedAt) return;
  await sequelize.transaction(async (transaction) => {
    const viewedAt = new Date();
    const [changed] = await Proposal.update({ firstViewedAt: viewedAt }, { where: { id: proposal.id, firmId: actor.firmId, firstViewedAt: null }, transaction });
    if (changed === 0) return;
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'proposal.first-viewed', subjectType: 'Proposal', subjectId: proposal.id, ip }, transaction);
    proposal.setDataValue('firstViewedAt', viewedAt);
  });
}
