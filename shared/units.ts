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
