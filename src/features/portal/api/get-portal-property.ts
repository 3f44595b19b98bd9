import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PortalPropertyDetail } from '../../../../shared/schemas/portal';
import { portalKeys, usePortalScope, type PortalScope } from './portal-scope';

/** GET {apiBase}/properties/:id: the plan in plain words, cautions and progress of one property. */
export const getPortalProperty = (scope: PortalScope, id: number, signal?: AbortSignal) => getData<PortalPropertyDetail>(`${scope.apiBase}/properties/${id}`, signal);

export const getPortalPropertyQueryOptions = (scope: PortalScope, id: number) =>
  queryOptions({ queryKey: portalKeys.property(scope, id), queryFn: ({ signal }) => getPortalProperty(scope, id, signal) });

/** One property of the portal's client. */
export const usePortalProperty = (id: number) => useQuery(getPortalPropertyQueryOptions(usePortalScope(), id));
