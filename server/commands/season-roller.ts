/**
 * Rolls a property's plan into the next season: gathers each unit's evidence (its prescription, the
 * season before, the latest establishment and browse checks and soil test), drafts the plan with
 * shared/domain/next-season, records the consultant's decisions, and finally writes the new
 * season's prescriptions and a draft proposal.
 */
import { Op, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Material, Practice, Prescription, Property, Unit } from '../models';
import { UnitCheck } from '../models/unit-check';
import { SoilTest } from '../models/soil-test';
import { SeasonDraft } from '../models/season-draft';
import { findInFirm } from '../policies/firm-scope';
import { conflict, notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { computePrescriptionRecord } from './prescription-writer';
import { draftProposal } from './proposal-writer';
import { cropGroupOf } from '../../shared/domain/soil-tests';
import { parametersWithChanges, planNextSeason, type ChangeDecision, type SeedComponentEvidence, type UnitEvidence } from '../../shared/domain/next-season';
import type { BrowseResult, EstablishmentResult } from '../../shared/domain/plot-checks';
import type { SessionUser } from '../../shared/schemas/auth';

/** The crop family a practice sows, its seed components with their species, and its seed step. */
async function familyOf(practice: Practice, transaction: Transaction): Promise<{ family: string | null; components: SeedComponentEvidence[]; seedStepKey: string | null }> {
  const step = practice.definition.steps.find((s) => s.application?.type === 'seed');
  if (!step || step.application?.type !== 'seed') return { family: null, components: [], seedStepKey: null };
  const keys = step.application.components.map((c) => c.materialKey);
  const materials = await Material.findAll({ where: { firmId: practice.firmId, key: keys }, transaction });
  const species = new Map(materials.map((m) => [m.key, m.definition.type === 'seed' ? m.definition.species : m.key]));
  const components = step.application.components.map((c) => ({ materialKey: c.materialKey, species: species.get(c.materialKey) ?? c.materialKey, rateLbPerAcre: c.rateLbPerAcre }));
  return { family: cropGroupOf(components.map((c) => c.species)), components, seedStepKey: step.key };
}

/** The evidence of one unit for next season (null when it carries no prescription before `season`). */
async function evidenceOf(unit: Unit, season: number, transaction: Transaction): Promise<UnitEvidence | null> {
  const earlier = await Prescription.findAll({ where: { unitId: unit.id, year: { [Op.lt]: season } }, order: [['year', 'DESC'], ['id', 'ASC']], transaction });
  const current = earlier[0];
  if (!current) return null;
  // The unit's main prescription of its latest season: the first written that year (a re-seeding comes later).
  const practice = await Practice.findByPk(current.practiceId, { transaction });
  if (!practice) return null;
  const { family, components, seedStepKey } = await familyOf(practice, transaction);
  const before = earlier.find((p) => p.year < current.year);
  const beforePractice = before ? await Practice.findByPk(before.practiceId, { transaction }) : null;
  const previousFamily = beforePractice ? (await familyOf(beforePractice, transaction)).family : null;
  const [establishment, browse, soil] = await Promise.all([
    UnitCheck.findOne({ where: { unitId: unit.id, kind: 'establishment' }, order: [['checkedOn', 'DESC'], ['id', 'DESC']], transaction }),
    UnitCheck.findOne({ where: { unitId: unit.id, kind: 'browse' }, order: [['checkedOn', 'DESC'], ['id', 'DESC']], transaction }),
    SoilTest.findOne({ where: { unitId: unit.id }, order: [['sampledOn', 'DESC'], ['id', 'DESC']], transaction }),
  ]);
  const est = establishment?.result as unknown as EstablishmentResult | undefined;
  const br = browse?.result as unknown as BrowseResult | undefined;
  return {
    unitId: unit.id,
    unitName: unit.name,
    prescription: {
      practiceId: practice.id,
      practiceName: practice.name,
      family,
      seedStepKey,
      components,
      limeStepKey: practice.definition.steps.find((s) => s.application?.type === 'lime')?.key ?? null,
      fertilizerStepKey: practice.definition.steps.find((s) => s.application?.type === 'fertilizer' && (s.application.p2o5LbPerAcre > 0 || s.application.k2oLbPerAcre > 0))?.key ?? null,
      parameters: current.parameters ?? {},
    },
    previousFamily,
    establishment: establishment && est ? { status: est.status, checkedOn: establishment.checkedOn, reason: est.reason } : null,
    preference: br ? br.species.map((s) => ({ species: s.species, jacobsD: s.jacobsD })) : null,
    soilTest: soil ? { sampledOn: soil.sampledOn, limeTonsPerAcre: soil.recommendation.lime.tonsPerAcre, p2o5LbPerAcre: soil.recommendation.nutrients.p2o5LbPerAcre, k2oLbPerAcre: soil.recommendation.nutrients.k2oLbPerAcre, source: `${soil.recommendation.lime.source}; P and K ${soil.recommendation.nutrients.source}` } : null,
  };
}

/** Drafts next season's plan of a property; a season already drafted answers its draft (`existing`). */
export async function rollSeason(actor: SessionUser, propertyId: number, season: number, ip: string | null): Promise<{ draft: SeasonDraft; existing: boolean }> {
  return sequelize.transaction(async (transaction) => {
    const property = await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction, lock: true });
    const existing = await SeasonDraft.findOne({ where: { propertyId: property.id, season }, transaction });
    if (existing) return { draft: existing, existing: true };
    const units = await Unit.findAll({ where: { propertyId: property.id, firmId: actor.firmId }, order: [['name', 'ASC']], transaction });
    const evidence: UnitEvidence[] = [];
    for (const unit of units) {
      const e = await evidenceOf(unit, season, transaction);
      if (e) evidence.push(e);
    }
    if (evidence.length === 0) throw unprocessable(`season: no unit of this property carries a prescription before ${season}; write this season's plan first.`);
    const draft = await SeasonDraft.create({ firmId: actor.firmId, propertyId: property.id, season, plan: planNextSeason(season, evidence), proposalId: null, createdById: actor.id }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'season.drafted', subjectType: 'Property', subjectId: property.id, data: { season, changes: draft.plan.changes.length }, ip }, transaction);
    return { draft, existing: false };
  });
}

/** Accepts or rejects one change of a draft still open. */
export async function decideSeasonChange(actor: SessionUser, draftId: number, changeId: string, decision: ChangeDecision, ip: string | null): Promise<SeasonDraft> {
  return sequelize.transaction(async (transaction) => {
    const draft = await findInFirm(SeasonDraft, draftId, actor.firmId, 'That season draft', { transaction, lock: true });
    if (draft.status !== 'draft') throw conflict('This season’s plan is already written into prescriptions; change the prescriptions themselves.');
    if (!draft.plan.changes.some((c) => c.id === changeId)) throw notFound('That change');
    draft.plan = { ...draft.plan, changes: draft.plan.changes.map((c) => (c.id === changeId ? { ...c, decision } : c)) };
    await draft.save({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'season.change-decided', subjectType: 'Property', subjectId: draft.propertyId, data: { draftId, changeId, decision }, ip }, transaction);
    return draft;
  });
}

/**
 * Writes the new season's prescriptions (carried over, with the accepted changes) in one transaction,
 * then drafts the proposal of them. Changes still proposed are refused first, so nothing is half decided.
 */
export async function writeSeason(actor: SessionUser, draftId: number, ip: string | null): Promise<SeasonDraft> {
  const written = await sequelize.transaction(async (transaction) => {
    const draft = await findInFirm(SeasonDraft, draftId, actor.firmId, 'That season draft', { transaction, lock: true });
    if (draft.status === 'written') return draft;
    const open = draft.plan.changes.filter((c) => c.decision === 'proposed');
    if (open.length > 0) throw unprocessable(`changes: accept or reject every change first (${open.length} still open: ${open.map((c) => `${c.unitName} ${c.kind}`).join(', ')}).`);
    const ids: number[] = [];
    for (const unitPlan of draft.plan.units) {
      const [unit, practice] = await Promise.all([Unit.findOne({ where: { id: unitPlan.unitId, firmId: actor.firmId }, transaction }), Practice.findOne({ where: { id: unitPlan.practiceId, firmId: actor.firmId }, transaction })]);
      if (!unit || !practice) continue;
      const parameters = parametersWithChanges(unitPlan, draft.plan.changes);
      const reasons = draft.plan.changes.filter((c) => c.unitId === unit.id && c.decision === 'accepted').map((c) => c.reason);
      const computed = await computePrescriptionRecord({ firmId: actor.firmId, unit, practice, year: draft.season, parameters });
      const row = await Prescription.create(
        { firmId: actor.firmId, propertyId: unit.propertyId, unitId: unit.id, practiceId: practice.id, year: computed.year, targetDate: null, count: null, notes: reasons.length ? `Season ${draft.season}: ${reasons.join(' ')}` : `Carried over into ${draft.season}.`, parameters, result: computed.result, schedule: computed.schedule, cautions: computed.cautions, summary: computed.summary, totalCents: computed.totalCents, createdById: actor.id },
        { transaction },
      );
      ids.push(row.id);
    }
    draft.status = 'written';
    draft.prescriptionIds = ids;
    await draft.save({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'season.written', subjectType: 'Property', subjectId: draft.propertyId, data: { draftId, prescriptions: ids.length }, ip }, transaction);
    return draft;
  });
  if (written.proposalId === null && written.prescriptionIds.length > 0) {
    const proposal = await draftProposal(actor, written.propertyId, { prescriptionIds: written.prescriptionIds, title: `Habitat plan ${written.season}` }, ip);
    written.proposalId = proposal.id;
    await written.save();
  }
  return written;
}
