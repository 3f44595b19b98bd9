import { Link, useParams } from 'react-router-dom';
import { useProposal } from '../../../features/proposals/api/get-proposal';
import { PortalProposalView } from '../../../features/proposals/components/portal-proposal-view';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { ApiError } from '../../../lib/api-client';
import { parseId } from '../../../lib/route-params';
import { paths } from '../../../config/paths';

/** One proposal for its landowner (the e-mail links here). */
export function PortalProposalPage() {
  const id = parseId(useParams().id);
  const proposal = useProposal(id ?? 0);
  if (id === null || (proposal.isError && proposal.error instanceof ApiError && proposal.error.status === 404)) {
    return (
      <div role="alert" className="mx-auto mt-8 flex max-w-lg flex-col items-center gap-2 rounded-md border border-rule bg-card px-6 py-8 text-center">
        <h1 className="text-xl font-bold">This proposal is not in your portal</h1>
        <p className="text-sm text-slate">The link may be mistyped, or it belongs to another account. Your proposals are listed under Proposals.</p>
        <Link to={paths.portalProposals} className="mt-2 font-semibold text-moss-deep underline">
          Your proposals
        </Link>
      </div>
    );
  }
  if (proposal.isPending) return <Loading label="Loading the proposal…" />;
  if (proposal.isError) return <ErrorPanel error={proposal.error} onRetry={() => void proposal.refetch()} />;
  return <PortalProposalView key={proposal.data.id} proposal={proposal.data} />;
}
