import { Link } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { buttonClasses } from '../../../components/ui/button';
import { paths } from '../../../config/paths';
import type { ProposalRowDto } from '../../../../shared/schemas/proposal-dto';
import { formatDay, formatMomentDay } from '../utils/dates';
import { StatusChip } from './status-chip';

const ACTION: Record<ProposalRowDto['status'], string> = {
  draft: 'View',
  sent: 'Review and approve',
  approved: 'View the approved proposal',
  declined: 'View',
  withdrawn: 'View',
  expired: 'View',
};

/** One proposal in the portal: a document card with one clear action (`to` overrides the link, for the consultant's preview). */
export function PortalProposalCard({ proposal: p, to }: { proposal: ProposalRowDto; to?: string }) {
  const waiting = p.status === 'sent';
  const when =
    p.status === 'sent'
      ? p.expiresOn
        ? `Prices hold until ${formatDay(p.expiresOn)}`
        : 'Waiting for your decision'
      : p.status === 'approved'
        ? `Approved ${formatMomentDay(p.decidedAt)}`
        : p.status === 'declined'
          ? `Declined ${formatMomentDay(p.decidedAt)}`
          : p.status === 'expired'
            ? `Expired after ${formatDay(p.expiresOn)}`
            : `Sent ${formatMomentDay(p.sentAt)}`;
  return (
    <article aria-label={`${p.title}, version ${p.version}`} className={`flex flex-col gap-2 rounded-md border bg-card p-4 ${waiting ? 'border-sky' : 'border-rule'}`}>
      <div className="flex items-start justify-between gap-2">
        <div className="min-w-0">
          <h3 className="text-lg font-bold leading-snug">{p.title}</h3>
          <p className="text-sm text-slate">
            {p.propertyName} · {p.number} v{p.version}
          </p>
        </div>
        <StatusChip status={p.status} />
      </div>
      <p className="flex flex-wrap items-baseline gap-x-2">
        <span className="figure text-2xl font-bold">{formatCents(p.totalCents)}</span>
        <span className="text-sm text-slate">deposit {formatCents(p.depositCents)}</span>
      </p>
      <p className="text-sm">{when}</p>
      <Link to={to ?? paths.portalProposal(p.id)} className={buttonClasses(waiting ? 'primary' : 'secondary', 'mt-1 w-full sm:w-auto sm:self-start')}>
        {ACTION[p.status]}
      </Link>
    </article>
  );
}
