import { Link, useNavigate } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { Button } from '../../../components/ui/button';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';
import { paths } from '../../../config/paths';
import { useCreateProposal } from '../api/create-proposal';
import { usePropertyProposals } from '../api/get-property-proposals';
import { proposalLabel } from '../../../../shared/schemas/proposal-dto';
import { formatMomentDay } from '../utils/dates';
import { StatusChip } from './status-chip';

/** A property's proposals, newest first, and the button that drafts a new one from its prescriptions. */
export function PropertyProposalsCard({ propertyId, propertyName }: { propertyId: number; propertyName: string }) {
  const proposals = usePropertyProposals(propertyId);
  const create = useCreateProposal();
  const navigate = useNavigate();
  const toast = useToast();
  const draft = () =>
    create.mutate(
      { propertyId },
      {
        onSuccess: (p) => {
          toast('success', `${proposalLabel(p)} drafted from ${p.lines.length} priced ${p.lines.length === 1 ? 'line' : 'lines'}.`);
          navigate(paths.proposal(p.id));
        },
        onError: (e) => toast('error', `No proposal was drafted: ${e.message}`),
      },
    );
  return (
    <Card
      title="Proposals"
      action={
        <Button size="sm" onClick={draft} busy={create.isPending}>
          New proposal
        </Button>
      }
    >
      {proposals.isPending ? (
        <Loading label="Loading proposals…" />
      ) : proposals.isError ? (
        <ErrorPanel error={proposals.error} onRetry={() => void proposals.refetch()} />
      ) : proposals.data.length === 0 ? (
        <EmptyState title={`No proposals for ${propertyName} yet`}>
          “New proposal” prices every prescription of the plan into a draft you can edit before sending.
        </EmptyState>
      ) : (
        <ul aria-label={`Proposals for ${propertyName}`} className="flex flex-col divide-y divide-rule">
          {proposals.data.map((p) => (
            <li key={p.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-2 text-sm">
              <span className="flex min-w-0 flex-wrap items-center gap-2">
                <Link to={paths.proposal(p.id)} className="font-semibold text-moss-deep underline">
                  {proposalLabel(p)}
                </Link>
                <StatusChip status={p.status} />
                <span className="truncate text-slate">{p.title}</span>
              </span>
              <span className="tabular-nums text-slate">
                <span className="figure text-ink">{formatCents(p.totalCents)}</span> · {p.sentAt ? `sent ${formatMomentDay(p.sentAt)}` : `updated ${formatMomentDay(p.updatedAt)}`}
              </span>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
