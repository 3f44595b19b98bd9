import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { FieldHome } from '../../../../shared/schemas/desk';

export const getFieldHomeQueryOptions = () => queryOptions({ queryKey: ['field', 'home'], queryFn: () => getData<FieldHome>('/api/field/home') });
export const useFieldHome = () => useQuery(getFieldHomeQueryOptions());
