import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { SoilTestContextDto, SoilTestCreateValues, SoilTestDto, SoilTestImportInput } from '../../../../shared/schemas/soil-tests';

/** Query keys of soil tests. */
export const soilTestKeys = {
  all: () => ['soil-tests'] as const,
  unit: (unitId: number) => ['soil-tests', { unitId }] as const,
  retestsDue: () => ['soil-tests', 'retests-due'] as const,
};

export const getUnitSoilTestsQueryOptions = (unitId: number) =>
  queryOptions({ queryKey: soilTestKeys.unit(unitId), queryFn: ({ signal }) => getData<SoilTestDto[]>(`/api/units/${unitId}/soil-tests`, signal) });

/** A unit's soil tests, newest first. */
export const useUnitSoilTests = (unitId: number) => useQuery({ ...getUnitSoilTestsQueryOptions(unitId), enabled: unitId > 0 });

export const getRetestsDueQueryOptions = () => queryOptions({ queryKey: soilTestKeys.retestsDue(), queryFn: ({ signal }) => getData<SoilTestDto[]>('/api/soil-tests/retests-due', signal) });

/** Units whose soil test is due again within 60 days (the Desk). */
export const useRetestsDue = () => useQuery(getRetestsDueQueryOptions());

/** POST /api/soil-tests/:id/apply: the recommendation written into the unit's prescription. */
export function useApplySoilTest() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (soilTestId: number) => (await api.post<{ data: { prescriptionId: number } }>(`/api/soil-tests/${soilTestId}/apply`)).data,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: soilTestKeys.all() });
      void qc.invalidateQueries({ queryKey: ['prescriptions'] });
    },
  });
}

export const getSoilTestContextQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: [...soilTestKeys.all(), 'context', { propertyId }] as const, queryFn: ({ signal }) => getData<SoilTestContextDto>(`/api/properties/${propertyId}/soil-test-context`, signal) });

/** The firm's state method and each unit's crop group on a property: what the browser previews a recommendation with. */
export const useSoilTestContext = (propertyId: number) => useQuery({ ...getSoilTestContextQueryOptions(propertyId), enabled: propertyId > 0 });

/** POST /api/units/:id/soil-tests: one lab result typed in. */
export function useCreateSoilTest() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ unitId, input }: { unitId: number; input: SoilTestCreateValues }) => (await api.post<{ data: SoilTestDto }>(`/api/units/${unitId}/soil-tests`, input)).data,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: soilTestKeys.all() });
      void qc.invalidateQueries({ queryKey: ['checks', 'history'] });
    },
  });
}

/** POST /api/properties/:id/soil-tests/import: a lab's file for several units, all rows or none. */
export function useImportSoilTests() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ propertyId, input }: { propertyId: number; input: SoilTestImportInput }) => (await api.post<{ data: SoilTestDto[] }>(`/api/properties/${propertyId}/soil-tests/import`, input)).data,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: soilTestKeys.all() });
      void qc.invalidateQueries({ queryKey: ['checks', 'history'] });
    },
  });
}
