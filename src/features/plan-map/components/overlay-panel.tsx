import { useId } from 'react';
import type { OverlayDto } from '../api/get-overlays';

/** One opacity slider per image overlay; the map follows the slider, the value is saved on release. */
export function OverlayPanel({
  overlays,
  onPreview,
  onCommit,
}: {
  overlays: OverlayDto[];
  onPreview: (overlayId: number, opacity: number) => void;
  onCommit: (overlayId: number, opacity: number) => void;
}) {
  const baseId = useId();
  if (overlays.length === 0) return null;
  return (
    <div role="group" aria-label="Image overlays" className="w-56 rounded border border-rule bg-card/95 px-3 py-2 text-xs shadow-sm">
      <p className="mb-1 font-semibold uppercase tracking-wide text-slate">Overlays</p>
      {overlays.map((o) => (
        <div key={o.id} className="flex flex-col gap-0.5 py-1">
          <label htmlFor={`${baseId}-${o.id}`} className="truncate font-semibold text-ink">
            {o.name}
          </label>
          <input
            id={`${baseId}-${o.id}`}
            type="range"
            min={0}
            max={1}
            step={0.05}
            defaultValue={o.opacity}
            aria-valuetext={`${Math.round(o.opacity * 100)} % opaque`}
            onInput={(e) => onPreview(o.id, Number((e.target as HTMLInputElement).value))}
            onPointerUp={(e) => onCommit(o.id, Number((e.target as HTMLInputElement).value))}
            onKeyUp={(e) => onCommit(o.id, Number((e.target as HTMLInputElement).value))}
            className="accent-moss"
          />
        </div>
      ))}
    </div>
  );
}
