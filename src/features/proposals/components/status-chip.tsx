import type { ProposalStatus } from '../../../../shared/schemas/proposal-dto';

/** How each state reads, and its colours: draft ochre, sent sky, approved moss, declined clay, withdrawn and expired slate. */
export const STATUS_LABELS: Record<ProposalStatus, string> = {
  draft: 'Draft',
  sent: 'Sent',
  approved: 'Approved',
  declined: 'Declined',
  withdrawn: 'Withdrawn',
  expired: 'Expired',
};

// Every pair meets WCAG AA for small text: ink on ochre 5.9, white on sky 4.7, white on moss 6.2,
// clay on card 4.8, slate on card 5.7.
const STYLES: Record<ProposalStatus, string> = {
  draft: 'border-ochre bg-ochre text-ink',
  sent: 'border-sky bg-sky text-white',
  approved: 'border-moss bg-moss text-white',
  declined: 'border-clay bg-card text-clay',
  withdrawn: 'border-slate bg-card text-slate',
  expired: 'border-dashed border-slate bg-card text-slate',
};

/** A proposal's state as a small chip in our own colours. */
export function StatusChip({ status, className = '' }: { status: ProposalStatus; className?: string }) {
  return (
    <span data-status={status} className={`inline-flex items-center whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold leading-5 ${STYLES[status]} ${className}`}>
      {STATUS_LABELS[status]}
    </span>
  );
}
