/** The second opinion on geometry: PostGIS ST_IsValid / ST_IsValidReason, worded for a person. */
import type { Geometry } from 'geojson';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { formatLatLon } from '../../shared/domain/geometry';
import { unprocessable } from '../errors';

/** Throws 422 naming what is wrong and where when PostGIS finds the geometry invalid. */
export async function assertValidInDatabase(geometry: Geometry, field: string, transaction?: Transaction): Promise<void> {
  const [row] = await sequelize.query<{ valid: boolean; reason: string }>(
    'SELECT ST_IsValid(g) AS valid, ST_IsValidReason(g) AS reason FROM (SELECT ST_GeomFromGeoJSON(:geojson) AS g) AS x',
    { replacements: { geojson: JSON.stringify(geometry) }, type: QueryTypes.SELECT, transaction },
  );
  if (row.valid) return;
  const at = /\[(-?[\d.]+)\s+(-?[\d.]+)\]/.exec(row.reason);
  const where = at ? ` near ${formatLatLon(Number(at[1]), Number(at[2]))}` : '';
  const what = row.reason.replace(/\[.*\]/, '').trim();
  const advice: Record<string, string> = {
    'Self-intersection': 'the outline crosses itself: move a corner so the edges do not cross',
    'Ring Self-intersection': 'a ring touches itself: move a corner apart',
    'Hole lies outside shell': 'a hole lies outside the outer edge: move it inside or delete it',
    'Interior is disconnected': 'a hole cuts the area in two: split it into two shapes',
    'Nested shells': 'one part lies inside another: merge them or draw a hole instead',
    'Too few points in geometry component': 'a part has too few corners: add corners or delete it',
  };
  throw unprocessable(`${field}: ${advice[what] ?? `the shape is not valid (${what})`}${where}.`, [{ path: field, message: row.reason }]);
}
