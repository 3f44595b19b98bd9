import { useProposals } from '../../../features/proposals/api/get-proposals';
import { PortalProposalCard } from '../../../features/proposals/components/portal-proposal-card';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';

/** The landowner's proposals as documents: those waiting for a decision first. */
export function PortalProposalsPage() {
  const proposals = useProposals();
  if (proposals.isPending) return <Loading label="Loading your proposals…" />;
  if (proposals.isError) return <ErrorPanel error={proposals.error} onRetry={() => void proposals.refetch()} />;
  const waiting = proposals.data.filter((p) => p.status === 'sent');
  const others = proposals.data.filter((p) => p.status !== 'sent');
  return (
    <div className="flex flex-col gap-5">
      <div>
        <h1 className="text-2xl font-bold">Proposals</h1>
        <p className="text-slate">The priced plans your consultant has sent you.</p>
      </div>
      {proposals.data.length === 0 ? (
        <EmptyState title="No proposals yet">When your consultant sends a proposal, it appears here and in your e-mail.</EmptyState>
      ) : null}
      {waiting.length ? (
        <section aria-labelledby="waiting" className="flex flex-col gap-3">
          <h2 id="waiting" className="text-lg font-bold">
            Waiting for your decision
          </h2>
          <ul className="grid gap-3 sm:grid-cols-2">
            {waiting.map((p) => (
              <li key={p.id}>
                <PortalProposalCard proposal={p} />
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {others.length ? (
        <section aria-labelledby="earlier" className="flex flex-col gap-3">
          <h2 id="earlier" className="text-lg font-bold">
            {waiting.length ? 'Earlier proposals' : 'Your proposals'}
          </h2>
          <ul className="grid gap-3 sm:grid-cols-2">
            {others.map((p) => (
              <li key={p.id}>
                <PortalProposalCard proposal={p} />
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
