/**
 * Writes a prescription on a unit: the unit's measures (server-computed) and the firm's library go
 * through the shared computations — quantities and cost, the step schedule, cautions and the
 * landowner's summary — and the result is stored with the prescription.
 */
import { sequelize } from '../db/sequelize';
import { Firm, Practice, Prescription, Property, Unit } from '../models';
import { computePrescription } from '../../shared/domain/prescription-quantities';
import { practiceWindow, REGIONS, schedulePrescription, type Region } from '../../shared/domain/planting-windows';
import { cautionsForPractice } from '../../shared/domain/cautions';
import { summarizePrescription } from '../../shared/domain/prescription-summary';
import { KIND_STYLES } from '../../shared/domain/unit-kinds';
import type { PrescriptionCreateInput } from '../../shared/schemas/library';
import type { PrescriptionUpdateSchema } from '../../shared/schemas/library';
import type { z } from 'zod';
type PrescriptionUpdateInput = z.infer<typeof PrescriptionUpdateSchema>;
import type { PrescriptionParameters, UnitMeasures } from '../../shared/domain/practice';
import type { SessionUser } from '../../shared/schemas/auth';
import { loadLibrary } from '../services/library/library-reader';
import { notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { firmToday } from '../services/clock';


interface ComputeInput {
  firmId: number;
  unit: Unit;
  practice: Practice;
  year?: number;
  targetDate?: string;
  count?: number;
  parameters?: PrescriptionParameters;
}

/** Everything computed for a prescription, ready to store. */
export async function computePrescriptionRecord(input: ComputeInput) {
  const { unit, practice } = input;
  const definition = practice.definition;
  if (!definition.unitKinds.includes(unit.kind)) {
    const fits = definition.unitKinds.map((k) => KIND_STYLES[k].label.toLowerCase()).join(', ');
    throw unprocessable(`practiceId: “${practice.name}” is written for ${fits}; this unit is a ${KIND_STYLES[unit.kind].label.toLowerCase()}. Choose another practice or change the unit’s kind.`, [{ path: 'practiceId', message: 'practice does not fit the unit kind' }]);
  }
  const [library, property, firm] = await Promise.all([loadLibrary(input.firmId), Property.findByPk(unit.propertyId, { attributes: ['region'] }), Firm.findByPk(input.firmId, { attributes: ['region'] })]);
  const regionText = property?.region ?? firm?.region ?? 'midwest';
  const region: Region = (REGIONS as readonly string[]).includes(regionText) ? (regionText as Region) : 'midwest';
  const measures: UnitMeasures = {
    ...(unit.acres !== null ? { acres: unit.acres } : {}),
    ...(unit.lengthFt !== null ? { lengthFt: unit.lengthFt } : {}),
    ...(unit.perimeterFt !== null ? { perimeterFt: unit.perimeterFt } : {}),
    count: input.count ?? 1,
  };
  const today = await firmToday(input.firmId);
  let year = input.year ?? (input.targetDate ? Number(input.targetDate.slice(0, 4)) : Number(today.slice(0, 4)));
  // Without a year, plan for the next window that has not closed yet.
  if (input.year === undefined && !input.targetDate && practiceWindow(definition, region, year).latest < today) year += 1;
  const result = computePrescription({ unit: measures, practice: definition, materials: library.materials, rates: library.rates, parameters: input.parameters });
  const schedule = schedulePrescription({ practice: definition, region, year, targetDate: input.targetDate, today });
  const cautions = cautionsForPractice(definition, library.materials);
  const summary = summarizePrescription({ practice: definition, unit: measures, materials: library.materials, schedule, totalCents: result.totalCents });
  return { result, schedule, cautions, summary, year, totalCents: result.totalCents };
}

/** The stored columns of a computed prescription: its year, quantities and costs, schedule, cautions and summary. */
export function computedColumns(computed: Awaited<ReturnType<typeof computePrescriptionRecord>>) {
  const { year, result, schedule, cautions, summary, totalCents } = computed;
  return { year, result, schedule, cautions, summary, totalCents };
}

async function findUnit(unitId: number, firmId: number): Promise<Unit> {
  const unit = await Unit.findOne({ where: { id: unitId, firmId } });
  if (!unit) throw notFound('That unit');
  return unit;
}

async function findPractice(practiceId: number, firmId: number): Promise<Practice> {
  const practice = await Practice.findOne({ where: { id: practiceId, firmId } });
  if (!practice) throw unprocessable('practiceId: choose a practice from your firm’s library.', [{ path: 'practiceId', message: 'not in this firm’s library' }]);
  return practice;
}

/** Writes a new prescription on a unit. */
export async function createPrescription(actor: SessionUser, unitId: number, input: PrescriptionCreateInput, ip: string | null): Promise<Prescription> {
  const unit = await findUnit(unitId, actor.firmId);
  const practice = await findPractice(input.practiceId, actor.firmId);
  const computed = await computePrescriptionRecord({ firmId: actor.firmId, unit, practice, year: input.year, targetDate: input.targetDate, count: input.count, parameters: input.parameters });
  return sequelize.transaction(async (transaction) => {
    const row = await Prescription.create(
      {
        firmId: actor.firmId,
        propertyId: unit.propertyId,
        unitId: unit.id,
        practiceId: practice.id,
        targetDate: input.targetDate ?? null,
        count: input.count ?? null,
        notes: input.notes ?? null,
        parameters: input.parameters ?? {},
        ...computedColumns(computed),
        createdById: actor.id,
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'prescription.written', subjectType: 'Unit', subjectId: unit.id, data: { practice: practice.name, totalCents: computed.totalCents }, ip }, transaction);
    return row;
  });
}

/** Changes a prescription's parameters or dates and computes it again with the current library. */
export async function updatePrescription(actor: SessionUser, prescriptionId: number, input: PrescriptionUpdateInput, ip: string | null): Promise<Prescription> {
  const row = await Prescription.findOne({ where: { id: prescriptionId, firmId: actor.firmId } });
  if (!row) throw notFound('That prescription');
  const unit = await findUnit(row.unitId, actor.firmId);
  const practice = await findPractice(row.practiceId, actor.firmId);
  const next = {
    year: input.year ?? row.year,
    // null clears a value; undefined keeps the stored one.
    targetDate: input.targetDate !== undefined ? (input.targetDate ?? undefined) : (row.targetDate ?? undefined),
    count: input.count !== undefined ? (input.count ?? undefined) : (row.count ?? undefined),
    parameters: input.parameters ?? row.parameters,
  };
  const computed = await computePrescriptionRecord({ firmId: actor.firmId, unit, practice, ...next });
  return sequelize.transaction(async (transaction) => {
    await row.update(
      {
        targetDate: next.targetDate ?? null,
        count: next.count ?? null,
        notes: input.notes !== undefined ? (input.notes ?? null) : row.notes,
        parameters: next.parameters,
        ...computedColumns(computed),
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'prescription.revised', subjectType: 'Prescription', subjectId: row.id, ip }, transaction);
    return row;
  });
}

/** Deletes a prescription of the actor's firm (404 for any other), with its audit record, in one transaction. */
export async function deletePrescription(actor: SessionUser, prescriptionId: number, ip: string | null): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const row = await Prescription.findOne({ where: { id: prescriptionId, firmId: actor.firmId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('That prescription');
    await row.destroy({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'prescription.deleted', subjectType: 'Unit', subjectId: row.unitId, ip }, transaction);
  });
}
