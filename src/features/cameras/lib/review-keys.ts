/** The review grid's keys: one letter per tag, arrows to move, digits to name a buck from the roster, S to show a photo to the landowner. */
import type { CameraTag } from '../../../../shared/domain/camera-events';

export const TAG_KEYS: Record<string, CameraTag> = { b: 'buck', d: 'doe', f: 'fawn', o: 'other-species', p: 'person', e: 'empty' };
export const TAG_LABELS: Record<CameraTag, string> = { buck: 'Buck', doe: 'Doe', fawn: 'Fawn', 'other-species': 'Other species', person: 'Person', empty: 'Empty' };

export type ReviewAction = { kind: 'tag'; tag: CameraTag } | { kind: 'buck'; index: number } | { kind: 'move'; by: number } | { kind: 'feature' } | null;

/** What a key press does in a grid `columns` wide. */
export function reviewAction(key: string, columns: number): ReviewAction {
  const k = key.length === 1 ? key.toLowerCase() : key;
  if (TAG_KEYS[k]) return { kind: 'tag', tag: TAG_KEYS[k] };
  if (/^[1-9]$/.test(k)) return { kind: 'buck', index: Number(k) - 1 };
  // S: show this photo to the landowner among the roster's best (or stop showing it).
  if (k === 's') return { kind: 'feature' };
  if (k === 'ArrowRight') return { kind: 'move', by: 1 };
  if (k === 'ArrowLeft') return { kind: 'move', by: -1 };
  if (k === 'ArrowDown') return { kind: 'move', by: columns };
  if (k === 'ArrowUp') return { kind: 'move', by: -columns };
  return null;
}
