/**
 * The plan drawn once into a PNG for the print view: a throw-away MapLibre map with a drawing
 * buffer that survives (preserveDrawingBuffer), fitted to the plan, read back when idle.
 */
import { LngLatBounds, Map as MapLibreMap } from 'maplibre-gl';
import type { BBox, MultiPolygon, Polygon } from 'geojson';
import { offlineStyle } from './map-style';
import { addPlanLayers, setBoundaryData, setUnitData } from './plan-layers';
import type { FamilyCollections } from './unit-features';
import './maplibre-worker';

export interface PlanImage {
  dataUrl: string;
  widthPx: number;
  heightPx: number;
  /** Ground metres per CSS pixel of the image at its centre. */
  metresPerPx: number;
}

/** Renders the boundary and units into a PNG data URL of widthPx × heightPx (CSS pixels, drawn at 2×). */
export function renderPlanImage(input: { boundary: Polygon | MultiPolygon | null; collections: FamilyCollections; box: BBox; widthPx: number; heightPx: number }): Promise<PlanImage> {
  const holder = document.createElement('div');
  holder.style.cssText = `position:fixed;left:-20000px;top:0;width:${input.widthPx}px;height:${input.heightPx}px;`;
  document.body.appendChild(holder);
  const map = new MapLibreMap({
    container: holder,
    style: offlineStyle(),
    interactive: false,
    attributionControl: false,
    pixelRatio: 2,
    fadeDuration: 0,
    canvasContextAttributes: { preserveDrawingBuffer: true },
  });
  const done = () => {
    map.remove();
    holder.remove();
  };
  return new Promise<PlanImage>((resolve, reject) => {
    map.once('error', (e) => {
      done();
      reject(e.error ?? new Error('The map could not be drawn.'));
    });
    map.once('load', () => {
      addPlanLayers(map, { labels: true });
      setBoundaryData(map, input.boundary, input.box as [number, number, number, number]);
      setUnitData(map, input.collections);
      const [w, s, e, n] = input.box;
      map.fitBounds(new LngLatBounds([w, s], [e, n]), { padding: 36, animate: false, maxZoom: 18 });
      map.once('idle', () => {
        try {
          const y = input.heightPx / 2;
          const a = map.unproject([input.widthPx / 2 - 50, y]);
          const b = map.unproject([input.widthPx / 2 + 50, y]);
          const metresPerPx = a.distanceTo(b) / 100;
          const dataUrl = map.getCanvas().toDataURL('image/png');
          done();
          resolve({ dataUrl, widthPx: input.widthPx, heightPx: input.heightPx, metresPerPx });
        } catch (err) {
          done();
          reject(err);
        }
      });
    });
  });
}
