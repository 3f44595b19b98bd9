/**
 * Area, perimeter and length on the WGS84 ellipsoid, fast enough for the browser's live preview.
 *
 * Area: each vertex is moved to the authalic (equal-area) sphere of radius R_q through its authalic
 * latitude β (Snyder 1987, "Map Projections — A Working Manual", USGS Professional Paper 1395,
 * eqs. 3-11 to 3-12), which keeps every area exactly; each edge then adds the exact spherical excess
 * of the quadrilateral between it and the equator, tan(E/2) = tan(Δλ/2)·(tan(β₁/2) + tan(β₂/2)) /
 * (1 + tan(β₁/2)·tan(β₂/2)) (the spherical edge term of Karney, "Algorithms for geodesics",
 * J. Geodesy 87:43–55, 2013, §6). The only approximation left is that an edge is taken as a great
 * circle of that sphere rather than a geodesic of the ellipsoid; for edges of a property (up to tens
 * of kilometres) the two enclose areas that differ by far less than 0.01 % (unit tests check it
 * against GeographicLib on random shapes).
 *
 * Length: an edge up to about 30 km is measured with the radii of curvature at its mid-latitude
 * (M north–south, N·cos φ east–west; Snyder 1987, eqs. 4-18 and 4-20), whose error grows with the
 * square of the edge (below 1e-6 at 30 km); longer edges use Lambert's formula for long lines on the
 * auxiliary sphere of parametric latitude (error of order f², about 1e-5 relative at most).
 *
 * Every function takes GeoJSON positions [longitude, latitude, …] in degrees; a third value
 * (altitude) is ignored. Antimeridian crossings are not handled (no property of ours has one).
 */
import type { Position } from 'geojson';

/** WGS84 semi-major axis, metres (NGA.STND.0036, World Geodetic System 1984). */
export const WGS84_A = 6378137;
/** WGS84 flattening (NGA.STND.0036). */
export const WGS84_F = 1 / 298.257223563;
const E2 = WGS84_F * (2 - WGS84_F);
const ONE_MINUS_E2 = 1 - E2;
const RAD = Math.PI / 180;

/**
 * Snyder's q(φ) from s = sin φ as one series in x = e²s²:
 * q = (1 − e²)·[s / (1 − x) + atanh(e·s) / e] = (1 − e²)·s·Σ x^k·(1 + 1 / (2k + 1)).
 * x ≤ 0.0067: the loop keeps six terms (what is left is below 1e-13 and smooth in latitude, so it
 * scales areas by less than that); `authalicQ` keeps ten for the pole's value.
 */
const Q0 = 2, Q1 = 1 + 1 / 3, Q2 = 1 + 1 / 5, Q3 = 1 + 1 / 7, Q4 = 1 + 1 / 9;
const Q5 = 1 + 1 / 11, Q6 = 1 + 1 / 13, Q7 = 1 + 1 / 15, Q8 = 1 + 1 / 17, Q9 = 1 + 1 / 19;

function authalicQ(s: number): number {
  const x = E2 * s * s;
  return ONE_MINUS_E2 * s * (Q0 + x * (Q1 + x * (Q2 + x * (Q3 + x * (Q4 + x * (Q5 + x * (Q6 + x * (Q7 + x * (Q8 + x * Q9)))))))));
}

const Q_POLE = authalicQ(1);
/** sin β = q / q_p: precomputed (1 − e²) / q_p, so that sin β = SINB_SCALE · s · series. */
const SINB_SCALE = ONE_MINUS_E2 / Q_POLE;
/** Square of the authalic sphere's radius: R_q² = a²·q_p / 2 (Snyder 1987, eq. 3-13). */
const AUTHALIC_R2 = (WGS84_A * WGS84_A * Q_POLE) / 2;
/** Below this (radians) tan, atan and sec are replaced by their series (errors below 1e-18). */
const SERIES_LIMIT = 0.01;
// Series coefficients as products (a division by a constant is not turned into a multiplication).
const THIRD = 1 / 3;
const FIFTH = 1 / 5;
const SEVENTH = 1 / 7;
const TWO_FIFTEENTHS = 2 / 15;
const SEVENTEEN_315THS = 17 / 315;
const FIVE_48THS = 5 / 48;
const SIXTY_ONE_1440THS = 61 / 1440;
/** Edges whose sin(authalic latitude) changes more than this (about 100 km north–south) take the full area formula. */
const WIDE_DSB = 0.015;
/** Edges longer than this on the ground (radians of arc, about 32 km) use Lambert's long-line formula. */
const SHORT_EDGE = 0.005;

/** Longitude step in radians, wrapped into [−π, π]. */
function wrapLon(dLon: number): number {
  if (dLon > Math.PI) return dLon - 2 * Math.PI;
  if (dLon < -Math.PI) return dLon + 2 * Math.PI;
  return dLon;
}

/**
 * Lambert's formula for long lines (radians in, metres out): the central angle σ on the sphere of
 * parametric latitudes, corrected for the flattening. Used only for edges over about 30 km.
 */
function lambertLength(from: Position, to: Position): number {
  const lon1 = from[0] * RAD;
  const lat1 = from[1] * RAD;
  const lon2 = to[0] * RAD;
  const lat2 = to[1] * RAD;
  const b1 = Math.atan((1 - WGS84_F) * Math.tan(lat1));
  const b2 = Math.atan((1 - WGS84_F) * Math.tan(lat2));
  const dLon = wrapLon(lon2 - lon1);
  // Haversine central angle (well conditioned for every distance but antipodes).
  const sinDb = Math.sin((b2 - b1) / 2);
  const sinDl = Math.sin(dLon / 2);
  const hav = sinDb * sinDb + Math.cos(b1) * Math.cos(b2) * sinDl * sinDl;
  const sigma = 2 * Math.asin(Math.min(1, Math.sqrt(hav)));
  if (sigma === 0) return 0;
  const p = (b1 + b2) / 2;
  const q = (b2 - b1) / 2;
  const sinP = Math.sin(p);
  const cosP = Math.cos(p);
  const sinQ = Math.sin(q);
  const cosQ = Math.cos(q);
  const cosHalfSigma = Math.cos(sigma / 2);
  const sinHalfSigma = Math.sin(sigma / 2);
  const x = ((sigma - Math.sin(sigma)) * sinP * sinP * cosQ * cosQ) / (cosHalfSigma * cosHalfSigma);
  const y = ((sigma + Math.sin(sigma)) * cosP * cosP * sinQ * sinQ) / (sinHalfSigma * sinHalfSigma);
  return WGS84_A * (sigma - (WGS84_F / 2) * (x + y));
}

/**
 * Spherical excess of a long edge, in full: tan(E/2) = tan(Δλ/2)·S with S = sin β̄ / cos(Δβ/2)
 * = (sin β₁ + sin β₂) / (1 + cos Δβ), from Δλ and the sines of the authalic latitudes.
 */
function wideExcess(dLon: number, sb1: number, sb2: number): number {
  const cosDb = Math.sqrt(1 - sb1 * sb1) * Math.sqrt(1 - sb2 * sb2) + sb1 * sb2;
  return 2 * Math.atan(Math.tan(dLon / 2) * ((sb1 + sb2) / (1 + cosDb)));
}

export interface RingMeasure {
  /** Area enclosed, m², always positive whatever the winding. */
  areaSqM: number;
  /** Length of the ring, closing edge included, m. */
  perimeterM: number;
}

/**
 * One pass over a path: the signed spherical excess on the authalic sphere (meaningful when the path
 * is a ring) and the length, metres. `closed` adds the edge from the last position back to the first.
 * Written as one loop with the maths inline: this runs on every boundary of up to 50,000 vertices in
 * the browser's live preview, and a function call per edge tripled its time.
 */
function scan(coords: readonly Position[], count: number, closed: boolean): void {
  // Constants copied to locals: module-level bindings read inside the loop cost a load and a check each.
  const _RAD = RAD, _E2 = E2, _WGS84_A = WGS84_A, _ONE_MINUS_E2 = ONE_MINUS_E2, _SINB_SCALE = SINB_SCALE;
  const _SERIES_LIMIT = SERIES_LIMIT, _SHORT_EDGE = SHORT_EDGE, _WIDE_DSB = WIDE_DSB;
  const _Q0 = Q0, _Q1 = Q1, _Q2 = Q2, _Q3 = Q3, _Q4 = Q4, _Q5 = Q5;
  let prev = coords[0];
  let lonP = 0;
  let latP = 0;
  let sP = 0;
  let cP = 0;
  let sbP = 0;
  let excess = 0;
  let length = 0;
  // Rare long edges add into accumulators of their own: mixing a call's result into `excess` or
  // `length` (or passing the loop's running doubles to a call) made V8 box those doubles on every
  // edge, which tripled the time of a 50,000-vertex boundary.
  let wideExcessSum = 0;
  let longLength = 0;
  const last = closed ? count : count - 1;
  // Vertex 0 is read inside the loop too, so that every array access has type feedback before V8
  // optimises the loop (a first call on a large ring is compiled mid-loop).
  for (let i = 0; i <= last; i++) {
    const pos = coords[i === count ? 0 : i];
    const lon = pos[0] * _RAD;
    const lat = pos[1] * _RAD;
    const s = Math.sin(lat);
    const c = Math.sqrt(1 - s * s);
    const x = _E2 * s * s;
    const x2 = x * x;
    // Estrin's scheme: short dependency chains keep the processor's pipelines full.
    const sb = _SINB_SCALE * s * (_Q0 + x * _Q1 + x2 * (_Q2 + x * _Q3 + x2 * (_Q4 + x * _Q5)));
    if (i > 0) {
      let dLon = lon - lonP;
      if (dLon > Math.PI) dLon -= 2 * Math.PI;
      else if (dLon < -Math.PI) dLon += 2 * Math.PI;
      const dLat = lat - latP;

      // Area: tan(E/2) = tan(Δλ/2)·S with S = sin β̄ / cos(Δβ/2) = (sin β₁ + sin β₂) / (1 + cos Δβ).
      // For an edge under ~100 km, 1 + cos Δβ = 2 − ε with ε = 2 sin²(Δβ/2) = Δ(sin β)² / (2 cos² β̄)
      // (sum to product) and cos² β̄ ≈ 1 − m², m the mean of the sines (relative error in ε of order
      // Δβ²·tan² β̄ / 4); tan and atan become odd series. The worst edge is off by about 1e-10 of its
      // own term; long edges take the full formulae.
      const hx = dLon / 2;
      const dSb = sb - sbP;
      if (hx < _SERIES_LIMIT && hx > -_SERIES_LIMIT && dSb < _WIDE_DSB && dSb > -_WIDE_DSB) {
        const mSum = sbP + sb;
        const eps = (dSb * dSb) / (2 - 0.5 * mSum * mSum);
        const sRatio = 0.5 * mSum * (1 + eps * (0.5 + eps * 0.25));
        const hx2 = hx * hx;
        const y = hx * (1 + hx2 * (THIRD + hx2 * (TWO_FIFTEENTHS + hx2 * SEVENTEEN_315THS))) * sRatio;
        const y2 = y * y;
        excess += 2 * y * (1 - y2 * (THIRD - y2 * (FIFTH - y2 * SEVENTH)));
      } else {
        wideExcessSum += wideExcess(dLon, sbP, sb);
      }

      // Length: radii of curvature at the mid-latitude; sin φm = (s₁ + s₂) / (2 cos(Δφ/2)), likewise cos.
      const h2 = dLat * dLat * 0.25;
      const halfSec = 0.5 + h2 * (0.25 + h2 * (FIVE_48THS + h2 * SIXTY_ONE_1440THS));
      const sm = (sP + s) * halfSec;
      const cm = (cP + c) * halfSec;
      const dx0 = cm * dLon;
      if (dLat > _SHORT_EDGE || dLat < -_SHORT_EDGE || dx0 > _SHORT_EDGE || dx0 < -_SHORT_EDGE) {
        longLength += lambertLength(prev, pos);
      } else {
        // N = a / √w and M = a(1 − e²) / w^{3/2} with w = 1 − e² sin² φm, so the edge is
        // N·√((M/N)²·Δφ² + (cos φm·Δλ)²) = a·√(((1 − e²)/w)²·Δφ² + (cos φm·Δλ)²) / w).
        // 1 / w = 1 + u + u² + u³ + u⁴ with u = e² sin² φm ≤ 0.0067 (what is left: below 2e-11).
        const u = _E2 * sm * sm;
        const invW = 1 + u * (1 + u * (1 + u * (1 + u)));
        const k = _ONE_MINUS_E2 * invW;
        length += _WGS84_A * Math.sqrt((k * k * dLat * dLat + dx0 * dx0) * invW);
      }
    }
    prev = pos;
    lonP = lon;
    latP = lat;
    sP = s;
    cP = c;
    sbP = sb;
  }
  // Module-level answers rather than a fresh object: a result object after the loop made V8 drop the
  // loop's optimised code on every call (insufficient type feedback at the object literal).
  scannedExcess = excess + wideExcessSum;
  scannedLength = length + longLength;
}

let scannedExcess = 0;
let scannedLength = 0;

/*
 * Warm-up at load: a dozen passes over two small rings (one with short edges, one with long ones)
 * give every operation of `scan` type feedback. Without it, the first call on a large boundary is
 * compiled in the middle of its loop with nothing known about the code after it, and V8 kept
 * running the loop unoptimised on later calls (measured: 10–20× slower). Costs well under 1 ms.
 */
const WARM_UP_RINGS: Position[][] = [
  [[-90.5, 44.1], [-90.499, 44.1], [-90.499, 44.101], [-90.5, 44.101], [-90.5, 44.1]],
  [[-95.5, 36.1], [-92.5, 36.1], [-92.5, 39.1], [-95.5, 36.1]],
];
for (let i = 0; i < 12; i++) {
  for (const ring of WARM_UP_RINGS) {
    scan(ring, ring.length - 1, true);
    scan(ring, ring.length, false);
  }
}

/**
 * Area and perimeter of one ring in one pass. The ring may be closed (last position repeating the
 * first, as GeoJSON wants) or not; it is closed either way.
 */
export function measureRing(ring: readonly Position[]): RingMeasure {
  let n = ring.length;
  if (n > 1 && ring[0][0] === ring[n - 1][0] && ring[0][1] === ring[n - 1][1]) n -= 1;
  if (n < 2) return { areaSqM: 0, perimeterM: 0 };
  scan(ring, n, true);
  return { areaSqM: Math.abs(scannedExcess) * AUTHALIC_R2, perimeterM: scannedLength };
}

/**
 * Area (outer ring less its holes) and perimeter (every ring) of a polygon given as GeoJSON rings.
 * Each ring counts by its size, whatever its winding, like turf and GeographicLib's unsigned area.
 */
export function measurePolygonRings(rings: readonly (readonly Position[])[]): RingMeasure {
  let areaSqM = 0;
  let perimeterM = 0;
  for (let i = 0; i < rings.length; i++) {
    const m = measureRing(rings[i]);
    areaSqM += i === 0 ? m.areaSqM : -m.areaSqM;
    perimeterM += m.perimeterM;
  }
  return { areaSqM, perimeterM };
}

/** Length of a path (LineString coordinates) on the ellipsoid, metres. */
export function pathLengthM(path: readonly Position[]): number {
  if (path.length < 2) return 0;
  scan(path, path.length, false);
  return scannedLength;
}

/** Distance in metres between two positions on the ellipsoid (the same edge rule as every length). */
export function distanceM(a: Position, b: Position): number {
  return pathLengthM([a, b]);
}
