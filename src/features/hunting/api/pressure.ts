import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { PressureRow, PressureWarning } from '../../../../shared/schemas/hunting';
import { huntingKeys } from './keys';

/** Pressure per stand this season. */
export const getPressure = (propertyId: number, signal?: AbortSignal) => api.get<{ data: PressureRow[]; meta: { season: number; maxSitsPerWeek: number } }>(`/api/properties/${propertyId}/pressure`, signal);

export const getPressureQueryOptions = (propertyId: number) => queryOptions({ queryKey: huntingKeys.pressure(propertyId), queryFn: ({ signal }) => getPressure(propertyId, signal) });

export const usePressure = (propertyId: number) => useQuery({ ...getPressureQueryOptions(propertyId), enabled: propertyId > 0 });

/** Stands sat more than the firm's weekly limit, on the properties the person may read. */
export const getPressureWarningsQueryOptions = () => queryOptions({ queryKey: huntingKeys.warnings, queryFn: ({ signal }) => getData<PressureWarning[]>('/api/pressure-warnings', signal) });

export const usePressureWarnings = () => useQuery(getPressureWarningsQueryOptions());
