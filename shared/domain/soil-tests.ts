/**
 * Soil tests → lime and fertilizer by a published state method, chosen per firm region.
 *
 * - `ncdacs`: North Carolina Dept. of Agriculture (NCDA&CS) Mehlich-buffer method, published with a
 *   worked example (ncagr.gov, "bufftab1"): acidity (meq/100 cm³) = (6.6 − buffer pH) × 4;
 *   factor = (target pH − soil pH) ÷ (6.6 − soil pH); lime t/acre = acidity × factor − residual
 *   credit. Example: pH 5.0 → 6.0 with acidity 1.2 → 1.2 × 0.625 = 0.75 t/acre (the page prints 0.76).
 * - `missouri`: University of Missouri ENM method: the lab's ENM recommendation (lb ENM/acre) ÷ the
 *   lime's ENM guarantee per ton (1,600 ÷ 400 = 4 t/acre; 1,200 ÷ 400 = 3 t/acre, MU Extension).
 *   MU measures salt pH and the Woodruff buffer's neutralizable acidity; the ENM figure is the lab's.
 *
 * Phosphate and potash: the Tri-State build-up and maintenance approach (see NUTRIENT_RULES, each
 * constant with its source; crop maintenance remains from memory), on Bray P1 and ammonium-acetate K:
 * a Mehlich-3 report is converted first (`toTriStateBasis`, Ohio State ANR-75); the consultant edits
 * the prescription, which shows the source.
 */
import { DomainValidationError } from './errors';
import { limeTonsPerAcreFromEnm } from './lime';
import { roundHalfUp } from './rounding';

export const LIME_METHODS = ['ncdacs', 'missouri'] as const;
export type LimeMethod = (typeof LIME_METHODS)[number];

export const BUFFER_METHODS = ['mehlich', 'woodruff', 'sikora', 'smp'] as const;
export type BufferMethod = (typeof BUFFER_METHODS)[number];

/** The buffer each method reads; any other is refused. */
export const METHOD_BUFFERS: Record<LimeMethod, readonly BufferMethod[]> = { ncdacs: ['mehlich'], missouri: ['woodruff'] };

export const LIME_METHOD_LABELS: Record<LimeMethod, string> = {
  ncdacs: 'NCDA&CS Mehlich-buffer method (North Carolina)',
  missouri: 'University of Missouri ENM method',
};

const TRI_STATE_PH_TABLE = 'Tri-State Fertilizer Recommendations (Vitosh et al. 1995, MSU Extension Bulletin E-2567), Table 1 "Soil pH recommended for various crops"';

/**
 * Target soil pH by crop group, each with its source. Tri-State Table 1 gives, for mineral soils with subsoil
 * pH above 6 / below 6: alfalfa 6.5 / 6.8; other forage legumes 6.0 / 6.8; corn, soybeans, small grains and
 * other crops 6.0 / 6.5. Brassicas and native grasses have no row there.
 */
export const TARGET_PH: Record<string, { ph: number; source: string }> = {
  legume: { ph: 6.5, source: `Univ. of Kentucky AGR-33, "Growing Red Clover in Kentucky": pH 6.1–6.7 (6.5 taken); ${TRI_STATE_PH_TABLE}: alfalfa 6.5 over a subsoil above pH 6` },
  brassica: { ph: 6.3, source: `from memory (between the "other crops" 6.0 and 6.5 of ${TRI_STATE_PH_TABLE}; no brassica row)` },
  grain: { ph: 6.0, source: `${TRI_STATE_PH_TABLE}: small grains 6.0 over a subsoil above pH 6 (6.5 over an acid subsoil)` },
  'native-grass': { ph: 5.8, source: 'from memory (Oklahoma State switchgrass guide: no lime for switchgrass establishment at soil pH 5.0 or above)' },
};

/** The pH a state method may be asked about; a reading outside is a typing slip. */
export const PH_MIN = 3;
export const PH_MAX = 10;

/**
 * The lab's extractant for P and K: Bray P1 with 1 N ammonium acetate K (what the Tri-State rules are
 * calibrated on), or Mehlich-3 for both (what most commercial labs now run).
 */
export const SOIL_LAB_METHODS = ['bray-nh4oac', 'mehlich-3'] as const;
export type SoilLabMethod = (typeof SOIL_LAB_METHODS)[number];

export const SOIL_LAB_METHOD_LABELS: Record<SoilLabMethod, string> = {
  'bray-nh4oac': 'Bray P1, NH4OAc K',
  'mehlich-3': 'Mehlich-3',
};

/**
 * Ohio State University Extension fact sheet ANR-75, "Converting between Mehlich-3, Bray P, and Ammonium
 * Acetate Soil Test Values" (Culman et al., 14 June 2019), Summary of Findings: in Ohio and Indiana soils
 * Mehlich-3 P reads 35 % higher than Bray P, and Mehlich-3 K 14 % higher than ammonium-acetate K.
 */
export const MEHLICH3_CONVERSION = {
  pMehlich3PerBray: 1.35,
  kMehlich3PerAmmoniumAcetate: 1.14,
  source: 'Ohio State ANR-75 (Culman et al. 2019): Mehlich-3 P = 1.35 × Bray P1, Mehlich-3 K = 1.14 × ammonium-acetate K',
} as const;

/**
 * P and K on the Tri-State rules' basis (Bray P1, ammonium-acetate K): a Mehlich-3 reading divided by ANR-75's
 * factors, rounded to 0.1 ppm; Bray and ammonium-acetate readings pass unchanged.
 */
export function toTriStateBasis(test: { pPpm?: number | null; kPpm?: number | null; labMethod?: SoilLabMethod | null }): { pPpm: number | null; kPpm: number | null; converted: boolean } {
  const p = test.pPpm ?? null;
  const k = test.kPpm ?? null;
  if (test.labMethod !== 'mehlich-3') return { pPpm: p, kPpm: k, converted: false };
  const c = MEHLICH3_CONVERSION;
  return {
    pPpm: p === null ? null : roundHalfUp(p / c.pMehlich3PerBray, 1),
    kPpm: k === null ? null : roundHalfUp(k / c.kMehlich3PerAmmoniumAcetate, 1),
    converted: true,
  };
}

export interface SoilTestValues {
  ph: number;
  bufferPh?: number | null;
  bufferMethod?: BufferMethod | null;
  pPpm?: number | null;
  kPpm?: number | null;
  /** The extractant the P and K were read with; Bray/ammonium acetate when left out. */
  labMethod?: SoilLabMethod | null;
  /** Cation exchange capacity, meq/100 g: sets the K critical level. */
  cec?: number | null;
  /** The lab's own ENM recommendation, lb ENM/acre (University of Missouri reports). */
  enmLbPerAcre?: number | null;
}

export interface LimeRecommendationResult {
  method: LimeMethod;
  targetPh: number;
  tonsPerAcre: number;
  /** How it was worked, for the prescription's "source" line. */
  working: string;
  source: string;
}

/** Refuses a buffer method the chosen state method does not use, naming the field. */
export function checkBufferMethod(method: LimeMethod, bufferMethod: BufferMethod | null | undefined): void {
  if (!bufferMethod) return;
  if (!METHOD_BUFFERS[method].includes(bufferMethod)) {
    throw new DomainValidationError('bufferMethod', `The ${LIME_METHOD_LABELS[method]} reads the ${METHOD_BUFFERS[method].join(' or ')} buffer, not ${bufferMethod}: send the buffer pH your lab measured with that buffer, or leave the buffer out.`);
  }
}

/** NCDA&CS: acidity (meq/100 cm³) from the Mehlich buffer pH: (6.6 − BpH) × 4. */
export function ncdacsAcidity(bufferPh: number): number {
  return Math.max(0, (6.6 - bufferPh) * 4);
}

/** NCDA&CS lime t/acre: acidity × (target − pH) ÷ (6.6 − pH) − residual credit; 0 at or above the target. */
export function ncdacsLimeTonsPerAcre(ph: number, acidity: number, targetPh: number, residualCredit = 0): number {
  if (ph >= targetPh) return 0;
  if (ph >= 6.6) return 0;
  const factor = (targetPh - ph) / (6.6 - ph);
  return Math.max(0, acidity * factor - residualCredit);
}

/** Lime for a soil test by the chosen method, to the crop's target pH. */
export function limeRecommendation(method: LimeMethod, test: SoilTestValues, targetPh: number, productEnmLbPerTon = 400): LimeRecommendationResult {
  if (!(test.ph >= PH_MIN && test.ph <= PH_MAX)) throw new DomainValidationError('ph', `pH must lie between ${PH_MIN} and ${PH_MAX} (got ${test.ph}); check the lab report.`);
  checkBufferMethod(method, test.bufferMethod);
  if (method === 'ncdacs') {
    if (test.bufferPh === null || test.bufferPh === undefined) {
      if (test.ph >= targetPh) return { method, targetPh, tonsPerAcre: 0, working: `pH ${test.ph} is at or above the target ${targetPh}: no lime.`, source: 'NCDA&CS (ncagr.gov, buffer acidity table)' };
      throw new DomainValidationError('bufferPh', 'The NCDA&CS method needs the Mehlich buffer pH from the lab report to size the lime.');
    }
    const acidity = ncdacsAcidity(test.bufferPh);
    const tons = ncdacsLimeTonsPerAcre(test.ph, acidity, targetPh);
    return {
      method,
      targetPh,
      tonsPerAcre: roundHalfUp(tons, 2),
      working: `acidity (6.6 − ${test.bufferPh}) × 4 = ${acidity.toFixed(2)} meq/100 cm³ × (${targetPh} − ${test.ph}) ÷ (6.6 − ${test.ph}) = ${tons.toFixed(2)} t/acre`,
      source: 'NCDA&CS (ncagr.gov, buffer acidity table)',
    };
  }
  if (test.enmLbPerAcre === null || test.enmLbPerAcre === undefined) {
    if (test.ph >= targetPh) return { method, targetPh, tonsPerAcre: 0, working: `pH ${test.ph} is at or above the target ${targetPh}: no lime.`, source: 'University of Missouri Extension' };
    throw new DomainValidationError('enmLbPerAcre', 'The University of Missouri method sizes lime from the lab’s ENM recommendation (lb ENM/acre): copy it from the report.');
  }
  const tons = limeTonsPerAcreFromEnm(test.enmLbPerAcre, productEnmLbPerTon);
  return { method, targetPh, tonsPerAcre: roundHalfUp(tons, 2), working: `${test.enmLbPerAcre} lb ENM/acre ÷ ${productEnmLbPerTon} lb ENM/ton = ${tons.toFixed(2)} t/acre`, source: 'University of Missouri Extension (ENM ÷ ENM per ton)' };
}

/**
 * Phosphate and potash by the Tri-State build-up and maintenance approach (Vitosh, Johnson & Mengel
 * 1995, "Tri-State Fertilizer Recommendations for Corn, Soybeans, Wheat and Alfalfa", MSU Extension
 * Bulletin E-2567, with Ohio State and Purdue). Its lab methods: Bray P1 for P and 1 N ammonium
 * acetate for K, in ppm; Mehlich-3 readings are converted first (`toTriStateBasis`, Ohio State ANR-75).
 */
export const NUTRIENT_RULES = {
  /** Tri-State: wheat and alfalfa are more responsive to P than corn or soybeans, so their critical Bray P1 level is 25 ppm (not 15) — Ohio State agBMPs, "Soil test P levels less than 50 ppm", citing Vitosh et al. 1995. */
  pCriticalPpm: 25,
  /**
   * K critical level by CEC: the 2020 Tri-State revision (Culman et al. 2020, "Tri-State Fertilizer Recommendations
   * for Corn, Soybean, Wheat, and Alfalfa", Ohio State Extension Bulletin 974; as listed in A&L Great Lakes
   * Laboratories' release note) sets 100 ppm Mehlich-3 K for soils of CEC 5 meq/100 g or less and 120 ppm above 5;
   * on the ammonium-acetate basis of these rules (÷ 1.14, ANR-75): 100 ÷ 1.14 = 87.7 → 88 ppm, 120 ÷ 1.14 = 105.3 → 105 ppm.
   * Without a CEC the higher level (CEC above 5) is taken.
   */
  kCriticalLowCecPpm: 88,
  kCriticalPpm: 105,
  /** The CEC (meq/100 g) at or below which the lower K critical level applies (2020 Tri-State). */
  kLowCecMax: 5,
  /** Tri-State build-up equations: about 20 lb P2O5 raise soil-test P by 1 ppm (as summarised in AgProfessional, "How much fertilizer will move soil test levels"). */
  p2o5LbPerPpm: 20,
  /** Tri-State build-up equations: 6–10 lb K2O raise soil-test K by 1 ppm depending on CEC (same summary); the middle, 8, is taken. */
  k2oLbPerPpm: 8,
  /** Tri-State: build-up raises the soil test to the critical level over four years (Ohio State agcrops, "The new Tri-State fertilizer recommendation framework"). */
  buildUpYears: 4,
  /** At or above twice the critical level nothing is added: for P that is 50 ppm Bray P1, the level Ohio State agBMPs gives for no further fertilizer when every crop of the rotation is considered. */
  noneAboveCriticalTimes: 2,
  source:
    'Tri-State build-up and maintenance (Vitosh et al. 1995, MSU E-2567): P critical 25 ppm Bray P1 (wheat/alfalfa), 20 lb P2O5 per ppm, 8 lb K2O per ppm (6–10 by CEC), built up over 4 years; K critical 105 ppm ammonium-acetate K (88 at CEC ≤ 5) from the 2020 Tri-State 120/100 ppm Mehlich-3 ÷ 1.14 (Ohio State ANR-75); crop maintenance from memory',
} as const;

/** The Tri-State K critical level (ppm ammonium-acetate K) for a soil's CEC; the higher level when the CEC is unknown. */
export function kCriticalPpm(cec: number | null | undefined): number {
  const r = NUTRIENT_RULES;
  return cec !== null && cec !== undefined && cec <= r.kLowCecMax ? r.kCriticalLowCecPpm : r.kCriticalPpm;
}

/** Maintenance by crop group, lb/acre: crop removal (from memory; the Tri-State bulletin has tables for corn, soybeans, wheat and alfalfa only — MSU Extension gives alfalfa's K removal as 50 lb K2O per ton). */
export const MAINTENANCE: Record<string, { p2o5: number; k2o: number }> = {
  legume: { p2o5: 30, k2o: 60 },
  brassica: { p2o5: 40, k2o: 60 },
  grain: { p2o5: 30, k2o: 30 },
  'native-grass': { p2o5: 0, k2o: 0 },
};

export interface NutrientRecommendation {
  p2o5LbPerAcre: number;
  k2oLbPerAcre: number;
  working: string;
  source: string;
}

/**
 * P2O5 and K2O per acre: build-up toward the critical level spread over the years, plus maintenance; no
 * maintenance well above critical. A Mehlich-3 report is first put on the Bray/ammonium-acetate basis.
 */
export function nutrientRecommendation(test: SoilTestValues, cropGroup: string): NutrientRecommendation {
  const m = MAINTENANCE[cropGroup] ?? MAINTENANCE.grain!;
  const r = NUTRIENT_RULES;
  const basis = toTriStateBasis(test);
  const kCritical = kCriticalPpm(test.cec);
  const part = (ppm: number | null, critical: number, perPpm: number, maintenance: number) => {
    if (ppm === null) return maintenance;
    if (ppm >= critical * r.noneAboveCriticalTimes) return 0;
    const buildUp = ppm < critical ? ((critical - ppm) * perPpm) / r.buildUpYears : 0;
    return Math.round(buildUp + maintenance);
  };
  const p2o5 = part(basis.pPpm, r.pCriticalPpm, r.p2o5LbPerPpm, m.p2o5);
  const k2o = part(basis.kPpm, kCritical, r.k2oLbPerPpm, m.k2o);
  const read = basis.converted
    ? `Mehlich-3 P ${test.pPpm ?? '—'}, K ${test.kPpm ?? '—'} ppm = Bray P1 ${basis.pPpm ?? '—'}, ammonium-acetate K ${basis.kPpm ?? '—'} ppm (÷ 1.35 and ÷ 1.14)`
    : `P ${basis.pPpm ?? '—'} ppm, K ${basis.kPpm ?? '—'} ppm`;
  return {
    p2o5LbPerAcre: p2o5,
    k2oLbPerAcre: k2o,
    working: `${read} against ${r.pCriticalPpm} and ${kCritical} ppm`,
    source: basis.converted ? `${r.source}; ${MEHLICH3_CONVERSION.source}` : r.source,
  };
}

/** The crop group of a practice from the species it sows (for target pH and maintenance). */
export function cropGroupOf(species: readonly string[]): string {
  const s = species.join(' ').toLowerCase();
  if (/clover|alfalfa|cowpea|soybean|pea\b|lablab/.test(s)) return 'legume';
  if (/radish|turnip|rape|kale|brassica/.test(s)) return 'brassica';
  if (/bluestem|indiangrass|switchgrass/.test(s)) return 'native-grass';
  return 'grain';
}

/** The date a retest is due: the sample date plus the firm's interval in years (default 3). */
export function retestDue(sampledOn: string, years = 3): string {
  const y = Number(sampledOn.slice(0, 4)) + years;
  const rest = sampledOn.slice(4);
  return rest === '-02-29' ? `${y}-02-28` : `${y}${rest}`;
}

/** What a unit's soil test is worked against: the firm's method, the crop group its prescription sows, and its lime's ENM. */
export interface SoilTestContext {
  method: LimeMethod;
  cropGroup: string;
  limeEnmLbPerTon: number;
}

/**
 * The lime and P and K a soil test recommends for a unit (target pH by crop group, source named): the one
 * computation the server stores and the browser previews.
 */
export function recommendSoilTest(test: SoilTestValues, context: SoilTestContext): { lime: LimeRecommendationResult; nutrients: NutrientRecommendation } {
  const target = TARGET_PH[context.cropGroup] ?? TARGET_PH.grain!;
  const lime = limeRecommendation(context.method, test, target.ph, context.limeEnmLbPerTon);
  return { lime: { ...lime, source: `${lime.source}; target pH ${target.ph} (${target.source})` }, nutrients: nutrientRecommendation(test, context.cropGroup) };
}
