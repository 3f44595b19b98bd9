import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PracticeDto } from '../../../../shared/schemas/library';
import { libraryKeys } from './keys';

/** GET /api/practices: the firm's practices (archived ones left out). */
export const getPractices = (signal?: AbortSignal) => getData<PracticeDto[]>('/api/practices', signal);

export const getPracticesQueryOptions = () => queryOptions({ queryKey: libraryKeys.practices(), queryFn: ({ signal }) => getPractices(signal) });

/** The firm's practices. */
export const usePractices = () => useQuery(getPracticesQueryOptions());
