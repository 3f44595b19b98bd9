import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { SharedFileDto } from '../../../../shared/schemas/file';
import { portalKeys, usePortalScope, type PortalScope } from './portal-scope';

/** The files the portal's client sees. */
export const getPortalFiles = (scope: PortalScope, signal?: AbortSignal) => getData<SharedFileDto[]>(scope.filesUrl, signal);

export const getPortalFilesQueryOptions = (scope: PortalScope) => queryOptions({ queryKey: portalKeys.files(scope), queryFn: ({ signal }) => getPortalFiles(scope, signal) });

/** The portal's files list. */
export const usePortalFiles = () => useQuery(getPortalFilesQueryOptions(usePortalScope()));
