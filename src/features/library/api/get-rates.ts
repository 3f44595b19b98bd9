import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { RateDto } from '../lib/types';
import { libraryKeys } from './keys';

/** GET /api/rates: the firm's labor, equipment and fee rates. */
export const getRates = (signal?: AbortSignal) => getData<RateDto[]>('/api/rates', signal);

export const getRatesQueryOptions = () => queryOptions({ queryKey: libraryKeys.rates(), queryFn: ({ signal }) => getRates(signal) });

/** The firm's service rates. */
export const useRates = () => useQuery(getRatesQueryOptions());
