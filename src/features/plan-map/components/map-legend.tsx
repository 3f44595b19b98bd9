import { useState } from 'react';
import type { UnitKind } from '../../../../shared/domain/unit-kinds';
import { LegendList } from './legend-list';
import { UNIT_STATUS_STYLES, UNIT_WORK_STATUSES } from '../../../lib/work-status';

/** The legend of the kinds on the map, with our swatches and symbols; in work-status mode, the statuses. */
export function MapLegend({ kinds, hasBoundary, byStatus = false }: { kinds: UnitKind[]; hasBoundary: boolean; byStatus?: boolean }) {
  // Open on a roomy screen; folded where it would cover much of a small map.
  const [open, setOpen] = useState(() => typeof window === 'undefined' || window.matchMedia('(min-width: 1024px) and (min-height: 760px)').matches);
  if (kinds.length === 0 && !hasBoundary) return null;
  return (
    <details open={open} onToggle={(e) => setOpen((e.target as HTMLDetailsElement).open)} aria-label="Legend" className="group max-h-64 overflow-y-auto rounded border border-rule bg-card/95 px-3 py-1.5 text-xs shadow-sm">
      <summary className="cursor-pointer font-semibold uppercase tracking-wide text-slate">Legend</summary>
      {byStatus ? (
        <ul className="mt-1 flex flex-col gap-1 pb-0.5">
          {UNIT_WORK_STATUSES.map((s) => (
            <li key={s} className="flex items-center gap-2">
              <span aria-hidden className="inline-block size-3.5 rounded-sm border" style={{ background: UNIT_STATUS_STYLES[s].fill, borderColor: UNIT_STATUS_STYLES[s].stroke }} />
              {UNIT_STATUS_STYLES[s].label}
            </li>
          ))}
          <li className="flex items-center gap-2">
            <span aria-hidden className="inline-block size-3 rounded-full border-2 border-card bg-sky" />
            Crew photo
          </li>
        </ul>
      ) : (
        <LegendList kinds={kinds} hasBoundary={hasBoundary} className="mt-1 pb-0.5" />
      )}
    </details>
  );
}
