import { useEffect, useId, useRef, useState } from 'react';
import type { OverlayDto } from '../api/get-overlays';
import type { OverlayUpdateInput } from '../api/update-overlay';
import type { OverlayUploadInput } from '../api/overlay-writes';
import { GEOMETRY_LIMITS } from '../../../../shared/limits';

const MAX_MB = Math.round(GEOMETRY_LIMITS.overlayMaxBytes / 1024 / 1024);
const MAX_MP = Math.round(GEOMETRY_LIMITS.overlayMaxPixels / 1e6);
/** What the panel says before any upload: the file kinds and both limits. */
export const OVERLAY_LIMIT_TEXT = `GeoTIFF, or JPEG/PNG with its world file (.jgw, .pgw). At most ${MAX_MB} MB and ${MAX_MP} megapixels.`;

function OverlaySlider({ overlay, onPreview, onCommit }: { overlay: OverlayDto; onPreview: (opacity: number) => void; onCommit: (opacity: number) => void }) {
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
    <input
      ref={ref}
      type="range"
      aria-label={`Opacity of ${overlay.name}`}
      min={0}
      max={1}
      step={0.05}
      defaultValue={overlay.opacity}
      disabled={!overlay.visible}
      onInput={(e) => onPreview(Number((e.target as HTMLInputElement).value))}
      className="w-full accent-moss"
    />
  );
}

/** A JPEG or PNG waiting for its world file and coordinate system before it is sent. */
interface PendingImage {
  image: File;
  worldFile: File | null;
  epsg: string;
}

const isWorldFile = (f: File) => /\.(jgw|jpgw|pgw|pngw|tfw|wld)$/i.test(f.name);
const isGeoTiff = (f: File) => /\.(tif|tiff)$/i.test(f.name);

/**
 * The property's aerial photos: add one (GeoTIFF, or JPEG/PNG with world file and EPSG code) with
 * an upload progress bar and the limits stated first; per photo show/hide, opacity (saved on
 * release) and delete.
 */
export function OverlayPanel({
  overlays,
  uploading,
  onUpload,
  onPreview,
  onChange,
  onDelete,
}: {
  overlays: OverlayDto[];
  /** Upload progress 0–1, null while the server reads it, undefined when idle. */
  uploading: number | null | undefined;
  onUpload: (input: Omit<OverlayUploadInput, 'onProgress'>) => void;
  onPreview: (overlayId: number, opacity: number) => void;
  onChange: (overlayId: number, input: OverlayUpdateInput) => void;
  onDelete: (overlay: OverlayDto) => void;
}) {
  const fileId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [pending, setPending] = useState<PendingImage | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const choose = (files: File[]) => {
    setProblem(null);
    const image = files.find((f) => !isWorldFile(f));
    const world = files.find(isWorldFile) ?? null;
    if (!image) {
      if (pending && world) setPending({ ...pending, worldFile: world });
      else setProblem('Choose the image too (a GeoTIFF, or the JPEG/PNG with its world file).');
      return;
    }
    if (image.size > GEOMETRY_LIMITS.overlayMaxBytes) {
      setProblem(`${image.name} is ${(image.size / 1024 / 1024).toFixed(0)} MB; an upload may be at most ${MAX_MB} MB. Export it at a coarser resolution or crop it to the property.`);
      return;
    }
    if (isGeoTiff(image) && !world) {
      setPending(null);
      onUpload({ file: image });
      return;
    }
    setPending({ image, worldFile: world, epsg: pending?.epsg ?? '' });
  };

  const sendPending = async () => {
    if (!pending?.worldFile) return setProblem('Add the world file (.jgw or .pgw) that came with the image.');
    if (!/^\d{4,6}$/.test(pending.epsg.trim())) return setProblem('Give the EPSG code of the world file’s coordinates, such as 26915 (NAD83 / UTM zone 15N).');
    onUpload({ file: pending.image, worldFile: { text: await pending.worldFile.text(), epsg: pending.epsg.trim() } });
    setPending(null);
  };

  return (
    <section aria-label="Aerial photos" className="w-64 rounded border border-rule bg-card/95 px-3 py-2 text-xs shadow-sm">
      <div className="flex items-center justify-between gap-2">
        <p className="font-semibold uppercase tracking-wide text-slate">Aerial photos</p>
        <button type="button" className="font-semibold text-moss-deep hover:underline disabled:opacity-50" disabled={uploading !== undefined} onClick={() => input.current?.click()}>
          Add photo…
        </button>
      </div>
      <input
        ref={input}
        id={fileId}
        type="file"
        hidden
        multiple
        accept=".tif,.tiff,.jpg,.jpeg,.png,.jgw,.jpgw,.pgw,.pngw,.tfw,.wld"
        data-testid="overlay-file"
        onChange={(e) => {
          choose(Array.from(e.target.files ?? []));
          e.target.value = '';
        }}
      />
      <p className="mt-0.5 text-[11px] text-slate">{OVERLAY_LIMIT_TEXT}</p>
      {uploading !== undefined ? (
        <div className="mt-1.5">
          <progress className="h-2 w-full accent-moss" max={1} value={uploading ?? undefined} aria-label="Upload progress" />
          <p role="status" className="text-[11px] text-slate">
            {uploading === null ? 'Placing the photo on the map…' : `Uploading ${Math.round(uploading * 100)} %`}
          </p>
        </div>
      ) : null}
      {pending ? (
        <div className="mt-1.5 flex flex-col gap-1 rounded border border-rule bg-paper px-2 py-1.5">
          <p className="truncate font-semibold text-ink">{pending.image.name}</p>
          <p className="text-slate">{pending.worldFile ? `World file: ${pending.worldFile.name}` : 'Add its world file (.jgw or .pgw) with “Add photo…”.'}</p>
          <label className="flex items-center gap-1">
            <span className="text-slate">EPSG code</span>
            <input
              className="w-20 rounded border border-rule bg-card px-1 py-0.5 text-ink"
              inputMode="numeric"
              placeholder="26915"
              value={pending.epsg}
              onChange={(e) => setPending({ ...pending, epsg: e.target.value })}
            />
          </label>
          <div className="flex gap-2">
            <button type="button" className="font-semibold text-moss-deep hover:underline" onClick={() => void sendPending()}>
              Upload
            </button>
            <button type="button" className="text-slate hover:underline" onClick={() => setPending(null)}>
              Cancel
            </button>
          </div>
        </div>
      ) : null}
      {problem ? (
        <p role="alert" className="mt-1 text-clay">
          {problem}
        </p>
      ) : null}
      {overlays.length > 0 ? (
        <ul className="mt-1.5 flex flex-col divide-y divide-rule">
          {overlays.map((o) => (
            <li key={o.id} className="flex flex-col gap-0.5 py-1.5" data-testid="overlay-item">
              <div className="flex items-center gap-1.5">
                <input type="checkbox" checked={o.visible} aria-label={`Show ${o.name}`} onChange={(e) => onChange(o.id, { visible: e.target.checked })} className="accent-moss" />
                <span className="min-w-0 flex-1 truncate font-semibold text-ink" title={o.name}>
                  {o.name}
                </span>
                <button type="button" className="text-clay hover:underline" onClick={() => onDelete(o)}>
                  Delete
                </button>
              </div>
              <OverlaySlider overlay={o} onPreview={(v) => onPreview(o.id, v)} onCommit={(v) => onChange(o.id, { opacity: v })} />
              <label className="flex items-center gap-1.5 text-slate">
                <input type="checkbox" checked={o.inDocuments} onChange={(e) => onChange(o.id, { inDocuments: e.target.checked })} className="accent-moss" />
                Print under the plan (plan PDF, proposal map)
              </label>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
