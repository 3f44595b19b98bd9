/**
 * Stored imports (table geo_imports): the full geometries behind a preview, written once when the
 * file is read and fetched for the features the consultant saves. Rows older than a day are
 * removed whenever a new import is stored.
 */
import { QueryTypes } from 'sequelize';
import type { Geometry } from 'geojson';
import { sequelize } from '../../db/sequelize';
import type { ImportFullFeatureDto } from '../../../shared/schemas/geo-import';

export interface StoredImport {
  id: string;
  firmId: number;
  propertyId: number;
  userId: number | null;
  format: string;
  featureCount: number;
  /** JSON text of the geometries, in the preview's order (made in the worker thread). */
  geometriesJson: string;
}

/** Store an import's geometries (and forget imports older than a day). */
export async function storeImport(row: StoredImport): Promise<void> {
  await sequelize.query(
    `WITH gone AS (DELETE FROM geo_imports WHERE created_at < now() - interval '1 day')
     INSERT INTO geo_imports (id, firm_id, property_id, created_by_id, format, feature_count, geometries)
     VALUES (:id, :firmId, :propertyId, :userId, :format, :featureCount, CAST(:geometries AS json))`,
    {
      replacements: { id: row.id, firmId: row.firmId, propertyId: row.propertyId, userId: row.userId, format: row.format, featureCount: row.featureCount, geometries: row.geometriesJson },
      type: QueryTypes.INSERT,
    },
  );
}

/**
 * The full geometries of the chosen items of a stored import of this firm's property, or null when
 * there is no such import (never stored, another firm's, or older than a day).
 */
export async function loadImportGeometries(firmId: number, propertyId: number, importId: string, items: number[]): Promise<ImportFullFeatureDto[] | null> {
  const found = await sequelize.query<{ feature_count: number }>(
    `SELECT feature_count FROM geo_imports WHERE id = :importId AND firm_id = :firmId AND property_id = :propertyId AND created_at >= now() - interval '1 day'`,
    { replacements: { importId, firmId, propertyId }, type: QueryTypes.SELECT },
  );
  if (found.length === 0) return null;
  const wanted = items.filter((i) => i < found[0].feature_count);
  if (wanted.length === 0) return [];
  const rows = await sequelize.query<{ item: number; geometry: Geometry }>(
    `SELECT (e.ordinality - 1)::int AS item, e.value AS geometry
       FROM geo_imports g, json_array_elements(g.geometries) WITH ORDINALITY AS e
      WHERE g.id = :importId AND g.firm_id = :firmId AND (e.ordinality - 1) = ANY(ARRAY[:items]::int[])
      ORDER BY e.ordinality`,
    { replacements: { importId, firmId, items: wanted }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ item: r.item, geometry: r.geometry }));
}
