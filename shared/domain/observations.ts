/**
 * Field observations: the kinds of sign a person logs on the ground, and the rule that places an
 * observation on the plan (PostGIS measures the distances; this decides what they mean).
 */

/** The kinds of sign, as API slugs, in the order the log form shows them. */
export const OBSERVATION_KINDS = ['rub', 'scrape', 'bed', 'trail', 'shed', 'browse', 'tracks', 'droppings', 'standing-water', 'thin-stand', 'invasive-plants', 'other'] as const;
export type ObservationKind = (typeof OBSERVATION_KINDS)[number];

/** The label people read, and a colour from DESIGN.md's palette family for the map symbol. */
export const OBSERVATION_KIND_STYLES: Record<ObservationKind, { label: string; colour: string }> = {
  rub: { label: 'Rub', colour: '#8A5A2B' },
  scrape: { label: 'Scrape', colour: '#6B3F1F' },
  bed: { label: 'Bed', colour: '#7C6A3A' },
  trail: { label: 'Trail', colour: '#5B6B3A' },
  shed: { label: 'Shed antler', colour: '#A0835C' },
  browse: { label: 'Browse', colour: '#3F6B3A' },
  tracks: { label: 'Tracks', colour: '#4A4A3A' },
  droppings: { label: 'Droppings', colour: '#5A4632' },
  'standing-water': { label: 'Standing water', colour: '#2F6690' },
  'thin-stand': { label: 'Thin stand', colour: '#B08D2E' },
  'invasive-plants': { label: 'Invasive plants', colour: '#9B2F2F' },
  other: { label: 'Other', colour: '#55606A' },
};

/** Where an observation's position came from: the phone's GPS, the photo's EXIF GPS tags, or a tap on the map. */
export const POSITION_SOURCES = ['device', 'photo', 'map'] as const;
export type PositionSource = (typeof POSITION_SOURCES)[number];

/** Feet in a metre: 1 ft = 0.3048 m exactly (international yard and pound agreement, 1959). */
export const FEET_PER_METRE = 1 / 0.3048;

/** A firm that has not chosen: an observation up to 50 ft outside every unit goes to the nearest (the default; roughly a phone GPS's error under tree cover, common practice, no source). */
export const DEFAULT_OBSERVATION_SNAP_FT = 50;

/**
 * Beyond this distance outside the property boundary an observation is probably a slip (a wrong
 * property, a tap on the wrong side of the map, a photo taken elsewhere): it asks for a confirmation.
 * A quarter mile (common practice, no source).
 */
export const OBSERVATION_FAR_AWAY_FT = 1320;

/** What PostGIS measured for one position. */
export interface PlacementMeasures {
  /** The smallest area unit that contains the position, if any. */
  containingUnitId: number | null;
  /** The nearest unit of any kind and its distance in metres on the ellipsoid, if the plan has units. */
  nearestUnitId: number | null;
  nearestUnitM: number | null;
  /** Whether the property has a boundary at all; distance 0 means inside or on it. */
  hasBoundary: boolean;
  boundaryDistanceM: number | null;
}

/** Where the observation goes. */
export interface Placement {
  unitId: number | null;
  how: 'inside' | 'nearest' | 'none';
  insideBoundary: boolean;
  /** Set when the position lies so far outside that the person must confirm it. */
  farAwayFt: number | null;
}

/** The firm's snap distance in feet from its settings, or the default. */
export function observationSnapFt(settings: Record<string, unknown> | null | undefined): number {
  const v = settings?.observationSnapFt;
  return typeof v === 'number' && Number.isFinite(v) && v >= 0 ? v : DEFAULT_OBSERVATION_SNAP_FT;
}

/**
 * Places an observation: the containing unit; else the nearest unit within `snapFt`; else none.
 * Inside the boundary when the property has none (nothing says otherwise) or the distance is 0.
 * Far away when more than OBSERVATION_FAR_AWAY_FT outside the boundary (or, without a boundary,
 * that far from every unit).
 */
export function placeObservation(m: PlacementMeasures, snapFt: number): Placement {
  const insideBoundary = !m.hasBoundary || (m.boundaryDistanceM ?? 0) <= 1e-6;
  let unitId: number | null = null;
  let how: Placement['how'] = 'none';
  if (m.containingUnitId !== null) {
    unitId = m.containingUnitId;
    how = 'inside';
  } else if (m.nearestUnitId !== null && m.nearestUnitM !== null && m.nearestUnitM * FEET_PER_METRE <= snapFt) {
    unitId = m.nearestUnitId;
    how = 'nearest';
  }
  const outsideFt = m.hasBoundary ? (m.boundaryDistanceM ?? 0) * FEET_PER_METRE : m.nearestUnitM !== null ? m.nearestUnitM * FEET_PER_METRE : 0;
  const farAwayFt = outsideFt > OBSERVATION_FAR_AWAY_FT ? Math.round(outsideFt) : null;
  return { unitId, how, insideBoundary, farAwayFt };
}

/** The month an instant falls in, in the firm's zone, as "YYYY-MM" (the summary's key). */
export function monthKey(isoDate: string): string {
  return isoDate.slice(0, 7);
}
