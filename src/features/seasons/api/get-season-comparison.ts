import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { SeasonComparisonDto } from '../../../../shared/schemas/season-comparison';

/** Query keys of season comparisons. */
export const seasonComparisonKeys = {
  all: () => ['season-comparison'] as const,
  detail: (propertyId: number, season: number | null) => ['season-comparison', { propertyId, season }] as const,
};

/** GET /api/properties/:id/season-comparison[?season=]: this season and last, per unit. */
export const getSeasonComparison = (propertyId: number, season: number | null, signal?: AbortSignal) =>
  getData<SeasonComparisonDto>(`/api/properties/${propertyId}/season-comparison${season ? `?season=${season}` : ''}`, signal);

export const getSeasonComparisonQueryOptions = (propertyId: number, season: number | null) =>
  queryOptions({ queryKey: seasonComparisonKeys.detail(propertyId, season), queryFn: ({ signal }) => getSeasonComparison(propertyId, season, signal) });

/** Two seasons of a property side by side (staff, or the client who owns it). */
export const useSeasonComparison = (propertyId: number, season: number | null) => useQuery({ ...getSeasonComparisonQueryOptions(propertyId, season), enabled: propertyId > 0 });
