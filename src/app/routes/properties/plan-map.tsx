/**
 * The plan map page: the consultant's drafting table for one property. State lives in the
 * plan-map feature's hooks (data, map sync, editing, import, photos); this file composes them.
 * More layers (observations, stands, …) go in `<PlanMapLayers>` below, one element each — see
 * DEVELOPERS.md, "Plan map: adding a layer".
 */
import { useRef, useState } from 'react';
import { useParams } from 'react-router-dom';
import { bboxOf } from '../../../../shared/domain/geometry';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { usePlanMapData } from '../../../features/plan-map/hooks/use-plan-map-data';
import { useMapSync } from '../../../features/plan-map/hooks/use-map-sync';
import { usePlanEditing } from '../../../features/plan-map/hooks/use-plan-editing';
import { usePlanImport } from '../../../features/plan-map/hooks/use-plan-import';
import { usePlanOverlays } from '../../../features/plan-map/hooks/use-plan-overlays';
import { PlanMapCanvas } from '../../../features/plan-map/components/plan-map-canvas';
import { PlanMapHeader } from '../../../features/plan-map/components/plan-map-header';
import { PlanMapLayers, PlanMapProvider } from '../../../components/map/plan-map-layers';
import { PlaceSearch } from '../../../features/plan-map/components/place-search';
import { DrawChips } from '../../../features/plan-map/components/draw-chips';
import { DrawControls, DrawHint, MeasureReadout, drawsArea, drawsPoint } from '../../../features/plan-map/components/draw-status';
import { PlanLedger } from '../../../features/plan-map/components/plan-ledger';
import { UnitDetail } from '../../../features/plan-map/components/unit-detail';
import { ImportPanel } from '../../../features/plan-map/components/import-panel';
import { MapLegend } from '../../../features/plan-map/components/map-legend';
import { OverlayPanel } from '../../../features/plan-map/components/overlay-panel';
import { MapSidePanel, ShowMapPanelButton, useSidePanel } from '../../../features/plan-map/components/map-side-panel';
import type { PlanMapCallbacks, PlanMapController } from '../../../features/plan-map/lib/plan-map-controller';
import type { ColourBy } from '../../../features/plan-map/lib/plan-layers';
import { usePropertyProgress } from '../../../features/schedule/api/get-property-progress';
import { useTasks } from '../../../features/schedule/api/get-tasks';
import { ObservationsLayer } from '../../../features/observations/components/observations-layer';
import { PlotStatusPanel } from '../../../features/checks/components/plot-status-panel';

/** The plan map: the consultant's drafting table for one property. */
export function PlanMapPage() {
  const params = useParams();
  const propertyId = Number(params.id);
  const [controller, setController] = useState<PlanMapController | null>(null);
  const [colourBy, setColourBy] = useState<ColourBy>('kind');
  const [tilesFailed, setTilesFailed] = useState(false);
  const chipsRef = useRef<HTMLDivElement>(null);
  const sidePanel = useSidePanel();
  const valid = Number.isInteger(propertyId) && propertyId > 0;
  const progress = usePropertyProgress(propertyId, valid);
  const doneTasks = useTasks({ propertyId, status: 'done', limit: 500 }, colourBy === 'status' && valid);
  const data = usePlanMapData(propertyId, colourBy, { unitStatuses: progress.data?.units, doneTasks: doneTasks.data?.tasks });
  const { property, units, plan, unitList, boundary, statuses } = data;
  const { tileTemplate } = useMapSync(controller, propertyId, data, colourBy, chipsRef);
  const editing = usePlanEditing(controller, propertyId, unitList, boundary);
  const importer = usePlanImport(controller, propertyId, boundary, data.boundaryBox, editing);
  const photos = usePlanOverlays(controller, propertyId);
  const { selected, drawTarget, measure } = editing;
  const importState = importer.importState;
  const callbacks: PlanMapCallbacks = { ...editing.drawCallbacks, onTilesFailed: () => setTilesFailed(true) };

  if (!valid) return <ErrorPanel error={new Error('This address does not name a property.')} />;
  if (property.isError) {
    return (
      <div className="p-6">
        <ErrorPanel error={property.error} />
      </div>
    );
  }

  return (
    <PlanMapProvider controller={controller} propertyId={propertyId}>
      <div className="flex h-full min-h-0 flex-col">
        <PlanMapHeader propertyId={propertyId} property={property.data} hasBoundary={!!boundary} editing={editing} importer={importer} />
        <div className="flex min-h-0 flex-1 flex-col lg:flex-row">
          <div className="relative flex min-h-[22rem] min-w-0 flex-1">
            <MapSidePanel open={sidePanel.open} onOpenChange={sidePanel.setOpen}>
              <OverlayPanel overlays={data.overlays.data ?? []} uploading={photos.progress} onUpload={photos.onUpload} onPreview={photos.onPreview} onChange={photos.onChange} onDelete={photos.onDelete} />
              <PlanMapLayers>
                {/* More map layers go here, one element each (see DEVELOPERS.md). */}
                <ObservationsLayer map={controller?.map ?? null} propertyId={propertyId} />
              </PlanMapLayers>
              <MapLegend kinds={data.legendKinds} hasBoundary={!!boundary} byStatus={colourBy === 'status'} />
            </MapSidePanel>
            <div className="relative min-w-0 flex-1">
              <PlanMapCanvas callbacks={callbacks} onController={setController} unitCount={unitList.length} />
              <div className="pointer-events-none absolute inset-x-2 top-2 z-10 flex flex-col items-start gap-2">
                <div className="pointer-events-auto relative z-20 flex max-w-full items-start gap-2">
                  {!sidePanel.open ? <ShowMapPanelButton onOpen={() => sidePanel.setOpen(true)} /> : null}
                  <div className="min-w-0">
                    <PlaceSearch onPick={(place) => controller?.flyToPlace(place)} />
                  </div>
                </div>
                <div ref={chipsRef} className="relative z-10 w-full">
                  <DrawChips active={drawTarget} onChoose={editing.chooseTool} hasBoundary={!!boundary} />
                </div>
                {drawTarget ? <DrawHint target={drawTarget} /> : null}
                {drawTarget && !drawsPoint(drawTarget) ? (
                  <div className="pointer-events-auto">
                    <DrawControls points={editing.drawPoints} area={drawsArea(drawTarget)} onFinish={() => controller?.finishDraw()} onUndo={() => controller?.undoVertex()} onCancel={editing.cancelDraw} />
                  </div>
                ) : null}
                {measure ? (
                  <div className="pointer-events-auto">
                    <MeasureReadout
                      reading={measure}
                      onClear={() => {
                        controller?.clearMeasure();
                        editing.setMeasure(null);
                      }}
                    />
                  </div>
                ) : null}
                {tilesFailed && tileTemplate ? (
                  <p role="status" className="pointer-events-auto rounded border-l-4 border-clay bg-card/95 px-3 py-1 text-xs text-ink shadow-sm">
                    <strong>Imagery offline.</strong> {new URL(tileTemplate.replace(/\{[a-z]\}/g, '0')).host} did not answer; the state and county lines and the plan still work. The firm owner can check the imagery choice in Settings.
                  </p>
                ) : null}
                {editing.editingBoundary ? (
                  <p role="status" className="pointer-events-auto rounded bg-ink/85 px-3 py-1 text-xs text-white">
                    Drag the boundary’s corners or the whole outline; each change is saved.
                  </p>
                ) : null}
              </div>
              {property.data && !boundary && unitList.length === 0 && !drawTarget && !importState ? (
                <div className="pointer-events-none absolute inset-0 z-0 flex items-center justify-center">
                  <div className="pointer-events-auto max-w-sm rounded-md border border-rule bg-card/95 px-5 py-4 text-center shadow-sm">
                    <p className="font-serif text-ink">No boundary yet</p>
                    <p className="mt-1 text-sm text-slate">Find the farm with the search box, then choose “Boundary” above and click its corners on the map — or import a KML, GPX, GeoJSON or shapefile.</p>
                  </div>
                </div>
              ) : null}
            </div>
          </div>
          <ConfirmDialog open={editing.largeAsk !== null} title="Keep this large area?" confirmLabel="Keep it" onConfirm={() => editing.answerLargeArea(true)} onCancel={() => editing.answerLargeArea(false)}>
            <p>{editing.largeAsk?.message.replace(/;? ?to keep it anyway, confirm the large area \(confirmLargeArea: true\)\.$/, '.')}</p>
            <p className="mt-2 text-slate">Cancel leaves the plan as it was.</p>
          </ConfirmDialog>
          <aside aria-label="Plan ledger" className="max-h-[45vh] w-full shrink-0 overflow-y-auto border-t border-rule bg-card px-4 py-4 lg:max-h-none lg:w-[20rem] lg:border-l min-[90rem]:w-[22rem] lg:border-t-0">
            {importState && importer.importPlan ? (
              <ImportPanel
                fileName={importState.fileName}
                preview={importState.preview}
                choices={importState.choices}
                problems={importer.importPlan.problems}
                saving={importer.savingImport}
                onChoose={(i, c) => importer.setImportState((s) => (s ? { ...s, choices: s.choices.map((old, j) => (j === i ? c : old)) } : s))}
                onHover={(i) => importer.setImportState((s) => (s && s.hover !== i ? { ...s, hover: i } : s))}
                onSave={() => void importer.saveImport()}
                onCancel={() => importer.setImportState(null)}
              />
            ) : units.isPending || property.isPending ? (
              <Loading />
            ) : units.isError ? (
              <ErrorPanel error={units.error} />
            ) : selected ? (
              <UnitDetail
                key={selected.id}
                unit={selected}
                saving={editing.updateUnit.isPending}
                deleting={editing.deleteUnit.isPending}
                onSave={(input) => editing.saveDetails(selected, input)}
                onDelete={() => void editing.removeUnit(selected)}
                onBack={() => editing.setSelectedId(null)}
                onZoom={() => controller?.fitTo(bboxOf([selected.geometry]), true)}
              />
            ) : (
              <PlanLedger
                units={unitList}
                plan={plan.data}
                planError={plan.error}
                selectedId={editing.selectedId}
                colourBy={colourBy}
                onColourBy={setColourBy}
                statuses={statuses}
                onSelect={(id) => {
                  editing.setSelectedId(id);
                  const unit = unitList.find((u) => u.id === id);
                  if (unit) controller?.reveal(unit.geometry);
                }}
              />
            )}
            <PlotStatusPanel propertyId={propertyId} />
          </aside>
        </div>
      </div>
    </PlanMapProvider>
  );
}

/** Route module for React Router's lazy loading. */
export const Component = PlanMapPage;
