import { useEffect, useRef } from 'react';
import { PlanMapController, type PlanMapCallbacks } from '../lib/plan-map-controller';
import { startFrameProbe, type FrameStats } from '../lib/frame-stats';

declare global {
  interface Window {
    /** Performance probe for benchmarks: frame times of the plan map while it pans. */
    __planMapStats?: {
      unitCount: () => number;
      start: () => void;
      stop: () => FrameStats | null;
      /** Pans the map back and forth for durationMs and answers the frame times meanwhile. */
      pan: (durationMs?: number) => Promise<FrameStats>;
      /** The MapLibre map, for experiments in a benchmark (hide a layer, change the zoom). */
      map: () => unknown;
    };
  }
}

/**
 * The map element: creates the map and its drawing tools once for the life of the page (never on
 * a re-render) and hands the controller to the page.
 */
export function PlanMapCanvas({
  callbacks,
  onController,
  unitCount,
}: {
  callbacks: PlanMapCallbacks;
  onController: (controller: PlanMapController | null) => void;
  unitCount: number;
}) {
  const containerRef = useRef<HTMLDivElement>(null);
  const controllerRef = useRef<PlanMapController | null>(null);
  const callbacksRef = useRef(callbacks);
  const countRef = useRef(unitCount);
  const onControllerRef = useRef(onController);
  callbacksRef.current = callbacks;
  countRef.current = unitCount;
  onControllerRef.current = onController;

  useEffect(() => {
    if (!containerRef.current) return;
    // Callbacks go through the ref so that the map always calls the latest handlers.
    const forward: PlanMapCallbacks = {
      onReady: () => callbacksRef.current.onReady?.(),
      onDrawn: (t, g) => callbacksRef.current.onDrawn?.(t, g),
      onEdited: (t, g) => callbacksRef.current.onEdited?.(t, g),
      onPick: (id) => callbacksRef.current.onPick?.(id),
      onMeasure: (m) => callbacksRef.current.onMeasure?.(m),
      onToolEnded: () => callbacksRef.current.onToolEnded?.(),
      onTilesFailed: (m) => callbacksRef.current.onTilesFailed?.(m),
      onDrawProgress: (n) => callbacksRef.current.onDrawProgress?.(n),
    };
    const controller = new PlanMapController(containerRef.current, forward);
    controllerRef.current = controller;
    onControllerRef.current(controller);
    let probe: ReturnType<typeof startFrameProbe> | null = null;
    window.__planMapStats = {
      unitCount: () => countRef.current,
      start: () => {
        probe = startFrameProbe();
      },
      stop: () => {
        const stats = probe?.stop() ?? null;
        probe = null;
        return stats;
      },
      map: () => controller.map,
      pan: async (durationMs = 3000) => {
        const map = controller.map;
        const run = startFrameProbe();
        const end = performance.now() + durationMs;
        let dir = 1;
        while (performance.now() < end) {
          map.panBy([dir * 300, dir * 120], { duration: 500, easing: (t) => t });
          await new Promise<void>((resolve) => map.once('moveend', () => resolve()));
          dir = -dir;
        }
        return run.stop();
      },
    };
    return () => {
      delete window.__planMapStats;
      onControllerRef.current(null);
      controllerRef.current = null;
      controller.destroy();
    };
  }, []);

  // MapLibre makes its container position: relative, so the container sits inside the absolute box.
  return (
    <div className="absolute inset-0">
      <div ref={containerRef} className="h-full w-full" data-testid="plan-map" />
    </div>
  );
}
