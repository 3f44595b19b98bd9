/**
 * The plan map's one side panel at its left edge: aerial photos, the layers other features add
 * (observations, …) and the legend, stacked as sections beside the map instead of floating over it.
 * Folded, it leaves the map the whole width and a "Layers & legend" button on the map opens it again.
 * It starts open on a wide screen (≥ 1440 px) and folded on a narrower one; the person's own choice
 * is kept in this browser (`lib/side-panel-pref.ts`). Below 1024 px, open, it lies over the map's left
 * side. Folding only hides the sections: they stay mounted, so a layer they draw stays on the map.
 */
import { useState, type ReactNode } from 'react';
import { readSidePanelChoice, SIDE_PANEL_WIDE_QUERY, sidePanelStartsOpen, storeSidePanelChoice } from '../lib/side-panel-pref';

const PANEL_ID = 'plan-map-side-panel';

/** The side panel's open state: stored choice, else open on a wide screen; every change is remembered. */
export function useSidePanel(): { open: boolean; setOpen: (open: boolean) => void } {
  const [open, setOpenState] = useState(() => typeof window === 'undefined' || sidePanelStartsOpen(readSidePanelChoice(), window.matchMedia(SIDE_PANEL_WIDE_QUERY).matches));
  const setOpen = (next: boolean) => {
    storeSidePanelChoice(next);
    setOpenState(next);
  };
  return { open, setOpen };
}

/** The button on the map that opens the folded panel. */
export function ShowMapPanelButton({ onOpen }: { onOpen: () => void }) {
  return (
    <button
      type="button"
      aria-expanded={false}
      aria-controls={PANEL_ID}
      aria-label="Show map panel: layers & legend"
      title="Aerial photos, observations and legend"
      onClick={onOpen}
      className="inline-flex shrink-0 items-center gap-1 whitespace-nowrap rounded border border-rule bg-card/95 px-2.5 py-1.5 text-sm font-semibold text-moss-deep shadow-sm hover:border-moss"
    >
      <span aria-hidden>›</span>
      <span>
        Layers<span className="hidden sm:inline"> &amp; legend</span>
      </span>
    </button>
  );
}

/** A collapsible column of map panels; `children` are the sections, each with its own accessible name. */
export function MapSidePanel({ open, onOpenChange, children }: { open: boolean; onOpenChange: (open: boolean) => void; children: ReactNode }) {
  return (
    <aside
      id={PANEL_ID}
      aria-label="Map panel"
      className={`${open ? 'flex' : 'hidden'} absolute inset-y-0 left-0 z-30 w-64 shrink-0 flex-col border-r border-rule bg-paper shadow-md lg:static lg:shadow-none`}
    >
      <div className="flex items-center justify-between border-b border-rule bg-card px-3 py-1.5">
        <h2 className="text-xs font-semibold uppercase tracking-wide text-slate">Layers &amp; legend</h2>
        <button type="button" aria-expanded aria-controls={PANEL_ID} aria-label="Hide map panel" onClick={() => onOpenChange(false)} className="rounded px-1.5 text-sm font-semibold text-moss-deep hover:bg-paper">
          ‹
        </button>
      </div>
      <div className="flex min-h-0 flex-1 flex-col gap-2 overflow-y-auto p-2 [&_section]:w-full [&_section]:max-w-none [&_section]:shadow-none [&_details]:max-h-none">{children}</div>
    </aside>
  );
}
