/** The JSON shape of a check on a unit (type in shared/schemas/checks.ts): what was measured spread at the top, with `result`. */
import type { UnitCheckDto } from '../../shared/schemas/checks';
import type { UnitCheck } from '../models/unit-check';

/** A check as the API answers it. */
export function presentCheck(check: UnitCheck, unitName: string): UnitCheckDto {
  return {
    id: check.id,
    unitId: check.unitId,
    unitName,
    propertyId: check.propertyId,
    kind: check.kind,
    checkedOn: check.checkedOn,
    season: check.season,
    status: check.status,
    notes: check.notes,
    createdAt: check.createdAt.toISOString(),
    ...check.input,
    result: check.result,
    ...(check.kind === 'establishment' ? { reseed: check.reseed } : {}),
  } as unknown as UnitCheckDto;
}
