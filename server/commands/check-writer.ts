/**
 * Writes checks on a unit (establishment, browse, timber cruise) with their figures computed by
 * shared/domain/plot-checks, and decides the re-seeding a thin or failed establishment drafts. Each
 * write is one transaction with its audit record; a phone's idempotency key stores a check once.
 */
import type { Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Practice, Prescription, Task, Unit } from '../models';
import { UnitCheck } from '../models/unit-check';
import { findInFirm } from '../policies/firm-scope';
import { conflict, notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { computedColumns, computePrescriptionRecord } from './prescription-writer';
import { firmToday } from '../services/clock';
import { browseResult, establishmentResult, plotStatus, reseedRateFactor, scaledSeedRates, timberResult, type PlotCheckStatus } from '../../shared/domain/plot-checks';
import type { PracticeDefinition, PrescriptionParameters } from '../../shared/domain/practice';
import type { ReseedDraftDto, UnitCheckCreateValues } from '../../shared/schemas/checks';
import type { SessionUser } from '../../shared/schemas/auth';

/** The unit a person may check: staff of the firm, or crew with a task on it. */
export async function checkableUnit(actor: SessionUser, unitId: number, transaction?: Transaction): Promise<Unit> {
  const unit = await findInFirm(Unit, unitId, actor.firmId, 'That unit', { transaction });
  if (actor.role === 'crew') {
    const task = await Task.findOne({ where: { firmId: actor.firmId, unitId, assigneeId: actor.id }, attributes: ['id'], transaction });
    if (!task) throw notFound('That unit');
  }
  return unit;
}

/** The seed step of a practice, if it sows anything. */
export function seedStepOf(definition: PracticeDefinition) {
  return definition.steps.find((s) => s.application?.type === 'seed') ?? null;
}

/** The unit's latest prescription whose practice sows seed (the one a re-seeding repeats). */
async function latestSeededPrescription(unitId: number, transaction: Transaction): Promise<{ prescription: Prescription; practice: Practice } | null> {
  const prescriptions = await Prescription.findAll({ where: { unitId }, order: [['year', 'DESC'], ['id', 'DESC']], transaction });
  for (const prescription of prescriptions) {
    const practice = await Practice.findByPk(prescription.practiceId, { transaction });
    if (practice && seedStepOf(practice.definition)) return { prescription, practice };
  }
  return null;
}

interface Computed {
  input: Record<string, unknown>;
  result: Record<string, unknown>;
  status: PlotCheckStatus;
  reseed: ReseedDraftDto | null;
}

async function compute(unit: Unit, values: UnitCheckCreateValues, checkedOn: string, transaction: Transaction): Promise<Computed> {
  const season = Number(checkedOn.slice(0, 4));
  if (values.kind === 'establishment') {
    const { frameSqFt, samples, groundCoverPct, weedPressure } = values;
    const result = establishmentResult({ frameSqFt, samples, groundCoverPct, weedPressure });
    const factor = reseedRateFactor(result.status);
    let reseed: ReseedDraftDto | null = null;
    if (factor !== null) {
      const seeded = await latestSeededPrescription(unit.id, transaction);
      reseed = {
        status: 'proposed',
        rateFactor: factor,
        practiceId: seeded?.practice.id ?? null,
        practiceName: seeded?.practice.name ?? null,
        year: season,
        reason: `${result.status === 'failed' ? 'Failed' : 'Thin'} stand on ${unit.name}: ${result.reason} ${factor === 1 ? 'Sow again at the full rate.' : 'Overseed at half rate.'}`,
        prescriptionId: null,
      };
    }
    return { input: { frameSqFt, samples, groundCoverPct, weedPressure }, result: result as unknown as Record<string, unknown>, status: plotStatus({ kind: 'establishment', status: result.status }), reseed };
  }
  if (values.kind === 'browse') {
    const result = browseResult(values.pairs);
    return { input: { measure: values.measure, pairs: values.pairs }, result: result as unknown as Record<string, unknown>, status: plotStatus({ kind: 'browse', overallUsePct: result.overallUsePct }), reseed: null };
  }
  let target = values.targetResidualBaSqFtPerAcre ?? null;
  if (target === null) {
    const latest = await Prescription.findOne({ where: { unitId: unit.id }, order: [['year', 'DESC'], ['id', 'DESC']], transaction });
    const fromPrescription = (latest?.parameters as (PrescriptionParameters & { targetResidualBaSqFtPerAcre?: number }) | undefined)?.targetResidualBaSqFtPerAcre;
    target = typeof fromPrescription === 'number' ? fromPrescription : null;
  }
  const result = timberResult({ baf: values.baf, points: values.points, targetResidualBaSqFtPerAcre: target });
  return { input: { baf: values.baf, points: values.points, targetResidualBaSqFtPerAcre: target }, result: result as unknown as Record<string, unknown>, status: plotStatus({ kind: 'timber', excessBaSqFtPerAcre: result.excessBaSqFtPerAcre }), reseed: null };
}

/** Records a check on a unit; the same idempotency key answers the first check again (`replayed`). */
export async function createCheck(actor: SessionUser, unitId: number, values: UnitCheckCreateValues, idempotencyKey: string | null, ip: string | null): Promise<{ check: UnitCheck; replayed: boolean }> {
  return sequelize.transaction(async (transaction) => {
    const unit = await checkableUnit(actor, unitId, transaction);
    if (idempotencyKey) {
      const earlier = await UnitCheck.findOne({ where: { firmId: actor.firmId, idempotencyKey }, transaction });
      if (earlier) {
        if (earlier.unitId !== unit.id) throw conflict('This idempotency key was used for a check on another unit; make a new key for each check.');
        return { check: earlier, replayed: true };
      }
    }
    const checkedOn = values.checkedOn ?? (await firmToday(actor.firmId, transaction));
    const computed = await compute(unit, values, checkedOn, transaction);
    const check = await UnitCheck.create(
      {
        firmId: actor.firmId,
        propertyId: unit.propertyId,
        unitId: unit.id,
        kind: values.kind,
        checkedOn,
        season: Number(checkedOn.slice(0, 4)),
        ...computed,
        notes: values.notes ?? null,
        idempotencyKey,
        createdById: actor.id,
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'check.recorded', subjectType: 'Unit', subjectId: unit.id, data: { kind: values.kind, status: computed.status, checkId: check.id }, ip }, transaction);
    return { check, replayed: false };
  });
}

/**
 * Accepts or rejects the re-seeding a check drafted. Accepting writes the prescription — the practice
 * of the unit's seeded prescription with every seed rate scaled by the draft's factor — in the same
 * transaction as the decision.
 */
export async function decideReseed(actor: SessionUser, checkId: number, decision: 'accept' | 'reject', ip: string | null): Promise<UnitCheck> {
  return sequelize.transaction(async (transaction) => {
    const check = await findInFirm(UnitCheck, checkId, actor.firmId, 'That check', { transaction, lock: true });
    const draft = check.reseed;
    if (!draft) throw unprocessable('This check drafted no re-seeding: only a thin or failed establishment check does.');
    if (draft.status !== 'proposed') throw conflict(`This re-seeding was already ${draft.status}.`);
    if (decision === 'reject') {
      check.reseed = { ...draft, status: 'rejected' };
    } else {
      if (draft.practiceId === null) throw unprocessable('This unit has no seeded prescription to repeat: write the re-seeding as a new prescription on the unit.');
      const [unit, practice] = await Promise.all([Unit.findByPk(check.unitId, { transaction }), Practice.findOne({ where: { id: draft.practiceId, firmId: actor.firmId }, transaction })]);
      if (!unit || !practice) throw unprocessable('The unit or practice of this re-seeding no longer exists.');
      const step = seedStepOf(practice.definition)!;
      const components = step.application?.type === 'seed' ? step.application.components : [];
      const parameters: PrescriptionParameters = { steps: { [step.key]: { seedRatesLbPerAcre: scaledSeedRates(components, draft.rateFactor) } } };
      const computed = await computePrescriptionRecord({ firmId: actor.firmId, unit, practice, parameters });
      const prescription = await Prescription.create(
        {
          firmId: actor.firmId,
          propertyId: unit.propertyId,
          unitId: unit.id,
          practiceId: practice.id,
          targetDate: null,
          count: null,
          notes: draft.reason,
          parameters,
          ...computedColumns(computed),
          createdById: actor.id,
        },
        { transaction },
      );
      check.reseed = { ...draft, status: 'accepted', prescriptionId: prescription.id, year: computed.year };
    }
    check.changed('reseed', true);
    await check.save({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: `check.reseed-${decision}ed`, subjectType: 'Unit', subjectId: check.unitId, data: { checkId: check.id }, ip }, transaction);
    return check;
  });
}
