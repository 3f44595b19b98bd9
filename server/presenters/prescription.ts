import type { Prescription } from '../models';

/** A prescription with its quantities (units of measure in the names), schedule, cautions and summary. */
export function presentPrescription(p: Prescription, practiceName: string, unitName?: string) {
  const r = p.result;
  return {
    id: p.id,
    unitId: p.unitId,
    unitName: unitName ?? null,
    propertyId: p.propertyId,
    practiceId: p.practiceId,
    practiceName,
    year: p.year,
    targetDate: p.targetDate,
    count: p.count,
    notes: p.notes,
    parameters: p.parameters,
    acres: r.acres,
    lengthFt: r.lengthFt,
    bulkSeedLb: r.bulkSeedLb,
    plsSeedLb: r.plsSeedLb,
    packages: r.packages,
    limeTons: r.limeTons,
    fertilizerProductLb: r.fertilizerProductLb,
    fertilizerBags: r.fertilizerBags,
    herbicideProductGal: r.herbicideProductGal,
    tankLoads: r.tankLoads,
    laborHours: r.laborHours,
    equipmentHours: r.equipmentHours,
    materialCents: r.materialCents,
    laborCents: r.laborCents,
    equipmentCents: r.equipmentCents,
    feesCents: r.feesCents,
    totalCents: p.totalCents,
    steps: r.steps,
    purchases: r.purchases,
    lines: r.lines,
    schedule: p.schedule,
    warnings: p.schedule.warnings,
    cautions: p.cautions,
    summary: p.summary,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}
export type PrescriptionDto = ReturnType<typeof presentPrescription>;
