import { AGE_CLASS_LABELS, type HarvestDto } from '../../../../shared/schemas/results';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/card';
import { formatDate, formatNumber } from '../../../lib/format';

/** The harvest records, newest first; `onDelete` adds a delete button per row (staff). */
export function HarvestTable({ harvests, onDelete, busyId }: { harvests: readonly HarvestDto[]; onDelete?: (record: HarvestDto) => void; busyId?: number | null }) {
  if (harvests.length === 0) return <EmptyState title="No harvest recorded">Deer taken on the property show here.</EmptyState>;
  return (
    // relative: the visually-hidden texts inside (absolutely placed) stay within the scrolling box.
    <div className="relative overflow-x-auto">
      <table className="w-full min-w-[32rem] text-sm">
        <caption className="sr-only">Harvest records</caption>
        <thead>
          <tr className="border-b border-slate text-left text-xs uppercase tracking-wide text-slate">
            <th scope="col" className="py-2 pr-3">Date</th>
            <th scope="col" className="py-2 pr-3">Deer</th>
            <th scope="col" className="py-2 pr-3">Age</th>
            <th scope="col" className="py-2 pr-3 text-right">Dressed</th>
            <th scope="col" className="py-2 pr-3 text-right">Points</th>
            <th scope="col" className="py-2 pr-3">Where</th>
            {onDelete ? <th scope="col" className="py-2"><span className="sr-only">Actions</span></th> : null}
          </tr>
        </thead>
        <tbody>
          {harvests.map((h) => (
            <tr key={h.id} className="border-b border-rule">
              <td className="py-2 pr-3 tabular-nums">{formatDate(`${h.date}T12:00:00`)}</td>
              <td className="py-2 pr-3">{h.sex === 'male' ? 'Buck' : 'Doe'}</td>
              <td className="py-2 pr-3">{AGE_CLASS_LABELS[h.ageClass]}</td>
              <td className="py-2 pr-3 text-right tabular-nums">{h.dressedWeightLb === null ? '—' : `${formatNumber(h.dressedWeightLb, 0)} lb`}</td>
              <td className="py-2 pr-3 text-right tabular-nums">{h.antlerPoints ?? '—'}</td>
              <td className="py-2 pr-3">{h.unitName ?? h.stand ?? '—'}</td>
              {onDelete ? (
                <td className="py-2 text-right">
                  <Button variant="ghost" size="sm" busy={busyId === h.id} onClick={() => onDelete(h)} aria-label={`Delete the harvest of ${formatDate(h.date)}`}>
                    Delete
                  </Button>
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
