/**
 * The link that opens a place in the phone's maps app: a geo URI (RFC 5870, section 3.3:
 * "geo:" latitude "," longitude, WGS 84), six decimals (about 0.1 m). Null without a position.
 */
export function geoUri(location: [number, number] | null, label?: string): string | null {
  if (!location) return null;
  const [lon, lat] = location;
  if (!Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180) return null;
  const fix = (n: number) => String(Math.round(n * 1e6) / 1e6);
  // Android's maps apps read a "q" query with the same point and a label; other apps ignore it.
  const query = label ? `?q=${fix(lat)},${fix(lon)}(${encodeURIComponent(label)})` : '';
  return `geo:${fix(lat)},${fix(lon)}${query}`;
}
