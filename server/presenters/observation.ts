import { OBSERVATION_KINDS, OBSERVATION_KIND_STYLES, type ObservationKind } from '../../shared/domain/observations';
import { formatDate } from '../../shared/domain/clock';
import type { ObservationDto, ObservationSummaryDto } from '../../shared/schemas/observation';
import type { ObservationPhotoRow, ObservationRow } from '../queries/observations';

/** The address of an observation photo (and of its thumbnail). */
export const observationPhotoUrl = (id: number, thumbnail = false) => `/api/observation-photos/${id}${thumbnail ? '/thumbnail' : ''}`;

/** An observation as the API answers it. */
export function presentObservation(row: ObservationRow, photos: ObservationPhotoRow[]): ObservationDto {
  return {
    id: row.id,
    propertyId: row.property_id,
    kind: row.kind as ObservationKind,
    observedAt: new Date(row.observed_at).toISOString(),
    notes: row.notes,
    position: [Number(row.lon), Number(row.lat)],
    positionSource: row.position_source as ObservationDto['positionSource'],
    unitId: row.unit_id,
    unitName: row.unit_name,
    insideBoundary: row.inside_boundary,
    photos: photos
      .filter((p) => p.observation_id === row.id)
      .map((p) => ({
        id: p.id,
        url: observationPhotoUrl(p.id),
        thumbnailUrl: p.thumbnail_key ? observationPhotoUrl(p.id, true) : null,
        contentType: p.content_type,
        takenAt: p.taken_at ? new Date(p.taken_at).toISOString() : null,
        exifProblems: p.exif_problems ?? [],
      })),
    loggedBy: row.logged_by,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

const monthLabel = (key: string) => formatDate(`${key}-01`).replace(/ 1,/, '');

/** Counts as rows of a table: one per unit (or month), each split by kind; units by count, months in order. */
export function presentObservationSummary(by: 'unit' | 'month', counts: { key: string; label: string | null; kind: string; count: number }[]): ObservationSummaryDto {
  const rows = new Map<string, { key: string; label: string; total: number; byKind: Record<string, number> }>();
  for (const c of counts) {
    const label = by === 'month' ? monthLabel(c.key) : c.key === 'none' ? 'Outside every unit' : (c.label ?? `Unit ${c.key}`);
    const row = rows.get(c.key) ?? { key: c.key, label, total: 0, byKind: Object.fromEntries(OBSERVATION_KINDS.map((k) => [k, 0])) };
    row.byKind[c.kind] = (row.byKind[c.kind] ?? 0) + c.count;
    row.total += c.count;
    rows.set(c.key, row);
  }
  const list = [...rows.values()];
  if (by === 'unit') list.sort((a, b) => b.total - a.total || a.label.localeCompare(b.label));
  else list.sort((a, b) => a.key.localeCompare(b.key));
  return { by, total: list.reduce((s, r) => s + r.total, 0), rows: list };
}

/** "Scrape" for "scrape". */
export const kindLabel = (kind: string) => OBSERVATION_KIND_STYLES[kind as ObservationKind]?.label ?? kind;
