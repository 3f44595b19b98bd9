import { useEffect, useRef, useState } from 'react';
import type { BuckDto, CameraPhotoDto } from '../../../../shared/schemas/cameras';
import { formatTime } from '../../../lib/firm-clock';
import { useDeploymentPhotos, useTagPhoto } from '../api/cameras';
import { reviewAction, TAG_KEYS, TAG_LABELS } from '../lib/review-keys';
import { useToast } from '../../../components/ui/toast';

const COLUMNS = 4;

/**
 * The review grid: arrows move, B D F O P E tag (buck, doe, fawn, other species, person, empty) and
 * move on, 1–9 name the selected buck photo's buck from the roster.
 */
export function ReviewGrid({ deploymentId, bucks }: { deploymentId: number; bucks: BuckDto[] }) {
  const photos = useDeploymentPhotos(deploymentId);
  const tag = useTagPhoto(deploymentId);
  const toast = useToast();
  const [at, setAtState] = useState(0);
  // The selection is also kept in a ref so quick key presses (before React renders) each act on the next photo.
  const atRef = useRef(0);
  const setAt = (next: number | ((i: number) => number)) => {
    atRef.current = typeof next === 'function' ? next(atRef.current) : next;
    setAtState(atRef.current);
  };
  const grid = useRef<HTMLDivElement>(null);
  const list: CameraPhotoDto[] = photos.data ?? [];

  useEffect(() => {
    grid.current?.querySelector<HTMLElement>(`[data-index="${at}"]`)?.scrollIntoView({ block: 'nearest' });
  }, [at]);

  function onKey(e: React.KeyboardEvent) {
    const action = reviewAction(e.key, COLUMNS);
    if (!action || list.length === 0) return;
    e.preventDefault();
    const photo = list[atRef.current];
    if (action.kind === 'move') setAt((i) => Math.max(0, Math.min(list.length - 1, i + action.by)));
    else if (action.kind === 'tag') {
      tag.mutate({ id: photo.id, input: { tag: action.tag } }, { onError: (err) => toast('error', err.message) });
      setAt((i) => Math.min(list.length - 1, i + 1));
    } else if (action.kind === 'feature') {
      if (!photo.tag || photo.tag === 'person') return toast('error', 'Tag the photo first; a photo of a person is never shown to the landowner.');
      tag.mutate({ id: photo.id, input: { tag: photo.tag, buckId: photo.buckId, featured: !photo.featured } }, { onError: (err) => toast('error', err.message) });
    } else if (action.kind === 'buck') {
      const buck = bucks[action.index];
      if (!buck) return;
      tag.mutate({ id: photo.id, input: { tag: 'buck', buckId: buck.id } }, { onError: (err) => toast('error', err.message) });
      setAt((i) => Math.min(list.length - 1, i + 1));
    }
  }

  if (photos.isPending) return <p className="text-sm text-slate">Loading photos…</p>;
  if (list.length === 0) return <p className="text-sm text-slate">No photos yet: bring the card in above.</p>;
  const tagged = list.filter((p) => p.tag).length;
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-slate" id={`keys-${deploymentId}`}>
        Click the grid, then: {Object.entries(TAG_KEYS).map(([k, t]) => `${k.toUpperCase()} ${TAG_LABELS[t].toLowerCase()}`).join(' · ')} · 1–{Math.max(1, Math.min(9, bucks.length))} a buck from the roster · S show it to the landowner ·
        arrows to move. {tagged} of {list.length} tagged.
      </p>
      <div
        ref={grid}
        role="grid"
        tabIndex={0}
        aria-label="Card photos to review"
        aria-describedby={`keys-${deploymentId}`}
        aria-activedescendant={`photo-${list[at]?.id}`}
        onKeyDown={onKey}
        className="grid max-h-[32rem] grid-cols-4 gap-2 overflow-y-auto rounded border border-rule p-2 focus:outline-none focus:ring-2 focus:ring-moss"
      >
        {list.map((p, i) => {
          const buck = p.buckId ? bucks.find((b) => b.id === p.buckId) : null;
          return (
            <div
              key={p.id}
              id={`photo-${p.id}`}
              role="gridcell"
              aria-selected={i === at}
              data-index={i}
              data-tag={p.tag ?? ''}
              onClick={() => setAt(i)}
              className={`flex flex-col gap-1 rounded border p-1 text-xs ${i === at ? 'border-moss ring-2 ring-moss' : 'border-rule'}`}
            >
              <img src={p.thumbnailUrl ?? p.url} alt={p.originalName ?? `Photo ${p.id}`} loading="lazy" className="aspect-[4/3] w-full rounded bg-rule object-cover" />
              <span className="text-slate">{p.takenAt ? formatTime(p.takenAt) : 'no time'}</span>
              <span className={p.tag ? 'font-semibold text-ink' : 'text-slate'}>
                {p.tag ? TAG_LABELS[p.tag] : 'Untagged'}
                {buck ? ` · ${buck.name}` : ''}
                {p.featured ? ' · shown to the landowner' : ''}
              </span>
            </div>
          );
        })}
      </div>
    </div>
  );
}
