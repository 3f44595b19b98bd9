import { useState } from 'react';
import { KIND_STYLES, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { KindSwatch } from './kind-swatch';

/** The legend of the kinds on the map, with our swatches and symbols. */
export function MapLegend({ kinds, hasBoundary }: { kinds: UnitKind[]; hasBoundary: boolean }) {
  // Open on a roomy screen; folded where it would cover much of a small map.
  const [open, setOpen] = useState(() => typeof window === 'undefined' || window.matchMedia('(min-width: 1024px) and (min-height: 760px)').matches);
  if (kinds.length === 0 && !hasBoundary) return null;
  return (
    <details open={open} onToggle={(e) => setOpen((e.target as HTMLDetailsElement).open)} aria-label="Legend" className="group max-h-64 overflow-y-auto rounded border border-rule bg-card/95 px-3 py-1.5 text-xs shadow-sm">
      <summary className="cursor-pointer font-semibold uppercase tracking-wide text-slate">Legend</summary>
      <ul className="mt-1 flex flex-col gap-1 pb-0.5">
        {hasBoundary ? (
          <li className="flex items-center gap-2">
            <KindSwatch kind="boundary" size={14} /> Property boundary
          </li>
        ) : null}
        {kinds.map((k) => (
          <li key={k} className="flex items-center gap-2">
            <KindSwatch kind={k} size={14} /> {KIND_STYLES[k].label}
          </li>
        ))}
      </ul>
    </details>
  );
}
