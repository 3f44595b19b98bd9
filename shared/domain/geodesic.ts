/**
 * Bearings and destination points on the WGS84 ellipsoid (Vincenty's inverse and direct solutions,
 * accurate to well under a millimetre for the short, non-antipodal lines a property has). The tests
 * hold them to GeographicLib's Inverse and Direct.
 */
import type { Position } from 'geojson';
import { WGS84_A, WGS84_F } from './ellipsoid';

const A = WGS84_A;
const F = WGS84_F;
const B = A * (1 - F);
const RAD = Math.PI / 180;

/** A geodesic between two points: its length and the forward azimuth at the start (degrees clockwise from north, 0–360). */
export interface GeodesicLine {
  distanceM: number;
  bearingDeg: number;
}

/** Normalises an angle in degrees to [0, 360). */
export function normalizeDeg(deg: number): number {
  const d = deg % 360;
  return d < 0 ? d + 360 : d;
}

/** Length and initial bearing from `from` to `to` ([lon, lat] degrees) on the ellipsoid. */
export function inverse(from: Position, to: Position): GeodesicLine {
  const [lon1, lat1] = from;
  const [lon2, lat2] = to;
  if (lon1 === lon2 && lat1 === lat2) return { distanceM: 0, bearingDeg: 0 };
  const L = (lon2 - lon1) * RAD;
  const U1 = Math.atan((1 - F) * Math.tan(lat1 * RAD));
  const U2 = Math.atan((1 - F) * Math.tan(lat2 * RAD));
  const sinU1 = Math.sin(U1), cosU1 = Math.cos(U1), sinU2 = Math.sin(U2), cosU2 = Math.cos(U2);
  let lambda = L;
  let sinSigma = 0, cosSigma = 0, sigma = 0, cosSqAlpha = 0, cos2SigmaM = 0, sinLambda = 0, cosLambda = 0;
  for (let i = 0; i < 200; i++) {
    sinLambda = Math.sin(lambda);
    cosLambda = Math.cos(lambda);
    const t1 = cosU2 * sinLambda;
    const t2 = cosU1 * sinU2 - sinU1 * cosU2 * cosLambda;
    sinSigma = Math.sqrt(t1 * t1 + t2 * t2);
    if (sinSigma === 0) return { distanceM: 0, bearingDeg: 0 };
    cosSigma = sinU1 * sinU2 + cosU1 * cosU2 * cosLambda;
    sigma = Math.atan2(sinSigma, cosSigma);
    const sinAlpha = (cosU1 * cosU2 * sinLambda) / sinSigma;
    cosSqAlpha = 1 - sinAlpha * sinAlpha;
    cos2SigmaM = cosSqAlpha === 0 ? 0 : cosSigma - (2 * sinU1 * sinU2) / cosSqAlpha;
    const C = (F / 16) * cosSqAlpha * (4 + F * (4 - 3 * cosSqAlpha));
    const prev = lambda;
    lambda = L + (1 - C) * F * sinAlpha * (sigma + C * sinSigma * (cos2SigmaM + C * cosSigma * (-1 + 2 * cos2SigmaM * cos2SigmaM)));
    if (Math.abs(lambda - prev) < 1e-13) break;
  }
  const uSq = (cosSqAlpha * (A * A - B * B)) / (B * B);
  const bigA = 1 + (uSq / 16384) * (4096 + uSq * (-768 + uSq * (320 - 175 * uSq)));
  const bigB = (uSq / 1024) * (256 + uSq * (-128 + uSq * (74 - 47 * uSq)));
  const deltaSigma =
    bigB * sinSigma * (cos2SigmaM + (bigB / 4) * (cosSigma * (-1 + 2 * cos2SigmaM * cos2SigmaM) - (bigB / 6) * cos2SigmaM * (-3 + 4 * sinSigma * sinSigma) * (-3 + 4 * cos2SigmaM * cos2SigmaM)));
  const distanceM = B * bigA * (sigma - deltaSigma);
  const az = Math.atan2(cosU2 * sinLambda, cosU1 * sinU2 - sinU1 * cosU2 * cosLambda) / RAD;
  return { distanceM, bearingDeg: normalizeDeg(az) };
}

/** The point `distanceM` from `from` along the initial bearing `bearingDeg` on the ellipsoid, as [lon, lat]. */
export function destination(from: Position, bearingDeg: number, distanceM: number): Position {
  const [lon1, lat1] = from;
  const alpha1 = bearingDeg * RAD;
  const sinAlpha1 = Math.sin(alpha1), cosAlpha1 = Math.cos(alpha1);
  const tanU1 = (1 - F) * Math.tan(lat1 * RAD);
  const cosU1 = 1 / Math.sqrt(1 + tanU1 * tanU1), sinU1 = tanU1 * cosU1;
  const sigma1 = Math.atan2(tanU1, cosAlpha1);
  const sinAlpha = cosU1 * sinAlpha1;
  const cosSqAlpha = 1 - sinAlpha * sinAlpha;
  const uSq = (cosSqAlpha * (A * A - B * B)) / (B * B);
  const bigA = 1 + (uSq / 16384) * (4096 + uSq * (-768 + uSq * (320 - 175 * uSq)));
  const bigB = (uSq / 1024) * (256 + uSq * (-128 + uSq * (74 - 47 * uSq)));
  let sigma = distanceM / (B * bigA);
  let cos2SigmaM = 0, sinSigma = 0, cosSigma = 0;
  for (let i = 0; i < 200; i++) {
    cos2SigmaM = Math.cos(2 * sigma1 + sigma);
    sinSigma = Math.sin(sigma);
    cosSigma = Math.cos(sigma);
    const deltaSigma =
      bigB * sinSigma * (cos2SigmaM + (bigB / 4) * (cosSigma * (-1 + 2 * cos2SigmaM * cos2SigmaM) - (bigB / 6) * cos2SigmaM * (-3 + 4 * sinSigma * sinSigma) * (-3 + 4 * cos2SigmaM * cos2SigmaM)));
    const prev = sigma;
    sigma = distanceM / (B * bigA) + deltaSigma;
    if (Math.abs(sigma - prev) < 1e-13) break;
  }
  const tmp = sinU1 * sinSigma - cosU1 * cosSigma * cosAlpha1;
  const lat2 = Math.atan2(sinU1 * cosSigma + cosU1 * sinSigma * cosAlpha1, (1 - F) * Math.sqrt(sinAlpha * sinAlpha + tmp * tmp));
  const lambda = Math.atan2(sinSigma * sinAlpha1, cosU1 * cosSigma - sinU1 * sinSigma * cosAlpha1);
  const C = (F / 16) * cosSqAlpha * (4 + F * (4 - 3 * cosSqAlpha));
  const L = lambda - (1 - C) * F * sinAlpha * (sigma + C * sinSigma * (cos2SigmaM + C * cosSigma * (-1 + 2 * cos2SigmaM * cos2SigmaM)));
  return [lon1 + L / RAD, lat2 / RAD];
}

/** A point in a flat frame around an origin: metres east (x) and north (y), true along every line from the origin (azimuthal equidistant). */
export function localXY(origin: Position, p: Position): [number, number] {
  const { distanceM, bearingDeg } = inverse(origin, p);
  const b = bearingDeg * RAD;
  return [distanceM * Math.sin(b), distanceM * Math.cos(b)];
}
