import { useId } from 'react';
import { measureArea, measureLine } from '../../../../shared/domain/geometry';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/card';
import type { ImportPreviewDto } from '../api/import-file';
import { choiceLabel, choicesFor, type ImportChoice } from '../lib/import-choices';
import { formatAcresShort, formatFeet } from '../lib/measure-format';
import { KindSwatch } from './kind-swatch';

function featureMeasure(f: ImportPreviewDto['features'][number]): string {
  // Measured by the server on the full geometry (the preview draws a simplified outline).
  if (f.acres !== undefined) return formatAcresShort(f.acres);
  if (f.lengthFt !== undefined) return formatFeet(f.lengthFt);
  try {
    if (f.geometry.type === 'Polygon' || f.geometry.type === 'MultiPolygon') return formatAcresShort(measureArea(f.geometry).acres);
    if (f.geometry.type === 'LineString' || f.geometry.type === 'MultiLineString') return formatFeet(measureLine(f.geometry).lengthFt);
  } catch {
    /* shown without a measure */
  }
  return 'point';
}

/**
 * The import preview in the ledger: each feature found with what it becomes (boundary, a kind of
 * unit, or skipped), the features the file could not give and why, and one button to save.
 */
export function ImportPanel({
  fileName,
  preview,
  choices,
  problems,
  saving,
  onChoose,
  onHover,
  onSave,
  onCancel,
}: {
  fileName: string;
  preview: ImportPreviewDto;
  choices: ImportChoice[];
  problems: string[];
  saving: boolean;
  onChoose: (index: number, choice: ImportChoice) => void;
  onHover: (index: number | null) => void;
  onSave: () => void;
  onCancel: () => void;
}) {
  const baseId = useId();
  const count = choices.filter((c) => c !== 'skip').length;
  return (
    <section aria-label="Import preview" className="flex flex-col gap-4">
      <header>
        <h2 className="text-base font-bold">Import {fileName}</h2>
        <p className="text-sm text-slate">
          {preview.features.length} feature{preview.features.length === 1 ? '' : 's'} found ({preview.format.toUpperCase()}). Choose what each becomes; nothing is saved until you press Save.
        </p>
      </header>
      {preview.warnings.length > 0 ? (
        <ul className="rounded border-l-4 border-ochre bg-ochre/10 px-3 py-2 text-sm">
          {preview.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
      {preview.features.length === 0 ? (
        <EmptyState title="No features to import">The file holds no shapes we can use. Check the skipped list below, or export the file again with its layers visible.</EmptyState>
      ) : (
        <ol className="flex flex-col gap-2" aria-label="Features found">
          {preview.features.map((f, i) => {
            const selectId = `${baseId}-${i}`;
            const choice = choices[i];
            return (
              <li
                key={`${f.index}-${f.part ?? 0}`}
                onMouseEnter={() => onHover(i)}
                onMouseLeave={() => onHover(null)}
                className="rounded border border-rule bg-card px-3 py-2"
              >
                <div className="flex items-baseline justify-between gap-2">
                  <label htmlFor={selectId} className="truncate text-sm font-semibold">
                    {f.name || `Feature ${i + 1}`}
                  </label>
                  <span className="shrink-0 text-xs tabular-nums text-slate">{featureMeasure(f)}</span>
                </div>
                <div className="mt-1 flex items-center gap-2">
                  {choice !== 'skip' ? <KindSwatch kind={choice === 'boundary' ? 'boundary' : choice} size={14} /> : <span className="inline-block w-3.5" />}
                  <select
                    id={selectId}
                    value={choice}
                    onChange={(e) => onChoose(i, e.target.value as ImportChoice)}
                    className="flex-1 rounded border border-rule bg-white px-2 py-1 text-sm focus:border-moss focus:outline-none"
                  >
                    {choicesFor(f.family, f.closableGapM !== undefined).map((c) => (
                      <option key={c} value={c}>
                        {choiceLabel(c)}
                        {f.kind && c === f.kind ? ' (from the file)' : ''}
                      </option>
                    ))}
                  </select>
                </div>
                {f.notes.length > 0 ? <p className="mt-1 text-xs text-slate">{f.notes.join(' ')}</p> : null}
              </li>
            );
          })}
        </ol>
      )}
      {preview.skipped.length > 0 ? (
        <section aria-label="Skipped features" className="rounded-md border-l-4 border-clay bg-clay/5 px-3 py-2">
          <h3 className="font-sans text-sm font-bold text-clay">Skipped ({preview.skipped.length})</h3>
          <ul className="mt-1 flex flex-col gap-1 text-sm">
            {preview.skipped.map((s) => (
              <li key={`${s.index}-${s.part ?? 0}`}>
                <span className="font-semibold">{s.name ?? `Feature ${s.index + 1}`}</span>: {s.reason}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {problems.length > 0 ? (
        <ul role="alert" className="rounded-md border border-clay/40 bg-clay/5 px-3 py-2 text-sm text-ink">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
      <div className="sticky bottom-0 flex gap-2 border-t border-rule bg-card py-3">
        <Button onClick={onSave} busy={saving} disabled={count === 0 || problems.length > 0}>
          Save {count} feature{count === 1 ? '' : 's'}
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={saving}>
          Cancel
        </Button>
      </div>
    </section>
  );
}
