import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import { planMapKeys } from './keys';

/** The firm as GET /api/firm answers it (the parts the map needs). */
export interface FirmDto {
  id: number;
  name: string;
  settings: { tileUrlTemplate: string | null; tileAttribution?: string | null; taxRatePct?: number | null };
}

/** GET /api/firm. */
export const getFirm = (signal?: AbortSignal) => getData<FirmDto>('/api/firm', signal);

export const getFirmQueryOptions = () => queryOptions({ queryKey: planMapKeys.firm(), queryFn: ({ signal }) => getFirm(signal), staleTime: 5 * 60_000 });

/** The firm's settings (the background tile template). */
export const useFirm = () => useQuery(getFirmQueryOptions());
