/** Reads of field observations: placement measures in PostGIS, the filtered list, and the counts by unit or month. */
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { OBSERVATION_KIND_STYLES, type ObservationKind, type PlacementMeasures } from '../../shared/domain/observations';
import type { ObservationListQuery } from '../../shared/schemas/observation';

/**
 * What PostGIS measures for a position on a property: the smallest area unit that covers it, the
 * nearest unit of any kind with its distance on the ellipsoid (geography), and the distance to the
 * boundary (0 inside or on it).
 */
export async function placementMeasures(propertyId: number, lon: number, lat: number, transaction?: Transaction): Promise<PlacementMeasures> {
  const [row] = await sequelize.query<{ containing: number | null; nearest: number | null; nearest_m: number | null; has_boundary: boolean; boundary_m: number | null }>(
    `WITH p AS (SELECT ST_SetSRID(ST_MakePoint($2, $3), 4326) AS g)
     SELECT
       (SELECT u.id FROM units u, p WHERE u.property_id = $1 AND GeometryType(u.geometry) IN ('POLYGON', 'MULTIPOLYGON') AND ST_Covers(u.geometry, p.g)
          ORDER BY ST_Area(u.geometry::geography), u.id LIMIT 1) AS containing,
       n.id AS nearest, n.d AS nearest_m,
       (pr.boundary IS NOT NULL) AS has_boundary,
       CASE WHEN pr.boundary IS NULL THEN NULL WHEN ST_Covers(pr.boundary, p.g) THEN 0 ELSE ST_Distance(pr.boundary::geography, p.g::geography) END AS boundary_m
     FROM properties pr CROSS JOIN p
     LEFT JOIN LATERAL (SELECT u.id, ST_Distance(u.geometry::geography, p.g::geography) AS d FROM units u WHERE u.property_id = $1 ORDER BY d, u.id LIMIT 1) n ON true
     WHERE pr.id = $1`,
    { bind: [propertyId, lon, lat], type: QueryTypes.SELECT, transaction },
  );
  return {
    containingUnitId: row?.containing ?? null,
    nearestUnitId: row?.nearest ?? null,
    nearestUnitM: row?.nearest_m === null || row?.nearest_m === undefined ? null : Number(row.nearest_m),
    hasBoundary: row?.has_boundary ?? false,
    boundaryDistanceM: row?.boundary_m === null || row?.boundary_m === undefined ? null : Number(row.boundary_m),
  };
}

/** One observation as the list reads it (photos separately). */
export interface ObservationRow {
  id: number;
  property_id: number;
  unit_id: number | null;
  unit_name: string | null;
  kind: string;
  observed_at: Date;
  notes: string | null;
  lon: number;
  lat: number;
  position_source: string;
  inside_boundary: boolean;
  logged_by: string | null;
  created_at: Date;
}

/** A photo row of an observation. */
export interface ObservationPhotoRow {
  id: number;
  observation_id: number;
  thumbnail_key: string | null;
  content_type: string;
  taken_at: Date | null;
  exif_problems: string[];
}

function filters(query: Partial<ObservationListQuery>, zone: string, bind: unknown[]): string {
  const parts: string[] = [];
  if (query.kind && query.kind.length) {
    bind.push(query.kind);
    parts.push(`o.kind = ANY($${bind.length})`);
  }
  if (query.from || query.to) bind.push(zone);
  const zoneAt = bind.length;
  if (query.from) {
    bind.push(query.from);
    parts.push(`(o.observed_at AT TIME ZONE $${zoneAt})::date >= $${bind.length}::date`);
  }
  if (query.to) {
    bind.push(query.to);
    parts.push(`(o.observed_at AT TIME ZONE $${zoneAt})::date <= $${bind.length}::date`);
  }
  return parts.length ? ` AND ${parts.join(' AND ')}` : '';
}

/** The observations of a property (oldest first), filtered by kind and by calendar dates in the firm's zone, with their photos. */
export async function listObservations(propertyId: number, query: Partial<ObservationListQuery>, zone: string, ids?: number[]): Promise<{ rows: ObservationRow[]; photos: ObservationPhotoRow[] }> {
  const bind: unknown[] = [propertyId];
  let where = filters(query, zone, bind);
  if (ids) {
    bind.push(ids);
    where += ` AND o.id = ANY($${bind.length})`;
  }
  const rows = await sequelize.query<ObservationRow>(
    `SELECT o.id, o.property_id, o.unit_id, u.name AS unit_name, o.kind, o.observed_at, o.notes, ST_X(o.position) AS lon, ST_Y(o.position) AS lat,
            o.position_source, o.inside_boundary, us.name AS logged_by, o.created_at
       FROM observations o
       LEFT JOIN units u ON u.id = o.unit_id
       LEFT JOIN users us ON us.id = o.created_by_id
      WHERE o.property_id = $1${where}
      ORDER BY o.observed_at, o.id`,
    { bind, type: QueryTypes.SELECT },
  );
  if (rows.length === 0) return { rows, photos: [] };
  const photos = await sequelize.query<ObservationPhotoRow>(
    'SELECT id, observation_id, thumbnail_key, content_type, taken_at, exif_problems FROM observation_photos WHERE observation_id = ANY($1) ORDER BY id',
    { bind: [rows.map((r) => r.id)], type: QueryTypes.SELECT },
  );
  return { rows, photos };
}

/** Counts by unit (with the unit's name) or by month in the firm's zone, split by kind. */
export async function countObservations(propertyId: number, by: 'unit' | 'month', query: Partial<ObservationListQuery>, zone: string): Promise<{ key: string; label: string | null; kind: string; count: number }[]> {
  const bind: unknown[] = [propertyId, zone];
  const where = filters(query, zone, bind);
  const keySql = by === 'unit' ? `COALESCE(o.unit_id::text, 'none')` : `to_char(o.observed_at AT TIME ZONE $2, 'YYYY-MM')`;
  const labelSql = by === 'unit' ? 'MIN(u.name)' : 'NULL';
  const rows = await sequelize.query<{ key: string; label: string | null; kind: string; count: string }>(
    `SELECT ${keySql} AS key, ${labelSql} AS label, o.kind, COUNT(*) AS count
       FROM observations o LEFT JOIN units u ON u.id = o.unit_id
      WHERE o.property_id = $1 AND $2::text IS NOT NULL${where}
      GROUP BY 1, o.kind ORDER BY 1, o.kind`,
    { bind, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ ...r, count: Number(r.count) }));
}

/** A property's observations as the exports write them (oldest first). */
export async function observationsForExport(propertyId: number): Promise<{ id: number; kind: string; label: string; observedAt: string; position: [number, number]; unitName: string | null; notes: string | null }[]> {
  const { rows } = await listObservations(propertyId, {}, 'UTC');
  return rows.map((r) => ({ id: r.id, kind: r.kind, label: OBSERVATION_KIND_STYLES[r.kind as ObservationKind]?.label ?? r.kind, observedAt: new Date(r.observed_at).toISOString(), position: [Number(r.lon), Number(r.lat)], unitName: r.unit_name, notes: r.notes }));
}
