import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { MaterialDto, PracticeDto } from '../../../../shared/schemas/library';
import type { ServiceRate } from '../../../../shared/domain/service-rates';
import type { FirmDto } from '../../../../shared/schemas/firm';
import { prescriptionKeys } from './keys';

/** GET /api/practices (the same list and key as the Library). */
export const getPracticesQueryOptions = () => queryOptions({ queryKey: prescriptionKeys.practices(), queryFn: ({ signal }) => getData<PracticeDto[]>('/api/practices', signal) });

/** GET /api/materials?includeArchived=true: every material a prescription may still use. */
export const getAllMaterialsQueryOptions = () =>
  queryOptions({ queryKey: prescriptionKeys.materials(), queryFn: ({ signal }) => getData<MaterialDto[]>('/api/materials?includeArchived=true', signal) });

/** GET /api/rates. */
export const getRatesQueryOptions = () =>
  queryOptions({ queryKey: prescriptionKeys.rates(), queryFn: ({ signal }) => getData<(ServiceRate & { id: number; archived: boolean; updatedAt: string })[]>('/api/rates', signal) });

/** GET /api/firm (its region places the schedule when the property has none). */
export const getFirmQueryOptions = () => queryOptions({ queryKey: prescriptionKeys.firm(), queryFn: ({ signal }) => getData<FirmDto>('/api/firm', signal), staleTime: 5 * 60_000 });

/** The firm's library as the live preview needs it: practices, every material, rates, and the firm's region. */
export function usePrescriptionLibrary() {
  const practices = useQuery(getPracticesQueryOptions());
  const materials = useQuery(getAllMaterialsQueryOptions());
  const rates = useQuery(getRatesQueryOptions());
  const firm = useQuery(getFirmQueryOptions());
  const queries = [practices, materials, rates];
  return {
    isPending: queries.some((q) => q.isPending),
    error: queries.find((q) => q.error)?.error ?? null,
    practices: practices.data ?? [],
    materials: materials.data ?? [],
    rates: rates.data ?? [],
    firmRegion: firm.data?.region ?? null,
  };
}
