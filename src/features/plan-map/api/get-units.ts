import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { UnitDto } from '../../../../shared/schemas/unit';
import { planMapKeys } from './keys';

/** GET /api/properties/:id/units: every unit of the property. */
export const getUnits = (propertyId: number, signal?: AbortSignal) => getData<UnitDto[]>(`/api/properties/${propertyId}/units`, signal);

export const getUnitsQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: planMapKeys.units(propertyId), queryFn: ({ signal }) => getUnits(propertyId, signal) });

/** The units of a property. */
export const useUnits = (propertyId: number) => useQuery(getUnitsQueryOptions(propertyId));

/**
 * Writes saved units into the cached list at once (the map redraws without a round trip), removes
 * the deleted ones, then refreshes the plan summary that depends on them.
 */
export function applyUnitChanges(qc: QueryClient, propertyId: number, change: { upsert?: UnitDto[]; remove?: number[] }): void {
  qc.setQueryData<UnitDto[]>(planMapKeys.units(propertyId), (old) => {
    let list = old ?? [];
    if (change.remove?.length) {
      const gone = new Set(change.remove);
      list = list.filter((u) => !gone.has(u.id));
    }
    for (const unit of change.upsert ?? []) {
      const i = list.findIndex((u) => u.id === unit.id);
      list = i === -1 ? [...list, unit] : list.map((u) => (u.id === unit.id ? unit : u));
    }
    return list;
  });
  void qc.invalidateQueries({ queryKey: planMapKeys.plan(propertyId) });
  void qc.invalidateQueries({ queryKey: planMapKeys.property(propertyId) });
}
