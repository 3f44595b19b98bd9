import { useParams } from 'react-router-dom';
import { useProposal } from '../../../features/proposals/api/get-proposal';
import { ProposalBuilder } from '../../../features/proposals/components/proposal-builder';
import { ProposalDocument } from '../../../features/proposals/components/proposal-document';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { MissingRecord } from '../../../components/ui/missing-record';
import { ApiError } from '../../../lib/api-client';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';
import { ProposalInvoicesCard } from '../../../features/invoices/components/proposal-invoices-card';

/** One proposal: the builder while it is a draft, a read-only document after. */
export function ProposalPage() {
  const id = parseId(useParams().id);
  const proposal = useProposal(id ?? 0);
  if (id === null || (proposal.isError && proposal.error instanceof ApiError && proposal.error.status === 404)) {
    return <MissingRecord what="proposal" backTo={paths.proposals} backLabel="All proposals" />;
  }
  if (proposal.isPending) return <Loading label="Loading proposal…" />;
  if (proposal.isError) return <ErrorPanel error={proposal.error} onRetry={() => void proposal.refetch()} />;
  const p = proposal.data;
  if (p.status === 'draft') return <ProposalBuilder key={p.id} proposal={p} />;
  return (
    <div className="flex flex-col gap-4">
      <ProposalDocument key={p.id} proposal={p} />
      {p.status === 'approved' ? <ProposalInvoicesCard proposalId={p.id} totalCents={p.totalCents} /> : null}
    </div>
  );
}
