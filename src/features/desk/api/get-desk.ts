import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { DeskSummary } from '../../../../shared/schemas/desk';

export const getDeskQueryOptions = () => queryOptions({ queryKey: ['desk'], queryFn: () => getData<DeskSummary>('/api/desk') });
export const useDesk = () => useQuery(getDeskQueryOptions());
