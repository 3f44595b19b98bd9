import { useCallback, useEffect, useMemo, useState } from 'react';
import type { Geometry, MultiPolygon, Polygon } from 'geojson';
import { bboxOf, centroidOf } from '../../../../shared/domain/geometry';
import type { UnitDto, UnitUpdateInput } from '../../../../shared/schemas/unit';
import { useToast } from '../../../components/ui/toast';
import { useCreateUnit } from '../api/create-unit';
import { useUpdateUnit } from '../api/update-unit';
import { useDeleteUnit } from '../api/delete-unit';
import { useUpdatePropertyBoundary } from '../api/update-property-boundary';
import { usePlanUndo } from './use-plan-undo';
import type { DrawTarget, MeasureReading, PlanMapCallbacks, PlanMapController } from '../lib/plan-map-controller';
import { defaultUnitName } from '../lib/unit-features';
import { formatAcresShort, formatFeet } from '../lib/measure-format';
import { isLargeAreaRefusal } from '../lib/large-area-answer';
import { errorText, isTyping } from '../lib/error-text';

/**
 * The drafting state of the plan map: the selected unit, boundary editing, the tool in hand and its
 * live measure, the large-area question, and every save (drawn, edited, details, delete, undo) with
 * its toast. Also the keyboard (Delete, Ctrl+Z, Backspace, Esc) and what the map is told to edit.
 */
export function usePlanEditing(controller: PlanMapController | null, propertyId: number, unitList: UnitDto[], boundary: Polygon | MultiPolygon | null) {
  const toast = useToast();
  const createUnit = useCreateUnit(propertyId);
  const updateUnit = useUpdateUnit(propertyId);
  const deleteUnit = useDeleteUnit(propertyId);
  const updateBoundary = useUpdatePropertyBoundary(propertyId);
  const [selectedId, setSelectedId] = useState<number | null>(null);
  const [editingBoundary, setEditingBoundary] = useState(false);
  const [drawTarget, setDrawTarget] = useState<DrawTarget | null>(null);
  const [measure, setMeasure] = useState<MeasureReading | null>(null);
  const [drawPoints, setDrawPoints] = useState(0);
  // The question asked when the server refuses an unconfirmed large area (422 naming confirmLargeArea).
  const [largeAsk, setLargeAsk] = useState<{ message: string; resolve: (keep: boolean) => void } | null>(null);
  const selected = useMemo(() => unitList.find((u) => u.id === selectedId) ?? null, [unitList, selectedId]);
  const undo = usePlanUndo(propertyId, { onUnitGone: (id) => setSelectedId((cur) => (cur === id ? null : cur)) });

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

  const cancelDraw = useCallback(() => {
    controller?.cancelDraw();
    setMeasure(null);
  }, [controller]);

  /** Asks whether to keep a large area; answers the person's choice. */
  const askLargeArea = (message: string) => new Promise<boolean>((resolve) => setLargeAsk({ message, resolve }));
  const answerLargeArea = (keep: boolean) => {
    largeAsk?.resolve(keep);
    setLargeAsk(null);
  };

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

  const saveEdited = async (target: Parameters<NonNullable<PlanMapCallbacks['onEdited']>>[0], geometry: Geometry) => {
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
        if (drawTarget) cancelDraw();
        else {
          setSelectedId(null);
          setEditingBoundary(false);
        }
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [selected, drawTarget, controller, removeUnit, runUndo, cancelDraw]);

  /** The map's callbacks for drawing and editing (the page adds tile failures). */
  const drawCallbacks: PlanMapCallbacks = {
    onDrawn: (t, g) => void saveDrawn(t, g),
    onEdited: (t, g) => void saveEdited(t, g),
    onPick: (id) => {
      setSelectedId(id);
      if (id !== null) setEditingBoundary(false);
    },
    onMeasure: setMeasure,
    onToolEnded: () => setDrawTarget(null),
    onDrawProgress: setDrawPoints,
  };

  return {
    selected,
    selectedId,
    setSelectedId,
    editingBoundary,
    setEditingBoundary,
    drawTarget,
    measure,
    setMeasure,
    drawPoints,
    largeAsk,
    answerLargeArea,
    withLargeAreaCheck,
    chooseTool,
    cancelDraw,
    saveDetails,
    removeUnit,
    runUndo,
    undo,
    updateUnit,
    deleteUnit,
    drawCallbacks,
  };
}

export type PlanEditing = ReturnType<typeof usePlanEditing>;
