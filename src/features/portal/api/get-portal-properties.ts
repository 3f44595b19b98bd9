import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PortalProperties } from '../../../../shared/schemas/portal';
import { portalKeys, usePortalScope, type PortalScope } from './portal-scope';

/** GET {apiBase}/properties: the client's properties, the client and the firm. */
export const getPortalProperties = (scope: PortalScope, signal?: AbortSignal) => getData<PortalProperties>(`${scope.apiBase}/properties`, signal);

export const getPortalPropertiesQueryOptions = (scope: PortalScope) =>
  queryOptions({ queryKey: portalKeys.properties(scope), queryFn: ({ signal }) => getPortalProperties(scope, signal) });

/** The properties of the portal's client. */
export const usePortalProperties = () => useQuery(getPortalPropertiesQueryOptions(usePortalScope()));
