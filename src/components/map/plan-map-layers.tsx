/**
 * The slot for more layers on the plan map. A feature that adds a layer (observations, stands, …)
 * (in its own feature: this module lives in components/ so any feature may import it)
 * writes one component that reads the map with `usePlanMapController()` and draws with MapLibre
 * sources/layers of its own ids, cleaning them up on unmount; the plan map page inserts it as one
 * element inside `<PlanMapLayers>`. Layers render nothing into the page (return null) unless they
 * need a small panel, which goes in the map's side panel (beside the map, foldable) through `PlanMapLayers`' children.
 */
import { createContext, useContext, type ReactNode } from 'react';
import type { Map as MapLibreMap } from 'maplibre-gl';

/** What a layer needs of the plan map: the MapLibre map and a way to wait until its style and plan layers are in. */
export interface PlanMapHandle {
  readonly map: MapLibreMap;
  whenMapReady(fn: () => void): void;
}

const PlanMapContext = createContext<{ controller: PlanMapHandle | null; propertyId: number } | null>(null);

/** Gives the layers below it the page's map controller (null until the map exists) and the property. */
export function PlanMapProvider({ controller, propertyId, children }: { controller: PlanMapHandle | null; propertyId: number; children: ReactNode }) {
  return <PlanMapContext.Provider value={{ controller, propertyId }}>{children}</PlanMapContext.Provider>;
}

/**
 * The map controller and property of the plan map page, for a layer component. `controller.map`
 * is the MapLibre map; call `controller.whenMapReady(fn)` before adding sources.
 */
export function usePlanMapController(): { controller: PlanMapHandle | null; propertyId: number } {
  const value = useContext(PlanMapContext);
  if (!value) throw new Error('usePlanMapController is used inside <PlanMapProvider> only (the plan map page).');
  return value;
}

/** Where layer components go: one element each. Any panel they render stacks in the map's side panel, full width. */
export function PlanMapLayers({ children }: { children?: ReactNode }) {
  return (
    <div className="pointer-events-auto flex flex-col items-stretch gap-2" data-slot="plan-map-layers">
      {children}
    </div>
  );
}
