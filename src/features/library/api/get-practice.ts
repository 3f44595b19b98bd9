import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PracticeDto } from '../../../../shared/schemas/library';
import { libraryKeys } from './keys';

/** GET /api/practices/:id. */
export const getPractice = (id: number, signal?: AbortSignal) => getData<PracticeDto>(`/api/practices/${id}`, signal);

export const getPracticeQueryOptions = (id: number) => queryOptions({ queryKey: libraryKeys.practice(id), queryFn: ({ signal }) => getPractice(id, signal) });

/** One practice with its steps and cautions. */
export const usePractice = (id: number) => useQuery(getPracticeQueryOptions(id));
