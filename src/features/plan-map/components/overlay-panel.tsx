import { useEffect, useId, useRef } from 'react';
import type { OverlayDto } from '../api/get-overlays';

function OverlaySlider({ overlay, onPreview, onCommit }: { overlay: OverlayDto; onPreview: (opacity: number) => void; onCommit: (opacity: number) => void }) {
  const id = useId();
  const ref = useRef<HTMLInputElement>(null);
  const commitRef = useRef(onCommit);
  commitRef.current = onCommit;
  // The native change event fires once, on release (mouse, touch or keys); React's onChange fires on every step.
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const onChange = () => commitRef.current(Number(el.value));
    el.addEventListener('change', onChange);
    return () => el.removeEventListener('change', onChange);
  }, []);
  return (
    <div className="flex flex-col gap-0.5 py-1">
      <label htmlFor={id} className="truncate font-semibold text-ink">
        {overlay.name}
      </label>
      <input
        ref={ref}
        id={id}
        type="range"
        min={0}
        max={1}
        step={0.05}
        defaultValue={overlay.opacity}
        onInput={(e) => onPreview(Number((e.target as HTMLInputElement).value))}
        className="accent-moss"
      />
    </div>
  );
}

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
  if (overlays.length === 0) return null;
  return (
    <div role="group" aria-label="Image overlays" className="w-56 rounded border border-rule bg-card/95 px-3 py-2 text-xs shadow-sm">
      <p className="mb-1 font-semibold uppercase tracking-wide text-slate">Overlays</p>
      {overlays.map((o) => (
        <OverlaySlider key={o.id} overlay={o} onPreview={(v) => onPreview(o.id, v)} onCommit={(v) => onCommit(o.id, v)} />
      ))}
    </div>
  );
}
