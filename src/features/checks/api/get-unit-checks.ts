import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { UnitCheckCreateInput, UnitCheckDto } from '../../../../shared/schemas/checks';
import type { UnitDto } from '../../../../shared/schemas/unit';
import { checksKeys } from './keys';

/** GET /api/units/:id/checks: the unit's checks, newest first. */
export const getUnitChecks = (unitId: number, signal?: AbortSignal) => getData<UnitCheckDto[]>(`/api/units/${unitId}/checks`, signal);

export const getUnitChecksQueryOptions = (unitId: number) => queryOptions({ queryKey: checksKeys.unit(unitId), queryFn: ({ signal }) => getUnitChecks(unitId, signal) });

/** The checks of one unit. */
export const useUnitChecks = (unitId: number) => useQuery({ ...getUnitChecksQueryOptions(unitId), enabled: unitId > 0 });

/** GET /api/units/:id: the unit itself (name, kind, acres). */
export const getCheckedUnitQueryOptions = (unitId: number) =>
  queryOptions({ queryKey: checksKeys.unitDetail(unitId), queryFn: ({ signal }) => getData<UnitDto>(`/api/units/${unitId}`, signal) });

/** The unit a checks page is about. */
export const useCheckedUnit = (unitId: number) => useQuery({ ...getCheckedUnitQueryOptions(unitId), enabled: unitId > 0 });

/** POST /api/units/:id/checks. */
export const createUnitCheck = async ({ unitId, input }: { unitId: number; input: UnitCheckCreateInput }) =>
  (await api.post<{ data: UnitCheckDto }>(`/api/units/${unitId}/checks`, input)).data;

/** Records a check; the unit's checks and the property's plot statuses refetch. */
export function useCreateUnitCheck() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createUnitCheck, onSuccess: () => qc.invalidateQueries({ queryKey: checksKeys.all() }) });
}

/** POST /api/checks/:id/reseed { decision }. */
export const decideReseed = async ({ checkId, decision }: { checkId: number; decision: 'accept' | 'reject' }) =>
  (await api.post<{ data: UnitCheckDto }>(`/api/checks/${checkId}/reseed`, { decision })).data;

/** Accepts or rejects a drafted re-seeding; checks and prescriptions refetch. */
export function useDecideReseed() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: decideReseed,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: checksKeys.all() });
      void qc.invalidateQueries({ queryKey: ['prescriptions'] });
    },
  });
}
