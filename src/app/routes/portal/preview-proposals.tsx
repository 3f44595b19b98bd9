import { useProposals } from '../../../features/proposals/api/get-proposals';
import { PortalProposalCard } from '../../../features/proposals/components/portal-proposal-card';
import { usePortalScope } from '../../../features/portal/api/portal-scope';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';

/** The client's proposals as the client lists them (sent ones, never drafts), in the consultant's preview. */
export function PreviewProposalsPage() {
  const scope = usePortalScope();
  const proposals = useProposals();
  if (proposals.isPending) return <Loading label="Loading the proposals…" />;
  if (proposals.isError) return <ErrorPanel error={proposals.error} onRetry={() => void proposals.refetch()} />;
  const rows = proposals.data.filter((p) => p.clientId === scope.clientId && p.status !== 'draft');
  return (
    <div className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Proposals</h1>
        <p className="text-slate">The priced plans your consultant has sent you.</p>
      </div>
      {rows.length === 0 ? <EmptyState title="No proposals yet">When your consultant sends a proposal, it appears here and in your e-mail.</EmptyState> : null}
      <ul className="grid gap-3 sm:grid-cols-2">
        {rows.map((p) => (
          <li key={p.id}>
            <PortalProposalCard proposal={p} to={scope.links.proposal(p.id)} />
          </li>
        ))}
      </ul>
    </div>
  );
}
