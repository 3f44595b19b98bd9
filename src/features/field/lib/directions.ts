/**
 * "Open in maps" that works on every phone. An iPhone ignores `geo:` links (RFC 5870), so it gets
 * an Apple Maps link with the destination (Apple's "Map Links": `daddr` = destination, `dirflg=d`
 * = driving); Android and other systems get the geo URI their maps apps register for, and every
 * device can copy the coordinates.
 */
import { geoUri } from './geo-uri';

export type Platform = 'ios' | 'android' | 'other';

/** The phone's system, from its user agent (an iPad that reports a Mac is told apart by touch). */
export function platformOf(userAgent: string, maxTouchPoints = 0): Platform {
  if (/iPhone|iPad|iPod/i.test(userAgent)) return 'ios';
  if (/Macintosh/i.test(userAgent) && maxTouchPoints > 1) return 'ios';
  if (/Android/i.test(userAgent)) return 'android';
  return 'other';
}

const fix = (n: number) => String(Math.round(n * 1e6) / 1e6);

/** Whether a [lon, lat] position is a place on Earth. */
const valid = (location: [number, number] | null): location is [number, number] =>
  Boolean(location) && Number.isFinite(location![0]) && Number.isFinite(location![1]) && Math.abs(location![1]) <= 90 && Math.abs(location![0]) <= 180;

/** The link that starts navigation to a [lon, lat] position on this platform; null without a position. */
export function directionsLink(location: [number, number] | null, label: string | undefined, platform: Platform): string | null {
  if (!valid(location)) return null;
  const [lon, lat] = location;
  if (platform === 'ios') {
    const name = label ? `&q=${encodeURIComponent(label)}` : '';
    return `https://maps.apple.com/?daddr=${fix(lat)},${fix(lon)}&dirflg=d${name}`;
  }
  return geoUri(location, label);
}

/** The coordinates as people copy them into any maps app: "latitude, longitude", five decimals (about 1 m). */
export function coordinatesText(location: [number, number] | null): string | null {
  if (!valid(location)) return null;
  return `${location[1].toFixed(5)}, ${location[0].toFixed(5)}`;
}
