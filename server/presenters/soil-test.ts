/** The JSON shape of a soil test (type in shared/schemas/soil-tests.ts). */
import type { SoilTestDto } from '../../shared/schemas/soil-tests';
import type { SoilTest } from '../models/soil-test';

/** A soil test with its recommendation and retest date. */
export function presentSoilTest(row: SoilTest, unitName: string): SoilTestDto {
  return {
    id: row.id,
    unitId: row.unitId,
    unitName,
    propertyId: row.propertyId,
    sampledOn: row.sampledOn,
    lab: row.lab,
    ph: row.ph,
    bufferPh: row.bufferPh,
    bufferMethod: row.bufferMethod,
    labMethod: row.labMethod,
    pPpm: row.pPpm,
    kPpm: row.kPpm,
    organicMatterPct: row.organicMatterPct,
    cec: row.cec,
    enmLbPerAcre: row.enmLbPerAcre,
    cropGroup: row.cropGroup,
    lime: row.recommendation.lime,
    nutrients: row.recommendation.nutrients,
    retestDue: row.retestDue,
    appliedPrescriptionId: row.appliedPrescriptionId,
  };
}
