import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import { searchText, type SearchResultDto } from '../../../../shared/schemas/search';

/** The firm's records matching the text, best first. */
export const getSearch = (q: string, signal?: AbortSignal) => getData<SearchResultDto[]>(`/api/search?q=${encodeURIComponent(q)}`, signal);

export const getSearchQueryOptions = (q: string) =>
  queryOptions({ queryKey: ['search', q], queryFn: ({ signal }) => getSearch(q, signal), staleTime: 30_000 });

/** Search results for the header box; asks nothing while the text has nothing searchable. */
export const useSearch = (q: string) => useQuery({ ...getSearchQueryOptions(q), enabled: searchText(q) !== null, placeholderData: keepPreviousData });
