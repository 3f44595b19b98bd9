import { Link } from 'react-router-dom';
import type { PropertyDto } from '../../../../shared/schemas/property';
import { paths } from '../../../config/paths';
import { Button } from '../../../components/ui/button';
import { ExportMenu } from './export-menu';
import { formatAcresShort, formatHectares, showsImperial } from '../lib/measure-format';
import type { PlanEditing } from '../hooks/use-plan-editing';
import type { usePlanImport } from '../hooks/use-plan-import';

/** The plan map's top bar: where the property belongs, its size, Undo, Edit boundary, Import file and Export. */
export function PlanMapHeader({
  propertyId,
  property,
  hasBoundary,
  editing,
  importer,
}: {
  propertyId: number;
  property: PropertyDto | undefined;
  hasBoundary: boolean;
  editing: PlanEditing;
  importer: ReturnType<typeof usePlanImport>;
}) {
  const p = property;
  const { undo } = editing;
  const progress = importer.uploadProgress;
  return (
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
          <span className="text-lg font-bold text-ink">{formatAcresShort(p.acres)}</span>{showsImperial() ? ` · ${formatHectares(p.hectares ?? 0)}` : ''}
        </p>
      ) : null}
      <div className="ml-auto flex flex-wrap items-center gap-2">
        <Button variant="secondary" className="!px-3 !py-1.5" onClick={() => void editing.runUndo()} disabled={!undo.canUndo} busy={undo.busy} title={`${undo.title} (Ctrl+Z)`}>
          Undo
        </Button>
        {hasBoundary ? (
          <Button
            variant="secondary"
            className="!px-3 !py-1.5"
            aria-pressed={editing.editingBoundary}
            onClick={() => {
              editing.chooseTool(null);
              editing.setSelectedId(null);
              editing.setEditingBoundary((v) => !v);
            }}
          >
            {editing.editingBoundary ? 'Done with boundary' : 'Edit boundary'}
          </Button>
        ) : null}
        <input
          ref={importer.fileInput}
          type="file"
          // Out of the accessibility tree: the "Import file" button is the one control people use.
          hidden
          id="plan-import-file"
          accept=".geojson,.json,.kml,.kmz,.gpx,.zip"
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) void importer.startImport(file);
          }}
        />
        <Button variant="secondary" className="!px-3 !py-1.5" busy={progress !== undefined} onClick={() => importer.fileInput.current?.click()}>
          {progress === undefined ? 'Import file' : progress === null ? 'Reading file…' : `Uploading ${Math.round(progress * 100)} %`}
        </Button>
        <ExportMenu propertyId={propertyId} />
      </div>
    </header>
  );
}
