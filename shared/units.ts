/** Units of measure: exact legal definitions used by every computation. */

/** International foot in metres, exact (NIST Handbook 44, App. C). */
export const METRES_PER_FOOT = 0.3048;
/** Square feet per acre, exact (NIST Handbook 44, App. C). */
export const SQ_FT_PER_ACRE = 43560;
/** Square metres per international acre: 43,560 × 0.3048² = 4,046.8564224 exactly. */
export const SQ_M_PER_ACRE = SQ_FT_PER_ACRE * METRES_PER_FOOT * METRES_PER_FOOT;
export const SQ_M_PER_HECTARE = 10000;
export const FEET_PER_MILE = 5280;
/** Acres per square mile (a nominal PLSS section). */
export const ACRES_PER_SQ_MI = 640;

export const sqMetresToAcres = (sqM: number): number => sqM / SQ_M_PER_ACRE;
export const sqMetresToHectares = (sqM: number): number => sqM / SQ_M_PER_HECTARE;
export const metresToFeet = (m: number): number => m / METRES_PER_FOOT;
export const feetToMiles = (ft: number): number => ft / FEET_PER_MILE;

/** Hectares per international acre: 4,046.8564224 m² ÷ 10,000 m² = 0.40468564224 exactly (NIST Handbook 44, App. C). */
export const HECTARES_PER_ACRE = SQ_M_PER_ACRE / SQ_M_PER_HECTARE;

/** The units a firm shows areas and lengths in (its profile's `areaUnit` and `lengthUnit`). */
export type AreaUnit = 'acres' | 'hectares';
export type LengthUnit = 'feet' | 'metres';
export interface DisplayUnits {
  areaUnit: AreaUnit;
  lengthUnit: LengthUnit;
}
/** A firm that has not chosen: acres and feet. */
export const DEFAULT_DISPLAY_UNITS: DisplayUnits = { areaUnit: 'acres', lengthUnit: 'feet' };

/** An area kept in acres, in the unit shown. */
export const areaIn = (acres: number, unit: AreaUnit): number => (unit === 'hectares' ? acres * HECTARES_PER_ACRE : acres);
/** A length kept in feet, in the unit shown. */
export const lengthIn = (feet: number, unit: LengthUnit): number => (unit === 'metres' ? feet * METRES_PER_FOOT : feet);

/**
 * An area kept in acres, written in the firm's unit: "0.20 acre", "3.45 acres", "12.3 acres";
 * "1.40 ha", "12.3 ha". Two decimals under 10, one above; `short` writes "ac" for acres.
 */
export function formatArea(acres: number, unit: AreaUnit = 'acres', options: { short?: boolean } = {}): string {
  const value = areaIn(acres, unit);
  const text = (value < 10 ? value.toFixed(2) : value.toFixed(1)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  if (unit === 'hectares') return `${text} ha`;
  if (options.short) return `${text} ac`;
  return `${text} ${Number(value.toFixed(2)) <= 1 ? 'acre' : 'acres'}`;
}

/** A length kept in feet, written in the firm's unit, whole: "1,250 ft", "381 m"; a mile or more adds miles or kilometres. */
export function formatLength(feet: number, unit: LengthUnit = 'feet'): string {
  if (unit === 'metres') {
    const m = lengthIn(feet, 'metres');
    const whole = `${Math.round(m).toLocaleString('en-US')} m`;
    return m >= 1000 ? `${(m / 1000).toFixed(2)} km (${whole})` : whole;
  }
  const whole = `${Math.round(feet).toLocaleString('en-US')} ft`;
  return feet >= FEET_PER_MILE ? `${feetToMiles(feet).toFixed(2)} mi (${whole})` : whole;
}
