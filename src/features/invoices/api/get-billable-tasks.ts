import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { BillableTaskDto } from '../../../../shared/schemas/invoice';

/** Done tasks of a proposal that no invoice has billed yet. */
export const getBillableTasks = (proposalId: number, signal?: AbortSignal) => getData<BillableTaskDto[]>(`/api/invoices/billable-tasks?proposalId=${proposalId}`, signal);

export const getBillableTasksQueryOptions = (proposalId: number) => queryOptions({ queryKey: ['invoices', 'billable-tasks', proposalId], queryFn: ({ signal }) => getBillableTasks(proposalId, signal) });

/** The tasks a progress invoice may bill. */
export const useBillableTasks = (proposalId: number) => useQuery(getBillableTasksQueryOptions(proposalId));
