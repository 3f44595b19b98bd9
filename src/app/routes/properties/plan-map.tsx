import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import type { Geometry, MultiPolygon, Polygon } from 'geojson';
import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { bboxOf, centroidOf } from '../../../../shared/domain/geometry';
import type { UnitDto, UnitUpdateInput } from '../../../../shared/schemas/unit';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';
import { useProperty } from '../../../features/plan-map/api/get-property';
import { useUnits } from '../../../features/plan-map/api/get-units';
import { usePlan } from '../../../features/plan-map/api/get-plan';
import { useFirm } from '../../../features/plan-map/api/get-firm';
import { useOverlays } from '../../../features/plan-map/api/get-overlays';
import { useUpdateOverlay } from '../../../features/plan-map/api/update-overlay';
import { useCreateUnit } from '../../../features/plan-map/api/create-unit';
import { useCreateUnitsBulk } from '../../../features/plan-map/api/create-units-bulk';
import { useUpdateUnit } from '../../../features/plan-map/api/update-unit';
import { useDeleteUnit } from '../../../features/plan-map/api/delete-unit';
import { useUpdatePropertyBoundary } from '../../../features/plan-map/api/update-property-boundary';
import { fetchImportGeometries, useImportFile, type ImportPreviewDto } from '../../../features/plan-map/api/import-file';
import { usePlanUndo } from '../../../features/plan-map/hooks/use-plan-undo';
import { PlanMapCanvas } from '../../../features/plan-map/components/plan-map-canvas';
import { ObservationsLayer } from '../../../features/observations/components/observations-layer';
import { PlaceSearch } from '../../../features/plan-map/components/place-search';
import { DrawChips } from '../../../features/plan-map/components/draw-chips';
import { PlanLedger } from '../../../features/plan-map/components/plan-ledger';
import { UnitDetail } from '../../../features/plan-map/components/unit-detail';
import { ImportPanel } from '../../../features/plan-map/components/import-panel';
import { MapLegend } from '../../../features/plan-map/components/map-legend';
import { ExportMenu } from '../../../features/plan-map/components/export-menu';
import { OverlayPanel } from '../../../features/plan-map/components/overlay-panel';
import type { DrawTarget, MeasureReading, PlanMapController, PlanMapCallbacks } from '../../../features/plan-map/lib/plan-map-controller';
import { defaultUnitName, kindsPresent, unitsToCollections } from '../../../features/plan-map/lib/unit-features';
import { defaultImportChoice, planImportSave, type ImportChoice } from '../../../features/plan-map/lib/import-choices';
import { formatAcresShort, formatFeet, formatHectares, formatMiles } from '../../../features/plan-map/lib/measure-format';
import type { ColourBy } from '../../../features/plan-map/lib/plan-layers';
import { isLargeAreaRefusal } from '../../../features/plan-map/lib/large-area-answer';
import { usePropertyProgress } from '../../../features/schedule/api/get-property-progress';
import { useTasks } from '../../../features/schedule/api/get-tasks';
import type { UnitWorkStatus } from '../../../../shared/domain/tasks';

/** The first field message of a 422 answer, or the error's own message. */
function errorText(err: unknown): string {
  if (err instanceof ApiError && Array.isArray(err.details) && err.details.length > 0) {
    const first = err.details[0] as { path?: string; message?: string };
    if (first.message) return `${err.message}: ${first.message}`;
  }
  return err instanceof Error ? err.message : 'Something went wrong. Please try again.';
}

function isTyping(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable);
}

function MeasureReadout({ reading, onClear }: { reading: MeasureReading; onClear: () => void }) {
  const what =
    reading.target.type === 'measure'
      ? reading.drawing
        ? 'Measuring'
        : 'Measured'
      : reading.target.type === 'boundary'
        ? 'Boundary'
        : KIND_STYLES[reading.target.kind].label;
  return (
    <div role="status" aria-label="Measure" className="flex items-center gap-3 rounded border border-sky/50 bg-card/95 px-3 py-1.5 text-sm shadow-sm">
      <span className="text-slate">{what}</span>
      {reading.shape === 'line' ? (
        <span className="figure font-bold text-ink">
          {formatFeet(reading.lengthFt)} · {formatMiles(reading.lengthMi)}
        </span>
      ) : (
        <span className="figure font-bold text-ink">
          {formatAcresShort(reading.acres)} · {formatHectares(reading.hectares)} · perimeter {formatFeet(reading.perimeterFt)}
        </span>
      )}
      {!reading.drawing && reading.target.type === 'measure' ? (
        <button type="button" onClick={onClear} className="text-moss-deep hover:underline">
          Clear
        </button>
      ) : null}
    </div>
  );
}

/** Finish, Undo point and Cancel while a line or an area is being drawn. */
function DrawControls({ points, area, onFinish, onUndo, onCancel }: { points: number; area: boolean; onFinish: () => void; onUndo: () => void; onCancel: () => void }) {
  const canFinish = points >= (area ? 3 : 2);
  return (
    <div role="group" aria-label="Drawing" className="flex flex-wrap items-center gap-1.5">
      <Button type="button" className="!px-3 !py-1" onClick={onFinish} disabled={!canFinish} title="Finish the shape (Enter)">
        Finish
      </Button>
      <Button type="button" variant="secondary" className="!px-3 !py-1" onClick={onUndo} disabled={points < 1} title="Take back the last point (Backspace)">
        Undo point
      </Button>
      <Button type="button" variant="secondary" className="!px-3 !py-1" onClick={onCancel} title="Stop drawing; nothing is saved (Esc)">
        Cancel
      </Button>
    </div>
  );
}

interface ImportState {
  fileName: string;
  preview: ImportPreviewDto;
  choices: ImportChoice[];
  hover: number | null;
}

/** The plan map: the consultant's drafting table for one property. */
export function PlanMapPage() {
  const params = useParams();
  const propertyId = Number(params.id);
  const toast = useToast();
  const property = useProperty(propertyId);
  const units = useUnits(propertyId);
  const plan = usePlan(propertyId);
  const firm = useFirm();
  const overlays = useOverlays(propertyId);
  const createUnit = useCreateUnit(propertyId);
  const createBulk = useCreateUnitsBulk(propertyId);
  const updateUnit = useUpdateUnit(propertyId);
  const deleteUnit = useDeleteUnit(propertyId);
  const updateBoundary = useUpdatePropertyBoundary(propertyId);
  const updateOverlay = useUpdateOverlay(propertyId);
  const importFile = useImportFile(propertyId);
  const [colourBy, setColourBy] = useState<ColourBy>('kind');
  const progress = usePropertyProgress(propertyId, Number.isInteger(propertyId) && propertyId > 0);
  // In work-status mode the crew's photos with a position show as dots.
  const doneTasks = useTasks({ propertyId, status: 'done' }, colourBy === 'status' && Number.isInteger(propertyId) && propertyId > 0);

  const [controller, setController] = useState<PlanMapController | null>(null);
  const [selectedId, setSelectedId] = useState<number | null>(null);
  const [editingBoundary, setEditingBoundary] = useState(false);
  const [drawTarget, setDrawTarget] = useState<DrawTarget | null>(null);
  const [measure, setMeasure] = useState<MeasureReading | null>(null);
  const [drawPoints, setDrawPoints] = useState(0);
  // The question asked when the server refuses an unconfirmed large area (422 naming confirmLargeArea).
  const [largeAsk, setLargeAsk] = useState<{ message: string; resolve: (keep: boolean) => void } | null>(null);
  const [importState, setImportState] = useState<ImportState | null>(null);
  const [tilesFailed, setTilesFailed] = useState(false);
  const [uploadProgress, setUploadProgress] = useState<number | null | undefined>(undefined);
  const fileInput = useRef<HTMLInputElement>(null);
  const chipsRef = useRef<HTMLDivElement>(null);

  const unitList = useMemo(() => units.data ?? [], [units.data]);
  const selected = useMemo(() => unitList.find((u) => u.id === selectedId) ?? null, [unitList, selectedId]);
  const boundary = property.data?.boundary ?? null;

  const undo = usePlanUndo(propertyId, {
    onUnitGone: (id) => setSelectedId((cur) => (cur === id ? null : cur)),
  });

  // Map data, memoised so that the sources are only rewritten when the units change.
  const statuses = useMemo(() => new Map<number, UnitWorkStatus>((progress.data?.units ?? []).map((u) => [u.unitId, u.status])), [progress.data]);
  const collections = useMemo(() => unitsToCollections(unitList, statuses), [unitList, statuses]);
  useEffect(() => controller?.setColourBy(colourBy), [controller, colourBy]);
  const photoPoints = useMemo(
    () =>
      colourBy === 'status'
        ? (doneTasks.data?.tasks ?? []).flatMap((t) =>
            t.photos.filter((p) => p.latitude !== null && p.longitude !== null).map((p) => ({ id: p.id, lon: p.longitude as number, lat: p.latitude as number, label: `${t.name}, ${t.unitName}` })),
          )
        : [],
    [colourBy, doneTasks.data],
  );
  useEffect(() => controller?.setPhotoPoints(photoPoints), [controller, photoPoints]);
  const legendKinds = useMemo(() => kindsPresent(unitList), [unitList]);
  const boundaryBox = useMemo(() => (boundary ? bboxOf([boundary]) : null), [boundary]);

  useEffect(() => controller?.setUnits(collections), [controller, collections]);
  // New corners snap to the boundary's corners and to other units' corners.
  useEffect(() => controller?.setSnapTargets([...(boundary ? [boundary] : []), ...unitList.map((u) => u.geometry)]), [controller, boundary, unitList]);
  // Without a boundary the graticule is laid around the units instead.
  const unitsBox = useMemo(() => (boundaryBox ? null : bboxOf(unitList.map((u) => u.geometry))), [boundaryBox, unitList]);
  const gridKey = JSON.stringify(boundaryBox ?? unitsBox);
  const gridBox = useMemo(() => JSON.parse(gridKey) as ReturnType<typeof bboxOf>, [gridKey]);
  useEffect(() => controller?.setBoundary(boundary, gridBox), [controller, boundary, gridBox]);

  // Keep the search box and the chips clear when fitting the view.
  useEffect(() => {
    const el = chipsRef.current;
    if (!controller || !el) return;
    const observer = new ResizeObserver(() => controller.setInsetTop(el.offsetTop + el.offsetHeight + 8));
    observer.observe(el);
    controller.setInsetTop(el.offsetTop + el.offsetHeight + 8);
    return () => observer.disconnect();
  }, [controller]);

  // Fit once per property, when the boundary (or, without one, the units) first arrive.
  const fitted = useRef<number | null>(null);
  useEffect(() => {
    if (!controller || fitted.current === propertyId || !property.data || !units.data) return;
    const box = boundaryBox ?? bboxOf(units.data.map((u) => u.geometry));
    controller.fitTo(box);
    fitted.current = propertyId;
  }, [controller, propertyId, property.data, units.data, boundaryBox]);

  useEffect(() => controller?.setOverlays(overlays.data ?? []), [controller, overlays.data]);
  const tileTemplate = firm.data?.settings.tileUrlTemplate ?? null;
  const tileAttribution = firm.data?.settings.tileAttribution ?? null;
  useEffect(() => controller?.setTiles(tileTemplate, tileAttribution), [controller, tileTemplate, tileAttribution]);

  // The selected unit (or the boundary) is handed to terra-draw for editing.
  useEffect(() => {
    if (!controller) return;
    if (editingBoundary && boundary) controller.setEditing({ type: 'boundary', geometry: boundary });
    else if (selected && !drawTarget) controller.setEditing({ type: 'unit', unitId: selected.id, kind: selected.kind, geometry: selected.geometry });
    else controller.setEditing(null);
  }, [controller, selected, editingBoundary, boundary, drawTarget]);

  useEffect(() => {
    if (!controller) return;
    if (!selected) return controller.setNameTag(null);
    const c = centroidOf(selected.geometry);
    controller.setNameTag({ lon: c.lon, lat: c.lat, text: selected.name });
  }, [controller, selected]);

  useEffect(() => {
    if (!controller) return;
    controller.setPreview(
      importState ? importState.preview.features.map((f, i) => ({ geometry: f.geometry, choice: importState.choices[i], highlight: importState.hover === i })) : [],
    );
  }, [controller, importState]);

  const chooseTool = useCallback(
    (target: DrawTarget | null) => {
      if (target) {
        setSelectedId(null);
        setEditingBoundary(false);
      }
      setDrawTarget(target);
      setMeasure(null);
      controller?.startDraw(target);
    },
    [controller],
  );

  /** Asks whether to keep a large area; answers the person's choice. */
  const askLargeArea = (message: string) => new Promise<boolean>((resolve) => setLargeAsk({ message, resolve }));

  /**
   * Saves, and when the server refuses an unconfirmed large area, asks and saves again confirmed.
   * Answers null when the person chose not to keep it (nothing saved).
   */
  const withLargeAreaCheck = async <T,>(save: (confirmLargeArea: boolean) => Promise<T>): Promise<T | null> => {
    try {
      return await save(false);
    } catch (err) {
      if (!isLargeAreaRefusal(err)) throw err;
      if (!(await askLargeArea(err.message))) return null;
      return save(true);
    }
  };

  const saveDrawn = async (target: DrawTarget, geometry: Geometry) => {
    setDrawTarget(null);
    if (target.type === 'unit') {
      const name = defaultUnitName(target.kind, unitList);
      try {
        const unit = await withLargeAreaCheck((confirmLargeArea) => createUnit.mutateAsync({ kind: target.kind, name, geometry, ...(confirmLargeArea ? { confirmLargeArea } : {}) }));
        if (!unit) {
          toast('success', `${name} was not saved.`);
          return;
        }
        undo.record({ type: 'create', unitId: unit.id, name: unit.name });
        setSelectedId(unit.id);
        const measureText = unit.acres !== null ? ` (${formatAcresShort(unit.acres)})` : unit.lengthFt !== null ? ` (${formatFeet(unit.lengthFt)})` : '';
        toast('success', `${unit.name} added${measureText}.`);
      } catch (err) {
        toast('error', `${name} was not saved. ${errorText(err)}`);
      }
      return;
    }
    if (target.type === 'boundary') {
      if (geometry.type !== 'Polygon') return;
      if (boundary && !window.confirm('Replace the property boundary with the one you drew? You can undo it.')) return;
      try {
        const before = boundary;
        const saved = await withLargeAreaCheck((confirmLargeArea) => updateBoundary.mutateAsync({ boundary: geometry, confirmLargeArea }));
        if (!saved) {
          toast('success', 'The boundary was not saved.');
          return;
        }
        undo.record({ type: 'boundary', before });
        controller?.fitTo(bboxOf([geometry]), true);
        toast('success', `Boundary saved: ${formatAcresShort(saved.acres ?? 0)}.`);
      } catch (err) {
        toast('error', `The boundary was not saved. ${errorText(err)}`);
      }
    }
  };

  const saveEdited: PlanMapCallbacks['onEdited'] = async (target, geometry) => {
    if (target.type === 'boundary') {
      try {
        const before = boundary;
        const saved = await withLargeAreaCheck((confirmLargeArea) => updateBoundary.mutateAsync({ boundary: geometry as Polygon | MultiPolygon, confirmLargeArea }));
        if (!saved) {
          controller?.setEditing(null);
          setEditingBoundary(false);
          return;
        }
        undo.record({ type: 'boundary', before });
      } catch (err) {
        toast('error', `The boundary change was not saved. ${errorText(err)}`);
        controller?.setEditing(null);
        setEditingBoundary(false);
      }
      return;
    }
    const before = unitList.find((u) => u.id === target.unitId);
    if (!before) return;
    try {
      const saved = await withLargeAreaCheck((confirmLargeArea) => updateUnit.mutateAsync({ unitId: target.unitId, input: { geometry, ...(confirmLargeArea ? { confirmLargeArea } : {}) } }));
      if (!saved) {
        controller?.setEditing(null);
        controller?.setEditing({ type: 'unit', unitId: before.id, kind: before.kind, geometry: before.geometry });
        return;
      }
      undo.record({ type: 'update', unitId: before.id, name: before.name, before: { geometry: before.geometry } });
    } catch (err) {
      toast('error', `The new shape of ${before.name} was not saved. ${errorText(err)}`);
      // Put the saved shape back in the editor.
      controller?.setEditing(null);
      controller?.setEditing({ type: 'unit', unitId: before.id, kind: before.kind, geometry: before.geometry });
    }
  };

  const callbacks: PlanMapCallbacks = {
    onDrawn: (t, g) => void saveDrawn(t, g),
    onEdited: (t, g) => void saveEdited?.(t, g),
    onPick: (id) => {
      setSelectedId(id);
      if (id !== null) setEditingBoundary(false);
    },
    onMeasure: setMeasure,
    onToolEnded: () => setDrawTarget(null),
    onDrawProgress: setDrawPoints,
    onTilesFailed: () => setTilesFailed(true),
  };

  const saveDetails = async (unit: UnitDto, input: UnitUpdateInput) => {
    try {
      const saved = await updateUnit.mutateAsync({ unitId: unit.id, input });
      undo.record({ type: 'update', unitId: unit.id, name: saved.name, before: { name: unit.name, kind: unit.kind, notes: unit.notes } });
      toast('success', `${saved.name} saved.`);
    } catch (err) {
      toast('error', errorText(err));
      throw err;
    }
  };

  const removeUnit = useCallback(
    async (unit: UnitDto) => {
      if (!window.confirm(`Delete “${unit.name}”? You can undo it.`)) return;
      try {
        await deleteUnit.mutateAsync(unit.id);
        undo.record({ type: 'delete', unitId: unit.id, name: unit.name, unit: { kind: unit.kind, name: unit.name, notes: unit.notes, geometry: unit.geometry } });
        setSelectedId(null);
        toast('success', `${unit.name} deleted.`);
      } catch (err) {
        toast('error', errorText(err));
      }
    },
    [deleteUnit, undo, toast],
  );

  const runUndo = useCallback(async () => {
    try {
      const what = await undo.undo();
      if (what) toast('success', `Undone: ${what}.`);
    } catch (err) {
      toast('error', `Could not undo. ${errorText(err)}`);
    }
  }, [undo, toast]);

  // Keyboard: Delete removes the selected unit, Ctrl+Z undoes, Escape stops drawing or deselects.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (isTyping(e.target)) return;
      if ((e.key === 'Delete' || e.key === 'Backspace') && selected && !drawTarget) {
        e.preventDefault();
        void removeUnit(selected);
      } else if (drawTarget && (e.key === 'Backspace' || ((e.ctrlKey || e.metaKey) && !e.shiftKey && e.key.toLowerCase() === 'z'))) {
        // While drawing, Backspace and Ctrl+Z take back the last point, not a saved change.
        e.preventDefault();
        controller?.undoVertex();
      } else if ((e.ctrlKey || e.metaKey) && !e.shiftKey && e.key.toLowerCase() === 'z' && !drawTarget) {
        e.preventDefault();
        void runUndo();
      } else if (e.key === 'Escape') {
        if (drawTarget) {
          controller?.cancelDraw();
          setMeasure(null);
        } else {
          setSelectedId(null);
          setEditingBoundary(false);
        }
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [selected, drawTarget, controller, removeUnit, runUndo]);

  const startImport = async (file: File) => {
    setUploadProgress(0);
    try {
      const preview = await importFile.mutateAsync({ file, onProgress: (p) => setUploadProgress(p) });
      setSelectedId(null);
      setImportState({ fileName: file.name, preview, choices: preview.features.map((f) => defaultImportChoice(f)), hover: null });
      const box = bboxOf(preview.features.map((f) => f.geometry));
      if (box) controller?.fitTo(boundaryBox ? [Math.min(box[0], boundaryBox[0]), Math.min(box[1], boundaryBox[1]), Math.max(box[2], boundaryBox[2]), Math.max(box[3], boundaryBox[3])] : box, true);
    } catch (err) {
      toast('error', `${file.name} could not be imported. ${errorText(err)}`);
    } finally {
      setUploadProgress(undefined);
      if (fileInput.current) fileInput.current.value = '';
    }
  };

  const importPlan = useMemo(() => (importState ? planImportSave(importState.preview.features, importState.choices) : null), [importState]);
  const [savingImport, setSavingImport] = useState(false);
  const saveImport = async () => {
    if (!importState || !importPlan || importPlan.problems.length > 0) return;
    if (importPlan.boundary && boundary && !window.confirm('Replace the property boundary with the imported one? You can undo it.')) return;
    setSavingImport(true);
    try {
      // The preview drew outlines; save the full geometries of the chosen features.
      const { preview, choices } = importState;
      const chosen = preview.features.filter((_, i) => choices[i] !== 'skip').map((f) => f.item);
      const full = new Map((await fetchImportGeometries(propertyId, preview.importId, chosen)).map((g) => [g.item, g.geometry]));
      if (chosen.some((item) => !full.has(item))) throw new Error('The uploaded file is no longer on the server; upload it again.');
      const toSave = planImportSave(preview.features.map((f) => ({ ...f, geometry: full.get(f.item) ?? f.geometry })), choices);
      const parts: string[] = [];
      if (toSave.boundary) {
        const before = boundary;
        const importedBoundary = toSave.boundary;
        const saved = await withLargeAreaCheck((confirmLargeArea) => updateBoundary.mutateAsync({ boundary: importedBoundary, confirmLargeArea }));
        if (!saved) return;
        undo.record({ type: 'boundary', before });
        controller?.fitTo(bboxOf([toSave.boundary]), true);
        parts.push(`boundary (${formatAcresShort(saved.acres ?? 0)})`);
      }
      if (toSave.units.length > 0) {
        const importedUnits = toSave.units;
        const created = await withLargeAreaCheck((confirmLargeArea) => createBulk.mutateAsync({ units: importedUnits, confirmLargeArea }));
        if (!created) return;
        undo.record({ type: 'create-many', unitIds: created.map((u) => u.id) });
        parts.push(`${created.length} unit${created.length === 1 ? '' : 's'}`);
      }
      setImportState(null);
      toast('success', `Imported ${parts.join(' and ')}.`);
    } catch (err) {
      toast('error', `The import was not saved. ${errorText(err)}`);
    } finally {
      setSavingImport(false);
    }
  };

  if (!Number.isInteger(propertyId) || propertyId <= 0) return <ErrorPanel error={new Error('This address does not name a property.')} />;
  if (property.isError) {
    return (
      <div className="p-6">
        <ErrorPanel error={property.error} />
      </div>
    );
  }

  const p = property.data;
  return (
    <div className="flex h-full min-h-0 flex-col">
      <header className="flex flex-wrap items-center gap-x-4 gap-y-2 border-b border-rule bg-card px-4 py-2">
        <div className="min-w-0">
          <p className="text-xs text-slate">
            {p ? (
              <>
                <Link to={paths.client(p.clientId)} className="hover:underline">
                  {p.clientName}
                </Link>
                {' · '}
                <Link to={paths.property(p.id)} className="hover:underline">
                  Property details
                </Link>
                {' · '}
                <Link to={paths.propertyPrescriptions(p.id)} className="hover:underline">
                  Prescriptions
                </Link>
              </>
            ) : (
              <Link to={paths.properties} className="hover:underline">
                Properties
              </Link>
            )}
          </p>
          <h1 className="truncate text-xl font-bold leading-tight">{p ? p.name : 'Plan map'}</h1>
        </div>
        {p?.acres ? (
          <p className="figure text-sm text-slate" data-testid="property-size">
            <span className="text-lg font-bold text-ink">{formatAcresShort(p.acres)}</span> · {formatHectares(p.hectares ?? 0)}
          </p>
        ) : null}
        <div className="ml-auto flex flex-wrap items-center gap-2">
          <Button variant="secondary" className="!px-3 !py-1.5" onClick={() => void runUndo()} disabled={!undo.canUndo} busy={undo.busy} title={`${undo.title} (Ctrl+Z)`}>
            Undo
          </Button>
          {boundary ? (
            <Button
              variant="secondary"
              className="!px-3 !py-1.5"
              aria-pressed={editingBoundary}
              onClick={() => {
                chooseTool(null);
                setSelectedId(null);
                setEditingBoundary((v) => !v);
              }}
            >
              {editingBoundary ? 'Done with boundary' : 'Edit boundary'}
            </Button>
          ) : null}
          <input
            ref={fileInput}
            type="file"
            // Out of the accessibility tree: the "Import file" button is the one control people use.
            hidden
            id="plan-import-file"
            accept=".geojson,.json,.kml,.kmz,.gpx,.zip"
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) void startImport(file);
            }}
          />
          <Button variant="secondary" className="!px-3 !py-1.5" busy={uploadProgress !== undefined} onClick={() => fileInput.current?.click()}>
            {uploadProgress === undefined ? 'Import file' : uploadProgress === null ? 'Reading file…' : `Uploading ${Math.round(uploadProgress * 100)} %`}
          </Button>
          <ExportMenu propertyId={propertyId} />
        </div>
      </header>
      <div className="flex min-h-0 flex-1 flex-col lg:flex-row">
        <div className="relative min-h-[22rem] min-w-0 flex-1">
          <PlanMapCanvas callbacks={callbacks} onController={setController} unitCount={unitList.length} />
          <ObservationsLayer map={controller?.map ?? null} propertyId={propertyId} />
          <div className="pointer-events-none absolute inset-x-2 top-2 z-10 flex flex-col items-start gap-2">
            <div className="pointer-events-auto relative z-20 max-w-full">
              <PlaceSearch onPick={(place) => controller?.flyToPlace(place)} />
            </div>
            <div ref={chipsRef} className="pointer-events-auto max-w-full">
              <DrawChips active={drawTarget} onChoose={chooseTool} />
            </div>
            {drawTarget ? (
              <p role="status" className="pointer-events-auto rounded bg-ink/85 px-3 py-1 text-xs text-white">
                {drawTarget.type === 'unit' && KIND_STYLES[drawTarget.kind].family === 'point'
                  ? 'Click the map to place it. Esc to stop.'
                  : drawTarget.type === 'unit' && KIND_STYLES[drawTarget.kind].family === 'line'
                    ? 'Click to add points; click the last point again (or press Enter) to finish. Esc to stop.'
                    : drawTarget.type === 'measure' && drawTarget.shape === 'line'
                      ? 'Click to add points; click the last point again to finish. Nothing is saved.'
                      : 'Click to add corners; click the first corner to close the shape. Esc to stop.'}{' '}
                {drawTarget.type === 'unit' && KIND_STYLES[drawTarget.kind].family === 'point' ? '' : 'Corners snap to the boundary’s and other units’ corners.'}
              </p>
            ) : null}
            {drawTarget && !(drawTarget.type === 'unit' && KIND_STYLES[drawTarget.kind].family === 'point') ? (
              <div className="pointer-events-auto">
                <DrawControls
                  points={drawPoints}
                  area={drawTarget.type === 'boundary' || (drawTarget.type === 'measure' ? drawTarget.shape === 'area' : KIND_STYLES[drawTarget.kind].family === 'area')}
                  onFinish={() => controller?.finishDraw()}
                  onUndo={() => controller?.undoVertex()}
                  onCancel={() => {
                    controller?.cancelDraw();
                    setMeasure(null);
                  }}
                />
              </div>
            ) : null}
            {measure ? (
              <div className="pointer-events-auto">
                <MeasureReadout
                  reading={measure}
                  onClear={() => {
                    controller?.clearMeasure();
                    setMeasure(null);
                  }}
                />
              </div>
            ) : null}
            {tilesFailed && tileTemplate ? (
              <p role="status" className="pointer-events-auto rounded border-l-4 border-clay bg-card/95 px-3 py-1 text-xs text-ink shadow-sm">
                The background imagery from {new URL(tileTemplate.replace(/\{[a-z]\}/g, '0')).host} could not be loaded. The plan still works; the firm owner can check the tile address in Settings.
              </p>
            ) : null}
            {editingBoundary ? (
              <p role="status" className="pointer-events-auto rounded bg-ink/85 px-3 py-1 text-xs text-white">
                Drag the boundary’s corners or the whole outline; each change is saved.
              </p>
            ) : null}
          </div>
          <div className="pointer-events-none absolute bottom-12 left-2 z-10 flex flex-col items-start gap-2">
            <div className="pointer-events-auto">
              <OverlayPanel
                overlays={overlays.data ?? []}
                onPreview={(id, opacity) => controller?.setOverlayOpacity(id, opacity)}
                onCommit={(id, opacity) => updateOverlay.mutate({ overlayId: id, input: { opacity } }, { onError: (err) => toast('error', errorText(err)) })}
              />
            </div>
            <div className="pointer-events-auto">
              <MapLegend kinds={legendKinds} hasBoundary={!!boundary} byStatus={colourBy === 'status'} />
            </div>
          </div>
          {p && !boundary && unitList.length === 0 && !drawTarget && !importState ? (
            <div className="pointer-events-none absolute inset-0 z-0 flex items-center justify-center">
              <div className="pointer-events-auto max-w-sm rounded-md border border-rule bg-card/95 px-5 py-4 text-center shadow-sm">
                <p className="font-serif text-ink">No boundary yet</p>
                <p className="mt-1 text-sm text-slate">Choose “Boundary” above and click its corners on the map, or import a KML, GPX, GeoJSON or shapefile.</p>
              </div>
            </div>
          ) : null}
        </div>
        <ConfirmDialog
          open={largeAsk !== null}
          title="Keep this large area?"
          confirmLabel="Keep it"
          onConfirm={() => {
            largeAsk?.resolve(true);
            setLargeAsk(null);
          }}
          onCancel={() => {
            largeAsk?.resolve(false);
            setLargeAsk(null);
          }}
        >
          <p>{largeAsk?.message.replace(/;? ?to keep it anyway, confirm the large area \(confirmLargeArea: true\)\.$/, '.')}</p>
          <p className="mt-2 text-slate">Cancel leaves the plan as it was.</p>
        </ConfirmDialog>
        <aside aria-label="Plan ledger" className="max-h-[45vh] w-full shrink-0 overflow-y-auto border-t border-rule bg-card px-4 py-4 lg:max-h-none lg:w-[22rem] lg:border-l lg:border-t-0">
          {importState && importPlan ? (
            <ImportPanel
              fileName={importState.fileName}
              preview={importState.preview}
              choices={importState.choices}
              problems={importPlan.problems}
              saving={savingImport}
              onChoose={(i, c) => setImportState((s) => (s ? { ...s, choices: s.choices.map((old, j) => (j === i ? c : old)) } : s))}
              onHover={(i) => setImportState((s) => (s && s.hover !== i ? { ...s, hover: i } : s))}
              onSave={() => void saveImport()}
              onCancel={() => setImportState(null)}
            />
          ) : units.isPending || property.isPending ? (
            <Loading />
          ) : units.isError ? (
            <ErrorPanel error={units.error} />
          ) : selected ? (
            <UnitDetail
              key={selected.id}
              unit={selected}
              saving={updateUnit.isPending}
              deleting={deleteUnit.isPending}
              onSave={(input) => saveDetails(selected, input)}
              onDelete={() => void removeUnit(selected)}
              onBack={() => setSelectedId(null)}
              onZoom={() => controller?.fitTo(bboxOf([selected.geometry]), true)}
            />
          ) : (
            <PlanLedger
              units={unitList}
              plan={plan.data}
              planError={plan.error}
              selectedId={selectedId}
              colourBy={colourBy}
              onColourBy={setColourBy}
              statuses={statuses}
              onSelect={(id) => {
                setSelectedId(id);
                const unit = unitList.find((u) => u.id === id);
                if (unit) controller?.reveal(unit.geometry);
              }}
            />
          )}
        </aside>
      </div>
    </div>
  );
}

/** Route module for React Router's lazy loading. */
export const Component = PlanMapPage;
