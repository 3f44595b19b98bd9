import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PortalHome } from '../../../../shared/schemas/desk';

export const getPortalHomeQueryOptions = () => queryOptions({ queryKey: ['portal', 'home'], queryFn: () => getData<PortalHome>('/api/portal/home') });
export const usePortalHome = () => useQuery(getPortalHomeQueryOptions());
