import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { Button } from '../../../components/ui/button';
import type { DrawTarget, MeasureReading } from '../lib/plan-map-controller';
import { formatAcresShort, formatFeet, formatHectares, formatMiles, showsImperial } from '../lib/measure-format';

/** The measure of the shape being drawn or measured, in words and figures. */
export function MeasureReadout({ reading, onClear }: { reading: MeasureReading; onClear: () => void }) {
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
          {formatFeet(reading.lengthFt)}{showsImperial() ? ` · ${formatMiles(reading.lengthMi)}` : ''}
        </span>
      ) : (
        <span className="figure font-bold text-ink">
          {formatAcresShort(reading.acres)}{showsImperial() ? ` · ${formatHectares(reading.hectares)}` : ''} · perimeter {formatFeet(reading.perimeterFt)}
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
export function DrawControls({ points, area, onFinish, onUndo, onCancel }: { points: number; area: boolean; onFinish: () => void; onUndo: () => void; onCancel: () => void }) {
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

/** What to do next with the tool in hand, named first (it may sit in the toolbar's "More" menu, out of sight). */
export function DrawHint({ target }: { target: DrawTarget }) {
  const point = target.type === 'unit' && KIND_STYLES[target.kind].family === 'point';
  const tool = target.type === 'unit' ? KIND_STYLES[target.kind].label : target.type === 'boundary' ? 'Boundary' : target.shape === 'line' ? 'Measure distance' : 'Measure area';
  return (
    <p role="status" className="pointer-events-auto rounded bg-ink/85 px-3 py-1 text-xs text-white">
      <strong className="font-semibold">{tool}:</strong>{' '}
      {point
        ? 'Click the map to place it. Esc to stop.'
        : target.type === 'unit' && KIND_STYLES[target.kind].family === 'line'
          ? 'Click to add points; click the last point again (or press Enter) to finish. Esc to stop.'
          : target.type === 'measure' && target.shape === 'line'
            ? 'Click to add points; click the last point again to finish. Nothing is saved.'
            : 'Click to add corners; click the first corner to close the shape. Esc to stop.'}{' '}
      {point ? '' : 'Corners snap to the boundary’s and other units’ corners.'}
    </p>
  );
}

/** Whether the tool draws an area (needs three points to finish) rather than a line. */
export function drawsArea(target: DrawTarget): boolean {
  return target.type === 'boundary' || (target.type === 'measure' ? target.shape === 'area' : KIND_STYLES[target.kind].family === 'area');
}

/** Whether the tool places a single point (no Finish/Undo point). */
export function drawsPoint(target: DrawTarget): boolean {
  return target.type === 'unit' && KIND_STYLES[target.kind].family === 'point';
}
