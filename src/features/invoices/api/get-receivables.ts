import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ReceivablesDto } from '../../../../shared/schemas/invoice';

/** Outstanding balances by age and this month's payments. */
export const getReceivables = (signal?: AbortSignal) => getData<ReceivablesDto>('/api/invoices/receivables', signal);

export const getReceivablesQueryOptions = () => queryOptions({ queryKey: ['invoices', 'receivables'], queryFn: ({ signal }) => getReceivables(signal) });

/** The receivables summary. */
export const useReceivables = () => useQuery(getReceivablesQueryOptions());
