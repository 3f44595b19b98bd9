/**
 * Coordinates as people type them: decimal degrees ("43.2655, -90.9380", "43.2655 N 90.938 W") or
 * degrees-minutes-seconds ("43°15'55.8\"N 90°56'16.8\"W", "43 15 55.8 N, 90 56 16.8 W"). Latitude
 * first, as GPS units and most maps write it; a hemisphere letter may come before or after each part.
 */

export interface LonLat {
  lon: number;
  lat: number;
}

const PART = String.raw`([NSEW])?\s*(-?\d{1,3}(?:\.\d+)?)\s*(?:°|d|deg)?\s*(?:(\d{1,2}(?:\.\d+)?)\s*(?:'|′|m|min)?\s*(?:(\d{1,2}(?:\.\d+)?)\s*(?:"|″|''|s|sec)?)?)?\s*([NSEW])?`;
const PAIR = new RegExp(String.raw`^\s*${PART}\s*[,;/\s]\s*${PART}\s*$`, 'i');

function degrees(sign: string | undefined, deg: string, min: string | undefined, sec: string | undefined, after: string | undefined): { value: number; hemi: string | null } | null {
  const d = Number(deg);
  const m = min === undefined ? 0 : Number(min);
  const s = sec === undefined ? 0 : Number(sec);
  if (m >= 60 || s >= 60) return null;
  if ((min !== undefined || sec !== undefined) && !Number.isInteger(d)) return null;
  if (sign && after) return null; // one hemisphere letter per part
  const hemi = (sign ?? after ?? '').toUpperCase() || null;
  const magnitude = Math.abs(d) + m / 60 + s / 3600;
  const negative = d < 0 || Object.is(d, -0) || hemi === 'S' || hemi === 'W';
  if (d < 0 && (hemi === 'S' || hemi === 'W' || hemi === 'N' || hemi === 'E')) return null;
  return { value: negative ? -magnitude : magnitude, hemi };
}

/** The point a typed pair of coordinates names, or null when the text is not one (or is off the globe). */
export function parseCoordinates(text: string): LonLat | null {
  if (text.length > 100) return null;
  const m = PAIR.exec(text.replace(/[\u2018\u2019]/g, "'").replace(/[\u201c\u201d]/g, '"'));
  if (!m) return null;
  const first = degrees(m[1], m[2]!, m[3], m[4], m[5]);
  const second = degrees(m[6], m[7]!, m[8], m[9], m[10]);
  if (!first || !second) return null;
  // Hemisphere letters decide which is which; without them, latitude comes first.
  const firstIsLon = first.hemi === 'E' || first.hemi === 'W' || second.hemi === 'N' || second.hemi === 'S';
  const isLat = (h: string | null) => h === 'N' || h === 'S';
  const isLon = (h: string | null) => h === 'E' || h === 'W';
  if ((isLat(first.hemi) && isLat(second.hemi)) || (isLon(first.hemi) && isLon(second.hemi))) return null;
  const lat = firstIsLon ? second.value : first.value;
  const lon = firstIsLon ? first.value : second.value;
  if (Math.abs(lat) > 90 || Math.abs(lon) > 180) return null;
  return { lon: Math.round(lon * 1e7) / 1e7, lat: Math.round(lat * 1e7) / 1e7 };
}
