import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { UnitHistoryDto } from '../../../../shared/schemas/unit-history';
import { checksKeys } from './keys';

/** GET /api/units/:id/history: prescriptions, work, checks and soil tests by season (under `['checks']`, so a new check refreshes it). */
export const getUnitHistoryQueryOptions = (unitId: number) =>
  queryOptions({ queryKey: checksKeys.history(unitId), queryFn: ({ signal }) => getData<UnitHistoryDto>(`/api/units/${unitId}/history`, signal) });

/** A unit's record per season, newest first. */
export const useUnitHistory = (unitId: number) => useQuery({ ...getUnitHistoryQueryOptions(unitId), enabled: unitId > 0 });
