import { PLOT_STATUS_LABELS } from '../../../../shared/schemas/checks';
import type { PlotCheckStatus } from '../../../../shared/domain/plot-checks';

const TONE: Record<PlotCheckStatus, string> = {
  established: 'border-moss text-moss-deep bg-moss/10',
  thin: 'border-ochre text-[#7A5A12] bg-ochre/10',
  failed: 'border-clay text-[#8E3F2A] bg-clay/10',
  'browsed-hard': 'border-clay text-[#8E3F2A] bg-clay/10',
  'over-target': 'border-ochre text-[#7A5A12] bg-ochre/10',
  checked: 'border-rule text-slate bg-card',
};

/** A plot's check status as a small labelled pill (words, not colour alone). */
export function PlotStatusBadge({ status }: { status: PlotCheckStatus }) {
  return <span className={`inline-block rounded border px-2 py-0.5 text-xs font-semibold ${TONE[status]}`}>{PLOT_STATUS_LABELS[status]}</span>;
}
