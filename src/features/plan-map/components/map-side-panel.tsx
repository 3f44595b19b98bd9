/**
 * The plan map's one side panel at its left edge: aerial photos, the layers other features add
 * (observations, …) and the legend, stacked as sections beside the map instead of floating over it.
 * It folds to a slim rail ("Show map panel") so the map takes the whole width; open by default on a
 * wide screen, folded on a narrow one (where, open, it lies over the map's left side). Folding only
 * hides the sections: they stay mounted, so a layer they draw stays on the map.
 */
import { useState, type ReactNode } from 'react';

const WIDE = '(min-width: 1024px)';

/** A collapsible column of map panels; `children` are the sections, each with its own accessible name. */
export function MapSidePanel({ children }: { children: ReactNode }) {
  const [open, setOpen] = useState(() => typeof window === 'undefined' || window.matchMedia(WIDE).matches);
  return (
    <>
      {!open ? (
        <div className="flex shrink-0 flex-col items-center border-r border-rule bg-card py-2" style={{ width: '2.25rem' }}>
          <button
            type="button"
            aria-expanded={false}
            aria-controls="plan-map-side-panel"
            aria-label="Show map panel"
            title="Aerial photos, observations and legend"
            onClick={() => setOpen(true)}
            className="flex flex-col items-center gap-2 rounded px-1 py-2 text-xs font-semibold text-moss-deep hover:bg-paper"
          >
            <span aria-hidden>›</span>
            <span aria-hidden style={{ writingMode: 'vertical-rl' }}>Layers &amp; legend</span>
          </button>
        </div>
      ) : null}
      <aside
        id="plan-map-side-panel"
        aria-label="Map panel"
        className={`${open ? 'flex' : 'hidden'} absolute inset-y-0 left-0 z-30 w-64 shrink-0 flex-col border-r border-rule bg-paper shadow-md lg:static lg:shadow-none`}
      >
        <div className="flex items-center justify-between border-b border-rule bg-card px-3 py-1.5">
          <h2 className="text-xs font-semibold uppercase tracking-wide text-slate">Layers &amp; legend</h2>
          <button type="button" aria-expanded aria-controls="plan-map-side-panel" aria-label="Hide map panel" onClick={() => setOpen(false)} className="rounded px-1.5 text-sm font-semibold text-moss-deep hover:bg-paper">
            ‹
          </button>
        </div>
        <div className="flex min-h-0 flex-1 flex-col gap-2 overflow-y-auto p-2 [&_section]:w-full [&_section]:max-w-none [&_section]:shadow-none [&_details]:max-h-none">{children}</div>
      </aside>
    </>
  );
}
