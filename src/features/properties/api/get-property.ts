import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PropertyDto } from '../../../../shared/schemas/property';

/** One property with its boundary and computed acres. */
export const getProperty = (id: number, signal?: AbortSignal) => getData<PropertyDto>(`/api/properties/${id}`, signal);

export const getPropertyQueryOptions = (id: number) => queryOptions({ queryKey: ['properties', 'detail', id], queryFn: ({ signal }) => getProperty(id, signal) });

/** One property of the firm. */
export const useProperty = (id: number) => useQuery({ ...getPropertyQueryOptions(id), enabled: id > 0 });
