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
 * constant with its source; the K critical level and crop maintenance remain from memory); the
 * consultant edits the prescription, which shows the source.
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

/** Target soil pH by crop group (from memory: common extension guidance of 6.0–6.5 for food-plot crops, legumes at the top; the legume value lies in red clover's 6.1–6.7 of Univ. of Kentucky AGR-33). */
export const TARGET_PH: Record<string, { ph: number; source: string }> = {
  legume: { ph: 6.5, source: 'Univ. of Kentucky AGR-33, "Growing Red Clover in Kentucky": pH 6.1–6.7 (6.5 taken)' },
  brassica: { ph: 6.3, source: 'from memory' },
  grain: { ph: 6.0, source: 'from memory' },
  'native-grass': { ph: 5.8, source: 'from memory' },
};

/** The pH a state method may be asked about; a reading outside is a typing slip. */
export const PH_MIN = 3;
export const PH_MAX = 10;

export interface SoilTestValues {
  ph: number;
  bufferPh?: number | null;
  bufferMethod?: BufferMethod | null;
  pPpm?: number | null;
  kPpm?: number | null;
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
 * acetate for K, in ppm; a Mehlich-3 P reads about 35 % higher than Bray P1 and Mehlich-3 K about 14 %
 * higher than ammonium-acetate K (Ohio State ANR-75, Culman et al. 2019), so send Bray/AA values.
 */
export const NUTRIENT_RULES = {
  /** Tri-State: wheat and alfalfa are more responsive to P than corn or soybeans, so their critical Bray P1 level is 25 ppm (not 15) — Ohio State agBMPs, "Soil test P levels less than 50 ppm", citing Vitosh et al. 1995. */
  pCriticalPpm: 25,
  /** From memory: the Tri-State K critical level rises with CEC; 150 ppm is a round value for the silt loams of the demo region, not read from the bulletin. */
  kCriticalPpm: 150,
  /** Tri-State build-up equations: about 20 lb P2O5 raise soil-test P by 1 ppm (as summarised in AgProfessional, "How much fertilizer will move soil test levels"). */
  p2o5LbPerPpm: 20,
  /** Tri-State build-up equations: 6–10 lb K2O raise soil-test K by 1 ppm depending on CEC (same summary); the middle, 8, is taken. */
  k2oLbPerPpm: 8,
  /** Tri-State: build-up raises the soil test to the critical level over four years (Ohio State agcrops, "The new Tri-State fertilizer recommendation framework"). */
  buildUpYears: 4,
  /** At or above twice the critical level nothing is added: for P that is 50 ppm Bray P1, the level Ohio State agBMPs gives for no further fertilizer when every crop of the rotation is considered. */
  noneAboveCriticalTimes: 2,
  source:
    'Tri-State build-up and maintenance (Vitosh et al. 1995, MSU E-2567): P critical 25 ppm Bray P1 (wheat/alfalfa), 20 lb P2O5 per ppm, 8 lb K2O per ppm (6–10 by CEC), built up over 4 years; K critical 150 ppm and crop maintenance from memory',
} as const;

/** Maintenance by crop group, lb/acre: crop removal (from memory; the Tri-State bulletin has tables for corn, soybeans, wheat and alfalfa only). */
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

/** P2O5 and K2O per acre: build-up toward the critical level spread over the years, plus maintenance; no maintenance well above critical. */
export function nutrientRecommendation(test: SoilTestValues, cropGroup: string): NutrientRecommendation {
  const m = MAINTENANCE[cropGroup] ?? MAINTENANCE.grain!;
  const r = NUTRIENT_RULES;
  const part = (ppm: number | null | undefined, critical: number, perPpm: number, maintenance: number) => {
    if (ppm === null || ppm === undefined) return maintenance;
    if (ppm >= critical * r.noneAboveCriticalTimes) return 0;
    const buildUp = ppm < critical ? ((critical - ppm) * perPpm) / r.buildUpYears : 0;
    return Math.round(buildUp + maintenance);
  };
  const p2o5 = part(test.pPpm, r.pCriticalPpm, r.p2o5LbPerPpm, m.p2o5);
  const k2o = part(test.kPpm, r.kCriticalPpm, r.k2oLbPerPpm, m.k2o);
  return { p2o5LbPerAcre: p2o5, k2oLbPerAcre: k2o, working: `P ${test.pPpm ?? '—'} ppm, K ${test.kPpm ?? '—'} ppm against ${r.pCriticalPpm} and ${r.kCriticalPpm} ppm`, source: r.source };
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
