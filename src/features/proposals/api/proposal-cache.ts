import type { QueryClient } from '@tanstack/react-query';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';

/**
 * After a write: the answer becomes the cached detail, and every other proposal query (lists,
 * versions, other details) and the desk refetch.
 */
export function storeProposal(qc: QueryClient, proposal: ProposalDto): Promise<unknown> {
  qc.setQueryData(['proposals', 'detail', proposal.id], proposal);
  const isThis = (key: readonly unknown[]) => key[1] === 'detail' && key[2] === proposal.id;
  return Promise.all([
    qc.invalidateQueries({ queryKey: ['proposals'], predicate: (q) => !isThis(q.queryKey) }),
    qc.invalidateQueries({ queryKey: ['desk'] }),
  ]);
}
