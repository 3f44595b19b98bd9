import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { MaterialDto, MaterialKind } from '../../../../shared/schemas/library';
import { libraryKeys } from './keys';

export interface MaterialFilter {
  kind?: MaterialKind;
  /** Archived materials too (older prescriptions still use them). */
  includeArchived?: boolean;
}

/** GET /api/materials?kind=&includeArchived=. */
export function getMaterials(filter: MaterialFilter = {}, signal?: AbortSignal) {
  const query = new URLSearchParams();
  if (filter.kind) query.set('kind', filter.kind);
  if (filter.includeArchived) query.set('includeArchived', 'true');
  const qs = query.toString();
  return getData<MaterialDto[]>(`/api/materials${qs ? `?${qs}` : ''}`, signal);
}

export const getMaterialsQueryOptions = (filter: MaterialFilter = {}) =>
  queryOptions({ queryKey: libraryKeys.materials({ ...filter }), queryFn: ({ signal }) => getMaterials(filter, signal) });

/** The firm's materials, optionally of one kind. */
export const useMaterials = (filter: MaterialFilter = {}) => useQuery(getMaterialsQueryOptions(filter));
