import { useSearchParams } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { PROPOSAL_STATES } from '../../../../shared/schemas/proposal';
import { useProposals } from '../../../features/proposals/api/get-proposals';
import { proposalLabel, type ProposalRowDto, type ProposalStatus } from '../../../../shared/schemas/proposal-dto';
import { StatusChip, STATUS_LABELS } from '../../../features/proposals/components/status-chip';
import { formatMomentDay } from '../../../features/proposals/utils/dates';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { DataTable, type DataColumn } from '../../../components/ui/data-table';
import { PageHeader } from '../../../components/ui/page-header';
import { StatusFilter } from '../../../components/ui/status-filter';
import { paths } from '../../../config/paths';

const COLUMNS: DataColumn<ProposalRowDto>[] = [
  { id: 'number', header: 'Proposal', value: (p) => proposalLabel(p), className: 'whitespace-nowrap' },
  { id: 'property', header: 'Property', value: (p) => p.propertyName },
  { id: 'client', header: 'Client', value: (p) => p.clientName, hideBelow: 'md' },
  { id: 'status', header: 'Status', value: (p) => STATUS_LABELS[p.status], cell: (p) => <StatusChip status={p.status} /> },
  { id: 'total', header: 'Total', value: (p) => p.totalCents, cell: (p) => formatCents(p.totalCents), align: 'right', className: 'whitespace-nowrap' },
  { id: 'sent', header: 'Sent', value: (p) => p.sentAt, cell: (p) => formatMomentDay(p.sentAt), hideBelow: 'sm', className: 'whitespace-nowrap', searchable: false },
  { id: 'viewed', header: 'First viewed', value: (p) => p.firstViewedAt, cell: (p) => formatMomentDay(p.firstViewedAt), hideBelow: 'lg', className: 'whitespace-nowrap', searchable: false },
];

const isStatus = (v: string | null): v is ProposalStatus => v !== null && (PROPOSAL_STATES as readonly string[]).includes(v);

/** The firm's proposals: a table with a status filter (kept in the address as ?status=). */
export function ProposalsPage() {
  const [params, setParams] = useSearchParams();
  const raw = params.get('status');
  const status = isStatus(raw) ? raw : undefined;
  const proposals = useProposals(status ? { status } : {});
  const setStatus = (value: string) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value) next.set('status', value);
        else next.delete('status');
        return next;
      },
      { replace: true },
    );
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Proposals">Priced plans for landowners. Draft one from a property’s page; it is priced from the plan’s prescriptions.</PageHeader>
      <Card>
        {proposals.isPending ? (
          <Loading label="Loading proposals…" />
        ) : proposals.isError ? (
          <ErrorPanel error={proposals.error} onRetry={() => void proposals.refetch()} />
        ) : (
          <DataTable
            data={proposals.data}
            columns={COLUMNS}
            label="Proposals"
            noun={['proposal', 'proposals']}
            rowKey={(p) => p.id}
            rowHref={(p) => paths.proposal(p.id)}
            searchPlaceholder="Number, property or client…"
            toolbar={
              <StatusFilter value={status} states={PROPOSAL_STATES} labels={STATUS_LABELS} onChange={setStatus} />
            }
            empty={
              <EmptyState title={status ? `No ${STATUS_LABELS[status].toLowerCase()} proposals` : 'No proposals yet'}>
                {status ? 'Choose “All states” to see the others.' : 'Open a property and press “New proposal”: its prescriptions become a draft you can edit and send.'}
              </EmptyState>
            }
          />
        )}
      </Card>
    </div>
  );
}
