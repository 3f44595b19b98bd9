import { Link } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { paths } from '../../../config/paths';
import { useProposalVersions } from '../api/get-proposal-versions';
import { formatMomentDay } from '../utils/dates';
import { StatusChip } from './status-chip';

/** Every version of a proposal's series, this one marked. */
export function VersionsList({ proposalId }: { proposalId: number }) {
  const versions = useProposalVersions(proposalId);
  return (
    <Card title="Versions">
      {versions.isPending ? (
        <Loading label="Loading versions…" />
      ) : versions.isError ? (
        <ErrorPanel error={versions.error} onRetry={() => void versions.refetch()} />
      ) : (
        <ol aria-label="Versions of this proposal" className="flex flex-col divide-y divide-rule text-sm">
          {versions.data.map((v) => {
            const current = v.id === proposalId;
            const when = v.decidedAt ?? v.sentAt ?? v.updatedAt;
            return (
              <li key={v.id} className="flex flex-wrap items-center justify-between gap-2 py-2" aria-current={current ? 'page' : undefined}>
                <span className="flex items-center gap-2">
                  {current ? (
                    <span className="font-semibold">Version {v.version} (this one)</span>
                  ) : (
                    <Link to={paths.proposal(v.id)} className="font-semibold text-moss-deep underline">
                      Version {v.version}
                    </Link>
                  )}
                  <StatusChip status={v.status} />
                </span>
                <span className="tabular-nums text-slate">
                  {formatCents(v.totalCents)} · {formatMomentDay(when)}
                </span>
              </li>
            );
          })}
        </ol>
      )}
    </Card>
  );
}
