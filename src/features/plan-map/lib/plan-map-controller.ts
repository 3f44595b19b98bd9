/**
 * The plan map outside React: one MapLibre map and one terra-draw instance for the page's life.
 * React hands it data (units, boundary, overlays, preview) and it calls back on clicks, drawings
 * and edits. Units are drawn by our own layers; only the shape being drawn or edited lives in
 * terra-draw, so 500 units cost three GeoJSON sources, not 500 editable features.
 */
import { LngLatBounds, Map as MapLibreMap, Marker, NavigationControl, ScaleControl, AttributionControl } from 'maplibre-gl';
import './maplibre-worker';
import {
  TerraDraw,
  TerraDrawLineStringMode,
  TerraDrawPointMode,
  TerraDrawPolygonMode,
  TerraDrawSelectMode,
  type GeoJSONStoreFeatures,
  type HexColor,
  type TerraDrawMouseEvent,
} from 'terra-draw';
import { TerraDrawMapLibreGLAdapter } from 'terra-draw-maplibre-gl-adapter';
import type { BBox, Geometry, LineString, MultiPolygon, Polygon, Position } from 'geojson';
import { KIND_STYLES, type KindFamily, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { bboxOf, measureArea, measureLine } from '../../../../shared/domain/geometry';
import { CARD, INK, MOSS_DEEP, OCHRE, SKY, offlineStyle } from './map-style';
import { addBaseLayer } from './base-layer';
import {
  UNIT_LAYERS,
  addPlanLayers,
  setColourBy,
  setPhotoPoints,
  type ColourBy,
  type PhotoPoint,
  hideBoundary,
  hideUnit,
  setBackgroundTiles,
  setBoundaryData,
  setOverlayOpacity,
  setPreviewData,
  setUnitData,
  syncOverlays,
  type MapOverlay,
} from './plan-layers';
import type { FamilyCollections } from './unit-features';
import { cursorMeasureText, SnapIndex } from './draw-assist';


/** What a drawing tool makes. */
export type DrawTarget = { type: 'unit'; kind: UnitKind } | { type: 'boundary' } | { type: 'measure'; shape: 'line' | 'area' };

/** What is being edited: a unit's shape or the boundary. */
export type EditTarget = { type: 'unit'; unitId: number; kind: UnitKind; geometry: Geometry } | { type: 'boundary'; geometry: Polygon | MultiPolygon };

/** A live measure of the shape being drawn (or the last measured one). */
export type MeasureReading =
  | { shape: 'line'; lengthFt: number; lengthMi: number; drawing: boolean; target: DrawTarget }
  | { shape: 'area'; acres: number; hectares: number; perimeterFt: number; drawing: boolean; target: DrawTarget };

export interface PlanMapCallbacks {
  onReady?: () => void;
  /** A unit or boundary shape was finished. */
  onDrawn?: (target: DrawTarget, geometry: Geometry) => void;
  /** The edited shape was changed (vertex dragged, inserted or deleted, or the shape moved). */
  onEdited?: (target: EditTarget, geometry: Geometry) => void;
  /** A click picked a unit (or empty map: null). */
  onPick?: (unitId: number | null) => void;
  onMeasure?: (reading: MeasureReading | null) => void;
  /** The firm's background tiles failed to load (said once per map). */
  onTilesFailed?: (message: string) => void;
  /** The drawing tool ended by itself: Escape, or a measure was finished (it stays shown). */
  onToolEnded?: () => void;
  /** How many points the shape being drawn has (to enable Finish and Undo point). */
  onDrawProgress?: (points: number) => void;
}

/** Pixels within which a new corner snaps to a corner of the boundary or of another unit. */
export const SNAP_PIXELS = 10;

const MODE = {
  select: 'select',
  polygon: 'unit-polygon',
  line: 'unit-line',
  point: 'unit-point',
  boundary: 'boundary',
  measureLine: 'measure-line',
  measureArea: 'measure-area',
} as const;

const FAMILY_MODE: Record<KindFamily, string> = { area: MODE.polygon, line: MODE.line, point: MODE.point };

const hex = (c: string) => c as HexColor;

/** True when terra-draw can edit the geometry's vertices (single parts only). */
export function isEditableGeometry(geometry: Geometry): boolean {
  return geometry.type === 'Polygon' || geometry.type === 'LineString' || geometry.type === 'Point' || (geometry.type === 'MultiPolygon' && geometry.coordinates.length === 1);
}

function singlePart(geometry: Geometry): Polygon | LineString | Geometry {
  if (geometry.type === 'MultiPolygon' && geometry.coordinates.length === 1) return { type: 'Polygon', coordinates: geometry.coordinates[0] };
  return geometry;
}

export class PlanMapController {
  readonly map: MapLibreMap;
  private draw: TerraDraw | null = null;
  private ready = false;
  private callbacks: PlanMapCallbacks;
  private drawTarget: DrawTarget | null = null;
  private drawKind: UnitKind | null = null;
  private editing: { target: EditTarget; featureId: string | number; signature: string } | null = null;
  private measureFeatureId: string | number | null = null;
  private nameMarker: Marker | null = null;
  private cursorLabel: Marker | null = null;
  private readonly snapIndex = new SnapIndex();
  /** The drawing modes by name, for Finish and Undo point. */
  private readonly drawModes = new Map<string, TerraDrawPolygonMode | TerraDrawLineStringMode>();
  private pending: (() => void)[] = [];
  private destroyed = false;
  private stopBaseLayer: (() => void) | null = null;

  constructor(container: HTMLElement, callbacks: PlanMapCallbacks, options: { preserveDrawingBuffer?: boolean } = {}) {
    this.callbacks = callbacks;
    this.map = new MapLibreMap({
      container,
      style: offlineStyle(),
      center: [-90.5, 43.5],
      zoom: 6,
      maxZoom: 20,
      attributionControl: false,
      dragRotate: false,
      pitchWithRotate: false,
      canvasContextAttributes: { preserveDrawingBuffer: options.preserveDrawingBuffer ?? false },
    });
    this.map.touchZoomRotate.disableRotation();
    this.map.addControl(new NavigationControl({ showCompass: false }), 'bottom-right');
    this.map.addControl(new ScaleControl({ unit: 'imperial', maxWidth: 140 }), 'bottom-left');
    this.map.on('load', () => this.onLoad());
    // A failing tile service must not flood the console nor hold up the plan: when its first
    // tiles all fail, the tiles are taken off and the page is told once.
    let tileErrors = 0;
    let tilesLoaded = 0;
    this.map.on('sourcedata', (e) => {
      if (e.sourceId === 'tiles' && (e as { tile?: unknown }).tile) tilesLoaded += 1;
    });
    this.map.on('error', (event) => {
      const e = event as unknown as { error?: Error; sourceId?: string };
      if (e.sourceId !== 'tiles') {
        console.error(e.error ?? e);
        return;
      }
      tileErrors += 1;
      if (tileErrors === 3 && tilesLoaded === 0) {
        setBackgroundTiles(this.map, null);
        this.imagery.tiles = false;
        this.applyImagery();
        this.callbacks.onTilesFailed?.(e.error?.message ?? 'no answer');
      }
    });
    this.map.on('click', (e) => this.onClick(e.point.x, e.point.y, e.lngLat));
    for (const layer of UNIT_LAYERS) {
      this.map.on('mouseenter', layer, () => {
        if (this.isIdle()) this.map.getCanvas().style.cursor = 'pointer';
      });
      this.map.on('mouseleave', layer, () => {
        if (this.isIdle()) this.map.getCanvas().style.cursor = '';
      });
    }
  }

  /** Replaces the callbacks (the page's handlers change with its state). */
  setCallbacks(callbacks: PlanMapCallbacks): void {
    this.callbacks = callbacks;
  }

  /** Runs fn once the map's style and the plan layers are in (at once if they are): for layer components. */
  whenMapReady(fn: () => void): void {
    this.whenReady(fn);
  }

  private whenReady(fn: () => void): void {
    if (this.ready) fn();
    else this.pending.push(fn);
  }

  private onLoad(): void {
    if (this.destroyed) return;
    addPlanLayers(this.map, { labels: true });
    // Credits: the base layer's source, and the imagery's when the firm turns it on.
    this.attribution = new AttributionControl({ compact: true });
    this.map.addControl(this.attribution, 'bottom-right');
    // State and county lines (offline) between the imagery and the plan.
    this.stopBaseLayer = addBaseLayer(this.map, 'boundary-fill');
    this.draw = this.createDraw();
    this.draw.start();
    this.draw.setMode(MODE.select);
    this.ready = true;
    for (const fn of this.pending.splice(0)) fn();
    this.callbacks.onReady?.();
  }

  private kindColour(feature: GeoJSONStoreFeatures | undefined, field: 'fill' | 'stroke', fallback: string): HexColor {
    const kind = (feature?.properties?.kind as UnitKind | undefined) ?? this.drawKind;
    return hex(kind ? KIND_STYLES[kind][field] : fallback);
  }

  private createDraw(): TerraDraw {
    const isBoundary = (f: GeoJSONStoreFeatures) => f.properties?.mode === MODE.boundary;
    const fill = (f: GeoJSONStoreFeatures) => (isBoundary(f) ? hex(CARD) : this.kindColour(f, 'fill', OCHRE));
    const stroke = (f: GeoJSONStoreFeatures) => this.kindColour(f, 'stroke', INK);
    const vertex = { coordinatePointColor: hex(CARD), coordinatePointOutlineColor: hex(INK), coordinatePointWidth: 4, coordinatePointOutlineWidth: 1.5 };
    const closing = { closingPointColor: hex(CARD), closingPointOutlineColor: hex(INK), closingPointWidth: 5, closingPointOutlineWidth: 2 };
    const editFlags = { feature: { draggable: true, coordinates: { draggable: true, midpoints: true, deletable: true } } };
    // New corners snap to the shape's own corners and to the corners of the boundary and the units.
    const snapping = { toCoordinate: true, toCustom: (event: TerraDrawMouseEvent) => this.snapToPlan(event) };
    const snapStyle = { snappingPointColor: hex(OCHRE), snappingPointWidth: 6, snappingPointOutlineColor: hex(INK), snappingPointOutlineWidth: 2 };
    const adapter = new TerraDrawMapLibreGLAdapter({ map: this.map, coordinatePrecision: 9 });
    const draw = new TerraDraw({
      adapter,
      modes: [
        new TerraDrawSelectMode({
          modeName: MODE.select,
          allowManualDeselection: false,
          keyEvents: { deselect: null, delete: null, rotate: null, scale: null },
          flags: {
            [MODE.polygon]: editFlags,
            [MODE.line]: editFlags,
            [MODE.point]: { feature: { draggable: true } },
            [MODE.boundary]: editFlags,
          },
          styles: {
            selectedPolygonColor: fill,
            selectedPolygonFillOpacity: (f: GeoJSONStoreFeatures) => (isBoundary(f) ? 0.15 : 0.45),
            selectedPolygonOutlineColor: hex(INK),
            selectedPolygonOutlineWidth: 2.5,
            selectedLineStringColor: stroke,
            selectedLineStringWidth: 4,
            selectedPointColor: fill,
            selectedPointWidth: 9,
            selectedPointOutlineColor: hex(INK),
            selectedPointOutlineWidth: 2.5,
            selectionPointColor: hex(CARD),
            selectionPointOutlineColor: hex(INK),
            selectionPointWidth: 5,
            selectionPointOutlineWidth: 2,
            midPointColor: hex(MOSS_DEEP),
            midPointOutlineColor: hex(CARD),
            midPointWidth: 3.5,
            midPointOutlineWidth: 1.5,
          },
        }),
        this.keepMode(new TerraDrawPolygonMode({
          modeName: MODE.polygon,
          snapping,
          styles: { fillColor: fill, fillOpacity: 0.45, outlineColor: stroke, outlineWidth: 2.5, ...closing, ...vertex, ...snapStyle },
        })),
        this.keepMode(new TerraDrawLineStringMode({
          modeName: MODE.line,
          snapping,
          styles: { lineStringColor: stroke, lineStringWidth: 3.5, ...closing, ...vertex, ...snapStyle },
        })),
        new TerraDrawPointMode({
          modeName: MODE.point,
          styles: { pointColor: fill, pointWidth: 8, pointOutlineColor: hex(CARD), pointOutlineWidth: 2.5 },
        }),
        this.keepMode(new TerraDrawPolygonMode({
          modeName: MODE.boundary,
          snapping,
          styles: { fillColor: hex(CARD), fillOpacity: 0.35, outlineColor: hex(INK), outlineWidth: 2.5, ...closing, ...vertex, ...snapStyle },
        })),
        this.keepMode(new TerraDrawLineStringMode({
          modeName: MODE.measureLine,
          snapping,
          styles: { lineStringColor: hex(SKY), lineStringWidth: 3, lineStringDash: [4, 3], ...closing, ...vertex, ...snapStyle },
        })),
        this.keepMode(new TerraDrawPolygonMode({
          modeName: MODE.measureArea,
          snapping,
          styles: { fillColor: hex(SKY), fillOpacity: 0.15, outlineColor: hex(SKY), outlineWidth: 2.5, ...closing, ...vertex, ...snapStyle },
        })),
      ],
    });
    draw.on('change', (ids, type) => this.onDrawChange(ids, type));
    draw.on('finish', (id, context) => {
      // terra-draw is still inside its own handler: act once it has finished.
      setTimeout(() => this.onDrawFinish(id, context.action), 0);
    });
    return draw;
  }

  private keepMode<M extends TerraDrawPolygonMode | TerraDrawLineStringMode>(mode: M): M {
    this.drawModes.set(mode.mode, mode);
    return mode;
  }

  /** The nearest corner of the boundary or a unit within SNAP_PIXELS of the pointer, if any. */
  private snapToPlan(event: TerraDrawMouseEvent): Position | undefined {
    return this.snapIndex.nearest(
      event.lng,
      event.lat,
      SNAP_PIXELS,
      (lon, lat) => this.map.project([lon, lat]),
      (x, y) => {
        const p = this.map.unproject([x, y]);
        return [p.lng, p.lat];
      },
      [event.containerX, event.containerY],
    );
  }

  /** The corners new drawings snap to: the boundary's and every unit's. */
  setSnapTargets(geometries: readonly Geometry[]): void {
    this.snapIndex.set(geometries);
  }

  /** Ends the shape being drawn as if its last point were clicked again (Enter). */
  finishDraw(): void {
    const mode = this.draw ? this.drawModes.get(this.draw.getMode()) : undefined;
    mode?.onKeyUp({ key: 'Enter', heldKeys: [], preventDefault: () => {} });
  }

  /** Takes back the last point of the shape being drawn. */
  undoVertex(): void {
    const mode = this.draw ? this.drawModes.get(this.draw.getMode()) : undefined;
    if (mode && mode.undoSize() > 0) mode.undo();
  }

  /** The live measure next to the cursor while drawing (null hides it). */
  private setCursorLabel(at: Position | null, text: string): void {
    if (!at || !text) {
      this.cursorLabel?.remove();
      this.cursorLabel = null;
      return;
    }
    if (!this.cursorLabel) {
      const el = document.createElement('div');
      el.dataset.testid = 'cursor-measure';
      el.setAttribute('aria-hidden', 'true');
      el.className = 'pointer-events-none rounded bg-ink/85 px-1.5 py-0.5 text-xs font-semibold text-white shadow whitespace-nowrap figure';
      this.cursorLabel = new Marker({ element: el, anchor: 'left', offset: [14, 14] });
    }
    this.cursorLabel.getElement().textContent = text;
    this.cursorLabel.setLngLat([at[0], at[1]]);
    if (!this.cursorLabel.getElement().isConnected) this.cursorLabel.addTo(this.map);
  }

  private isIdle(): boolean {
    return this.drawTarget === null;
  }

  private onClick(x: number, y: number, lngLat: { lng: number; lat: number }): void {
    if (!this.ready || !this.isIdle()) return;
    const box: [[number, number], [number, number]] = [
      [x - 5, y - 5],
      [x + 5, y + 5],
    ];
    const hits = this.map.queryRenderedFeatures(box, { layers: UNIT_LAYERS.filter((l) => this.map.getLayer(l)) });
    if (hits.length > 0) {
      const top = hits[0].layer.id;
      const candidates = hits.filter((h) => h.layer.id === top);
      // Where areas overlap, the smallest wins (a food plot inside timber).
      const best = top === 'unit-area-fill' ? candidates.reduce((a, b) => ((a.properties.acres as number) <= (b.properties.acres as number) ? a : b)) : candidates[0];
      this.callbacks.onPick?.(Number(best.properties.id));
      return;
    }
    if (this.editing && this.draw) {
      const own = this.draw.getFeaturesAtLngLat(lngLat, { pointerDistance: 8, ignoreSelectFeatures: true });
      if (own.some((f) => f.id === this.editing?.featureId)) return;
    }
    this.callbacks.onPick?.(null);
  }

  private onDrawChange(ids: (string | number)[], type: string): void {
    if (!this.draw || !this.drawTarget || type === 'delete') return;
    for (const id of ids) {
      const f = this.draw.getSnapshotFeature(id);
      if (!f || !f.properties?.currentlyDrawing) continue;
      this.emitMeasure(f.geometry as Geometry, true);
    }
  }

  private emitMeasure(geometry: Geometry, drawing: boolean): void {
    const target = this.drawTarget;
    if (!target) return;
    const label = drawing ? cursorMeasureText(geometry) : null;
    this.setCursorLabel(label?.at ?? null, label?.text ?? '');
    if (drawing) this.callbacks.onDrawProgress?.(label?.points ?? 0);
    try {
      if (geometry.type === 'LineString' && geometry.coordinates.length >= 2) {
        const m = measureLine(geometry);
        this.callbacks.onMeasure?.({ shape: 'line', lengthFt: m.lengthFt, lengthMi: m.lengthMi, drawing, target });
      } else if (geometry.type === 'Polygon' && geometry.coordinates[0]?.length >= 4) {
        const m = measureArea(geometry);
        this.callbacks.onMeasure?.({ shape: 'area', acres: m.acres, hectares: m.hectares, perimeterFt: m.perimeterFt, drawing, target });
      }
    } catch {
      /* a shape in the middle of being drawn can be degenerate: no reading for it */
    }
  }

  private onDrawFinish(id: string | number, action: string): void {
    if (!this.draw || this.destroyed) return;
    const feature = this.draw.getSnapshotFeature(id);
    if (!feature) return;
    const geometry = feature.geometry as Geometry;
    if (action === 'draw') {
      this.setCursorLabel(null, '');
      this.callbacks.onDrawProgress?.(0);
      const target = this.drawTarget;
      if (!target) return;
      if (target.type === 'measure') {
        this.measureFeatureId = id;
        this.emitMeasure(geometry, false);
        this.drawTarget = null;
        this.drawKind = null;
        this.draw.setMode(MODE.select);
        this.callbacks.onToolEnded?.();
        return;
      }
      this.draw.removeFeatures([id]);
      this.drawTarget = null;
      this.drawKind = null;
      this.draw.setMode(MODE.select);
      this.callbacks.onMeasure?.(null);
      this.callbacks.onDrawn?.(target, geometry);
      return;
    }
    if (this.editing && this.editing.featureId === id) {
      this.editing.signature = JSON.stringify(geometry);
      this.callbacks.onEdited?.(this.editing.target, geometry);
    }
  }

  /** Starts a drawing tool (null: back to picking and editing). Ends any edit and clears a measure. */
  startDraw(target: DrawTarget | null): void {
    this.whenReady(() => {
      if (!this.draw) return;
      this.setCursorLabel(null, '');
      this.callbacks.onDrawProgress?.(0);
      this.clearMeasure();
      this.setEditing(null);
      this.drawTarget = target;
      this.drawKind = target?.type === 'unit' ? target.kind : null;
      this.callbacks.onMeasure?.(null);
      if (!target) {
        this.draw.setMode(MODE.select);
        return;
      }
      const mode =
        target.type === 'unit'
          ? FAMILY_MODE[KIND_STYLES[target.kind].family]
          : target.type === 'boundary'
            ? MODE.boundary
            : target.shape === 'line'
              ? MODE.measureLine
              : MODE.measureArea;
      // Re-entering the same mode restarts it, dropping a half-drawn shape.
      if (this.draw.getMode() === mode) this.draw.setMode(MODE.select);
      this.draw.setMode(mode);
    });
  }

  /** Stops the drawing tool, dropping a half-drawn shape. */
  cancelDraw(): void {
    if (!this.drawTarget) return;
    this.startDraw(null);
    this.callbacks.onToolEnded?.();
  }

  /** Removes the last measured shape. */
  clearMeasure(): void {
    if (this.draw && this.measureFeatureId !== null && this.draw.hasFeature(this.measureFeatureId)) this.draw.removeFeatures([this.measureFeatureId]);
    this.measureFeatureId = null;
  }

  /**
   * Shows a unit or the boundary with draggable vertices and lets the whole shape be moved; the
   * same target with an unchanged shape is left alone (no flicker while saving).
   */
  setEditing(target: EditTarget | null): void {
    this.whenReady(() => {
      const draw = this.draw;
      if (!draw) return;
      const signature = target ? JSON.stringify(singlePart(target.geometry)) : '';
      const sameTarget =
        this.editing &&
        target &&
        this.editing.target.type === target.type &&
        (target.type === 'boundary' || (this.editing.target.type === 'unit' && this.editing.target.unitId === target.unitId));
      if (sameTarget && this.editing && this.editing.signature === signature) {
        this.editing.target = target!;
        return;
      }
      if (this.editing && draw.hasFeature(this.editing.featureId)) {
        if (draw.getMode() === MODE.select) {
          try {
            draw.deselectFeature(this.editing.featureId);
          } catch {
            /* already deselected */
          }
        }
        draw.removeFeatures([this.editing.featureId]);
      }
      this.editing = null;
      hideUnit(this.map, null);
      hideBoundary(this.map, false);
      if (!target || !isEditableGeometry(target.geometry) || this.drawTarget) return;
      const mode = target.type === 'boundary' ? MODE.boundary : FAMILY_MODE[KIND_STYLES[target.kind].family];
      const id = draw.getFeatureId();
      const geometry = singlePart(target.geometry) as GeoJSONStoreFeatures['geometry'];
      const result = draw.addFeatures([
        { type: 'Feature', id, geometry, properties: { mode, ...(target.type === 'unit' ? { kind: target.kind } : {}) } },
      ]);
      if (!result[0]?.valid) return;
      this.editing = { target, featureId: id, signature };
      if (target.type === 'unit') hideUnit(this.map, target.unitId);
      else hideBoundary(this.map, true);
      draw.selectFeature(id);
    });
  }

  /** Puts the units on the map. */
  setUnits(collections: FamilyCollections): void {
    this.whenReady(() => setUnitData(this.map, collections));
  }

  /** Colours the units by kind or by work status. */
  setColourBy(by: ColourBy): void {
    this.whenReady(() => setColourBy(this.map, by));
  }

  /** Shows the crew's photo positions (an empty list hides them). */
  setPhotoPoints(points: readonly PhotoPoint[]): void {
    this.whenReady(() => setPhotoPoints(this.map, points));
  }

  /** Puts the boundary on the map. */
  setBoundary(boundary: Polygon | MultiPolygon | null, box: BBox | null): void {
    this.whenReady(() => setBoundaryData(this.map, boundary, box as [number, number, number, number] | null));
  }

  /** Shows an import preview (an empty list clears it). */
  setPreview(features: { geometry: Geometry; choice: string; highlight?: boolean }[]): void {
    this.whenReady(() => setPreviewData(this.map, features));
  }

  private imagery = { tiles: false, overlays: false };

  /** Over imagery the boundary's paper wash goes, and with tiles the graticule too. */
  private applyImagery(): void {
    const any = this.imagery.tiles || this.imagery.overlays;
    if (this.map.getLayer('boundary-fill')) this.map.setPaintProperty('boundary-fill', 'fill-opacity', any ? 0 : 0.55);
    if (this.map.getLayer('graticule-line')) this.map.setLayoutProperty('graticule-line', 'visibility', this.imagery.tiles ? 'none' : 'visible');
  }

  /** Shows the image overlays. */
  setOverlays(overlays: readonly MapOverlay[]): void {
    this.whenReady(() => {
      syncOverlays(this.map, overlays);
      this.imagery.overlays = overlays.length > 0;
      this.applyImagery();
    });
  }

  /** Changes an overlay's opacity on the map only. */
  setOverlayOpacity(overlayId: number, opacity: number): void {
    this.whenReady(() => setOverlayOpacity(this.map, overlayId, opacity));
  }

  private attribution: AttributionControl | null = null;

  /** Adds the firm's background tiles (null removes them). */
  setTiles(template: string | null, attribution?: string | null): void {
    this.whenReady(() => {
      setBackgroundTiles(this.map, template, attribution);
      this.imagery.tiles = Boolean(template);
      this.applyImagery();

    });
  }

  /** Flies to a place found by the search box: a county's box, or a town or typed point at a close zoom. */
  flyToPlace(place: { kind: 'county' | 'town' | 'coordinates'; center: [number, number]; bbox?: [number, number, number, number] }): void {
    this.whenReady(() => {
      if (place.bbox) this.map.fitBounds(new LngLatBounds([place.bbox[0], place.bbox[1]], [place.bbox[2], place.bbox[3]]), { padding: 40, duration: 800 });
      else this.map.flyTo({ center: place.center, zoom: place.kind === 'town' ? 12 : 15, duration: 800 });
    });
  }

  /** Shows a name tag over a position (the selected unit), or none. */
  setNameTag(tag: { lon: number; lat: number; text: string } | null): void {
    this.nameMarker?.remove();
    this.nameMarker = null;
    if (!tag) return;
    const el = document.createElement('div');
    el.className = 'pointer-events-none rounded bg-card/95 px-2 py-0.5 text-xs font-semibold text-ink shadow border border-rule whitespace-nowrap';
    el.textContent = tag.text;
    this.nameMarker = new Marker({ element: el, anchor: 'bottom', offset: [0, -14] }).setLngLat([tag.lon, tag.lat]).addTo(this.map);
  }

  private insetTopPx = 0;

  /** Height of what covers the map's top edge (the drawing chips), kept clear when fitting. */
  setInsetTop(px: number): void {
    this.insetTopPx = Math.max(0, Math.round(px));
  }

  /** Fits the view to a box [west, south, east, north], clear of the chips along the top. */
  fitTo(box: BBox | null, animate = false): void {
    if (!box) return;
    const [w, s, e, n] = box;
    const el = this.map.getContainer();
    const pad = Math.min(64, Math.max(20, Math.floor(Math.min(el.clientWidth, el.clientHeight) / 10)));
    const top = Math.min(this.insetTopPx + pad, Math.max(pad, el.clientHeight / 3));
    this.map.fitBounds(new LngLatBounds([w, s], [e, n]), { padding: { top, bottom: pad, left: pad, right: pad }, maxZoom: 18, animate, duration: animate ? 500 : 0 });
  }

  /** Brings a shape into view when its centre is off screen (the zoom stays). */
  reveal(geometry: Geometry): void {
    const box = bboxOf([geometry]);
    if (!box) return;
    const centre: [number, number] = [(box[0] + box[2]) / 2, (box[1] + box[3]) / 2];
    if (!this.map.getBounds().contains(centre)) this.map.easeTo({ center: centre, duration: 400 });
  }

  /** Removes the map and everything on it. */
  destroy(): void {
    this.destroyed = true;
    try {
      this.draw?.stop();
    } catch {
      /* the map may already be gone */
    }
    this.nameMarker?.remove();
    this.cursorLabel?.remove();
    this.stopBaseLayer?.();
    this.map.remove();
  }
}
