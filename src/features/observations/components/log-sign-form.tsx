/**
 * "Log sign": kind buttons with our symbols, camera/photo input, a note, when, and where — the
 * phone's position, a tap on the map (when the page has one), or the photo's own GPS. Saved on the
 * phone first with a new idempotency key, then sent; with no signal it waits and goes later.
 * Loaded lazily (the field sheet's first load stays within its budget).
 */
import { useEffect, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { OBSERVATION_KINDS, OBSERVATION_KIND_STYLES, type ObservationKind } from '../../../../shared/domain/observations';
import { KindSymbol } from './kind-symbol';
import { localInstant, newObservationKey } from '../lib/observation-queue';
import type { LogOutcome } from '../hooks/use-observation-queue';
import type { QueuedObservation } from '../lib/observation-queue';
import type { NewQueuedItem } from '../../../lib/offline-queue';

export interface LogSignFormProps {
  properties: { id: number; name: string }[];
  defaultPropertyId?: number;
  /** A position the person tapped on the page's map, if it has one. */
  mapPosition?: { lon: number; lat: number } | null;
  save: (input: Omit<NewQueuedItem<QueuedObservation>, 'userId'>) => Promise<LogOutcome>;
  onDone?: (outcome: LogOutcome) => void;
}

type Where = { lon: number; lat: number; source: 'device' | 'map'; accuracyM?: number } | null;

const toLocalInput = (d: Date) => localInstant(d).slice(0, 16);

/** The log form (default export for React.lazy). */
export default function LogSignForm({ properties, defaultPropertyId, mapPosition, save, onDone }: LogSignFormProps) {
  const [propertyId, setPropertyId] = useState<number>(defaultPropertyId ?? properties[0]?.id ?? 0);
  const [kind, setKind] = useState<ObservationKind | null>(null);
  const [files, setFiles] = useState<File[]>([]);
  const [notes, setNotes] = useState('');
  const [when, setWhen] = useState(() => toLocalInput(new Date()));
  const [where, setWhere] = useState<Where>(null);
  const [locating, setLocating] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    if (mapPosition) setWhere({ ...mapPosition, source: 'map' });
  }, [mapPosition]);

  const locate = () => {
    if (!('geolocation' in navigator)) return setProblem('This phone gives no position to the browser. Tap the map, or attach a photo that carries its GPS position.');
    setLocating(true);
    navigator.geolocation.getCurrentPosition(
      (p) => {
        setLocating(false);
        setWhere({ lon: p.coords.longitude, lat: p.coords.latitude, source: 'device', accuracyM: p.coords.accuracy });
        setProblem(null);
      },
      (e) => {
        setLocating(false);
        setProblem(e.code === e.PERMISSION_DENIED ? 'Location is turned off for this site. Allow it in the browser, tap the map, or attach a photo with its GPS position.' : 'The phone could not find its position. Try again in the open, tap the map, or attach a photo with its GPS position.');
      },
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  };

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    if (!kind) return setProblem('Choose what you saw: tap one of the kinds above.');
    if (!propertyId) return setProblem('Choose the property.');
    if (!where && files.length === 0) return setProblem('Say where: use the phone’s position, tap the map, or attach a photo that carries its GPS position.');
    const at = new Date(when);
    if (Number.isNaN(at.getTime())) return setProblem('Give the date and time you saw it.');
    setBusy(true);
    setProblem(null);
    const outcome = await save({
      key: newObservationKey(),
      propertyId,
      propertyName: properties.find((p) => p.id === propertyId)?.name ?? '',
      fields: { kind, observedAt: localInstant(at), notes, position: where ? { lon: where.lon, lat: where.lat, source: where.source } : null },
      photos: files.map((f) => ({ name: f.name, type: f.type, blob: f })),
    });
    setBusy(false);
    if (outcome.kind === 'rejected') return setProblem(outcome.message);
    setKind(null);
    setFiles([]);
    setNotes('');
    setWhere(null);
    onDone?.(outcome);
  };

  return (
    <form onSubmit={submit} aria-label="Log sign" className="flex flex-col gap-3">
      {properties.length > 1 ? (
        <label className="flex flex-col gap-1 text-sm font-semibold">
          Property
          <select className="rounded border border-rule bg-card px-2 py-2 font-normal" value={propertyId} onChange={(e) => setPropertyId(Number(e.target.value))}>
            {properties.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </select>
        </label>
      ) : null}
      <fieldset>
        <legend className="mb-1 text-sm font-semibold">What did you see?</legend>
        <div className="grid grid-cols-3 gap-2 sm:grid-cols-4">
          {OBSERVATION_KINDS.map((k) => (
            <button
              key={k}
              type="button"
              aria-pressed={kind === k}
              onClick={() => setKind(k)}
              className={`flex flex-col items-center gap-1 rounded border px-1 py-2 text-xs font-semibold ${kind === k ? 'border-moss bg-moss/10 text-moss-deep' : 'border-rule bg-card text-ink'}`}
            >
              <span style={{ color: OBSERVATION_KIND_STYLES[k].colour }}>
                <KindSymbol kind={k} className="h-7 w-7" />
              </span>
              {OBSERVATION_KIND_STYLES[k].label}
            </button>
          ))}
        </div>
      </fieldset>
      <label className="flex flex-col gap-1 text-sm font-semibold">
        Photos
        <input type="file" accept="image/jpeg,image/png,image/heic,image/heif" capture="environment" multiple onChange={(e) => setFiles(Array.from(e.target.files ?? []))} className="text-sm font-normal" />
        {files.length ? <span className="text-xs font-normal text-slate">{files.length === 1 ? '1 photo' : `${files.length} photos`} attached</span> : null}
      </label>
      <label className="flex flex-col gap-1 text-sm font-semibold">
        Note
        <textarea value={notes} onChange={(e) => setNotes(e.target.value)} rows={2} maxLength={4000} className="rounded border border-rule bg-card px-2 py-1 font-normal" />
      </label>
      <label className="flex flex-col gap-1 text-sm font-semibold">
        When
        <input type="datetime-local" value={when} onChange={(e) => setWhen(e.target.value)} className="rounded border border-rule bg-card px-2 py-2 font-normal" />
      </label>
      <div className="flex flex-col gap-1 text-sm">
        <span className="font-semibold">Where</span>
        <div className="flex flex-wrap items-center gap-2">
          <Button type="button" variant="secondary" onClick={locate} busy={locating}>
            Use this phone’s position
          </Button>
          {where ? (
            <span data-testid="log-sign-position" className="figure text-slate">
              {where.lat.toFixed(5)}, {where.lon.toFixed(5)} · {where.source === 'map' ? 'tapped on the map' : `phone${where.accuracyM ? ` ±${Math.round(where.accuracyM * 3.28084)} ft` : ''}`}
            </span>
          ) : (
            <span className="text-slate">{mapPosition === undefined ? 'or leave it to the photo’s GPS' : 'or tap the map, or leave it to the photo’s GPS'}</span>
          )}
        </div>
      </div>
      {problem ? (
        <p role="alert" className="rounded border border-[#8E3F2A]/40 bg-[#8E3F2A]/5 px-3 py-2 text-sm text-[#8E3F2A]">
          {problem}
        </p>
      ) : null}
      <Button type="submit" busy={busy}>
        Save sign
      </Button>
    </form>
  );
}
