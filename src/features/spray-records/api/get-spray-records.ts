import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { SprayRecordList } from '../../../../shared/schemas/spray-records';

export interface SprayRecordFilter {
  season: number;
  propertyId?: number;
}

/** Query keys of spray records. */
export const sprayRecordKeys = {
  all: () => ['spray-records'] as const,
  list: (filter: SprayRecordFilter) => ['spray-records', filter] as const,
};

/** The address of a season's records, as JSON or as the CSV and PDF exports. */
export function sprayRecordsUrl(filter: SprayRecordFilter, format: 'json' | 'csv' | 'pdf' = 'json'): string {
  const q = new URLSearchParams({ season: String(filter.season), format });
  if (filter.propertyId) q.set('propertyId', String(filter.propertyId));
  return `/api/spray-records?${q.toString()}`;
}

export const getSprayRecordsQueryOptions = (filter: SprayRecordFilter) =>
  queryOptions({ queryKey: sprayRecordKeys.list(filter), queryFn: ({ signal }) => getData<SprayRecordList>(sprayRecordsUrl(filter), signal) });

/** A season's spray records of the firm or one property, with the caution every export carries. */
export const useSprayRecords = (filter: SprayRecordFilter) => useQuery({ ...getSprayRecordsQueryOptions(filter), placeholderData: keepPreviousData });
