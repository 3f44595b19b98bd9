import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { FirmDto } from '../../../../shared/schemas/firm';
import { planMapKeys } from './keys';

/** GET /api/firm. */
export const getFirm = (signal?: AbortSignal) => getData<FirmDto>('/api/firm', signal);

export const getFirmQueryOptions = () => queryOptions({ queryKey: planMapKeys.firm(), queryFn: ({ signal }) => getFirm(signal), staleTime: 5 * 60_000 });

/** The firm's settings (the background tile template). */
export const useFirm = () => useQuery(getFirmQueryOptions());
