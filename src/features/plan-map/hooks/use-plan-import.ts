import { useEffect, useMemo, useRef, useState } from 'react';
import type { BBox, MultiPolygon, Polygon } from 'geojson';
import { bboxOf } from '../../../../shared/domain/geometry';
import { useToast } from '../../../components/ui/toast';
import { useCreateUnitsBulk } from '../api/create-units-bulk';
import { useUpdatePropertyBoundary } from '../api/update-property-boundary';
import { fetchImportGeometries, useImportFile, type ImportPreviewDto } from '../api/import-file';
import type { PlanMapController } from '../lib/plan-map-controller';
import { defaultImportChoice, planImportSave, type ImportChoice } from '../lib/import-choices';
import { formatAcresShort } from '../lib/measure-format';
import { errorText } from '../lib/error-text';
import type { PlanEditing } from './use-plan-editing';

interface ImportState {
  fileName: string;
  preview: ImportPreviewDto;
  choices: ImportChoice[];
  hover: number | null;
}

/**
 * A geometry file import on the plan map: upload with progress, the preview drawn on the map, the
 * person's choice per feature, and the save (boundary and units, large-area question, undo).
 */
export function usePlanImport(controller: PlanMapController | null, propertyId: number, boundary: Polygon | MultiPolygon | null, boundaryBox: BBox | null, editing: PlanEditing) {
  const toast = useToast();
  const importFile = useImportFile(propertyId);
  const createBulk = useCreateUnitsBulk(propertyId);
  const updateBoundary = useUpdatePropertyBoundary(propertyId);
  const [importState, setImportState] = useState<ImportState | null>(null);
  const [uploadProgress, setUploadProgress] = useState<number | null | undefined>(undefined);
  const [savingImport, setSavingImport] = useState(false);
  const fileInput = useRef<HTMLInputElement>(null);
  const { withLargeAreaCheck, undo, setSelectedId } = editing;

  useEffect(() => {
    if (!controller) return;
    controller.setPreview(
      importState ? importState.preview.features.map((f, i) => ({ geometry: f.geometry, choice: importState.choices[i], highlight: importState.hover === i })) : [],
    );
  }, [controller, importState]);

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

  return { importState, setImportState, importPlan, startImport, saveImport, savingImport, uploadProgress, fileInput };
}
