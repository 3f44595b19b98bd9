/** GeoJSON read back from PostGIS carries a `crs` member; RFC 7946 has none. */
export function stripCrs<T extends object>(geometry: T): T {
  if (geometry && 'crs' in geometry) {
    const { crs: _crs, ...rest } = geometry as T & { crs: unknown };
    return rest as T;
  }
  return geometry;
}
