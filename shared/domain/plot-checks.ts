/**
 * Checks on a unit: how a seeded plot came up (establishment check: plants per ft² from frame
 * counts against a target stand per species), how hard deer use it (browse check: paired caged and
 * open samples → use % and Jacobs' 1974 preference index) and what a timber stand carries (prism
 * cruise: basal area and trees per acre). Pure; the server stores the result, the field sheet and
 * the unit's page preview it with the same functions.
 */
import { DomainValidationError } from './errors';

// ---------------------------------------------------------------- establishment

export const ESTABLISHMENT_STATUSES = ['established', 'thin', 'failed'] as const;
export type EstablishmentStatus = (typeof ESTABLISHMENT_STATUSES)[number];

export const WEED_PRESSURES = ['none', 'low', 'moderate', 'high'] as const;
export type WeedPressure = (typeof WEED_PRESSURES)[number];

/** A target stand: seedlings per ft² a few weeks after seeding that make a full stand of the species. */
export interface StandTarget {
  plantsPerSqFt: number;
  /** Where the number comes from, shown beside the result. */
  source: string;
}

const FROM_MEMORY = 'from memory (common extension guidance; no published stand count found for this species)';

/** Penn State Extension, "Wheat Stand Assessment": 20–30 plants/ft² adequate for maximum yield; replant below 12–14. */
const PSU_WHEAT = 'Penn State Extension, "Wheat Stand Assessment": 20–30 plants/ft² adequate (lower end taken)';
/** The same guide applied to the other fall cereals: no oat or rye count was found, so this is by analogy. */
const PSU_WHEAT_ANALOGY = 'by analogy to Penn State Extension, "Wheat Stand Assessment" (20 plants/ft² for wheat); no published count found for this cereal';
/** Forage rape is Brassica napus, the species of canola; canola stand guides apply to its seedlings. */
const CANOLA_STAND = 'OMAFRA Field Crop News, "Stand assessments and replant decisions for spring canola" (2025): optimum 5–8 plants/ft² (lower end taken); NDSU Crop & Pest Report (27 May 1999): 4 plants/ft² minimum';
/** Penn State forage specialist M. Hall, quoted in Hay & Forage Grower, "When thin alfalfa seedings aren't worth keeping": 15 plants/ft² bare minimum in new seedings. */
const ALFALFA_STAND = 'Penn State Extension (M. Hall), in Hay & Forage Grower, "When thin alfalfa seedings aren\'t worth keeping": 15 plants/ft² minimum in a new seeding';
/** USDA Farmers' Bulletin "Growing Crimson Clover" (L. W. Kephart, USDA, c. 1920), "Rate of seeding": six plants to every square foot "is a satisfactory stand". */
const CRIMSON_STAND = 'USDA Farmers\' Bulletin "Growing Crimson Clover" (L. W. Kephart), Rate of seeding: 6 plants/ft² is a satisfactory stand';
/** Iowa State University Extension, Integrated Crop Management News (P. Pedersen, 4 June 2007, "Planting and replanting scenarios"): a final stand of about 100,000 plants/acre; 100,000 ÷ 43,560 ft² = 2.30 plants/ft². */
const SOYBEAN_STAND = 'Iowa State Univ. Extension, ICM News (Pedersen, 2007), "Planting and replanting scenarios": final stand about 100,000 plants/acre = 2.3 plants/ft²';
/** Univ. of Tennessee Extension, UT Crops News (2015), "Grain sorghum stand issues and replant considerations": final stands of 60–70 thousand plants/acre; 60,000 ÷ 43,560 ft² = 1.38 plants/ft² (lower end taken). */
const SORGHUM_STAND = 'Univ. of Tennessee Extension, UT Crops News (2015), "Grain sorghum stand issues and replant considerations": final stand 60,000–70,000 plants/acre; 60,000 ÷ 43,560 = 1.4 plants/ft²';
/**
 * Great Plains Agricultural Council (1966): a grass seeding is successful when at least one plant per ft² becomes
 * established — read second-hand, as cited in a Colorado Division of Reclamation, Mining and Safety revegetation
 * report. (Oklahoma State's switchgrass guide aims higher at emergence: "at least 20 seedlings per square foot".)
 */
const NATIVE_GRASS_STAND = 'Great Plains Agricultural Council (1966), as cited by the Colorado Division of Reclamation, Mining and Safety: a seeding is successful with at least 1 established plant/ft² (second-hand)';

/**
 * Target stands by species (the common names the library's seed materials use): seedlings per ft²
 * a few weeks after seeding. Each carries where the number comes from; where no published stand
 * count could be found it says "from memory", and the consultant judges.
 */
export const STAND_TARGETS: Readonly<Record<string, StandTarget>> = {
  'white clover': { plantsPerSqFt: 10, source: FROM_MEMORY },
  'red clover': { plantsPerSqFt: 10, source: FROM_MEMORY },
  'crimson clover': { plantsPerSqFt: 6, source: CRIMSON_STAND },
  alfalfa: { plantsPerSqFt: 15, source: ALFALFA_STAND },
  'forage chicory': { plantsPerSqFt: 5, source: FROM_MEMORY },
  'forage radish': { plantsPerSqFt: 4, source: FROM_MEMORY },
  turnip: { plantsPerSqFt: 5, source: FROM_MEMORY },
  rape: { plantsPerSqFt: 5, source: CANOLA_STAND },
  oats: { plantsPerSqFt: 20, source: PSU_WHEAT_ANALOGY },
  wheat: { plantsPerSqFt: 20, source: PSU_WHEAT },
  'cereal rye': { plantsPerSqFt: 20, source: PSU_WHEAT_ANALOGY },
  cowpeas: { plantsPerSqFt: 2, source: FROM_MEMORY },
  'grain sorghum': { plantsPerSqFt: 1.4, source: SORGHUM_STAND },
  soybeans: { plantsPerSqFt: 2.3, source: SOYBEAN_STAND },
  'big bluestem': { plantsPerSqFt: 1, source: NATIVE_GRASS_STAND },
  indiangrass: { plantsPerSqFt: 1, source: NATIVE_GRASS_STAND },
  'little bluestem': { plantsPerSqFt: 1, source: NATIVE_GRASS_STAND },
  switchgrass: { plantsPerSqFt: 1, source: NATIVE_GRASS_STAND },
};

/** A stand at or above this share of its target is established (common practice, no source). */
export const ESTABLISHED_MIN_RATIO = 0.75;
/** Below this share of its target a stand has failed; between the two it is thin (common practice, no source). */
export const THIN_MIN_RATIO = 0.4;
/** Ground cover that judges a plot when none of its species has a target, percent (common practice, no source). */
export const COVER_ESTABLISHED_PCT = 70;
export const COVER_THIN_PCT = 40;

/** The target stand of a species, by its common name (case and spacing ignored); null when unknown. */
export function standTargetFor(species: string): StandTarget | null {
  const key = species.trim().toLowerCase().replace(/\s+/g, ' ');
  return STAND_TARGETS[key] ?? null;
}

/** established, thin or failed from a stand's share of its target. */
export function statusFromRatio(ratio: number): EstablishmentStatus {
  if (ratio >= ESTABLISHED_MIN_RATIO) return 'established';
  if (ratio >= THIN_MIN_RATIO) return 'thin';
  return 'failed';
}

export interface EstablishmentInput {
  frameSqFt: number;
  samples: readonly { species: string; plants: number }[];
  groundCoverPct: number;
  weedPressure: WeedPressure;
}

export interface EstablishmentSpeciesResult {
  species: string;
  frames: number;
  plants: number;
  plantsPerSqFt: number;
  targetPlantsPerSqFt: number | null;
  targetSource: string | null;
  /** plants per ft² ÷ target; null without a target. */
  ratio: number | null;
  status: EstablishmentStatus | null;
}

export interface EstablishmentResult {
  species: EstablishmentSpeciesResult[];
  status: EstablishmentStatus;
  /** A sentence saying why, for the unit's page and the re-seeding draft. */
  reason: string;
}

function wholeCount(field: string, value: number, label: string): void {
  if (!Number.isInteger(value) || value < 0) throw new DomainValidationError(field, `${label} must be a whole number, zero or more (got ${value}).`);
}

/**
 * Plants per ft² per species (all frames of a species together: plants ÷ (frames × frame area)),
 * each against its target stand, and the plot's status: the mean share of target (each capped at
 * 1, so a thick species cannot hide a failed one) or, when no species has a target, ground cover.
 */
export function establishmentResult(input: EstablishmentInput): EstablishmentResult {
  if (!(input.frameSqFt > 0) || !Number.isFinite(input.frameSqFt)) {
    throw new DomainValidationError('frameSqFt', `The frame area must be more than 0 ft² (got ${input.frameSqFt}); measure the frame's inside, e.g. 1 ft² for a 12-inch square.`);
  }
  if (input.samples.length === 0) throw new DomainValidationError('samples', 'Count at least one frame: species and plants.');
  if (!(input.groundCoverPct >= 0 && input.groundCoverPct <= 100)) {
    throw new DomainValidationError('groundCoverPct', `Ground cover is a percentage from 0 to 100 (got ${input.groundCoverPct}).`);
  }
  const bySpecies = new Map<string, { species: string; frames: number; plants: number }>();
  input.samples.forEach((sample, i) => {
    wholeCount(`samples.${i}.plants`, sample.plants, 'A plant count');
    const key = sample.species.trim().toLowerCase();
    const row = bySpecies.get(key) ?? { species: sample.species.trim(), frames: 0, plants: 0 };
    row.frames += 1;
    row.plants += sample.plants;
    bySpecies.set(key, row);
  });
  const species: EstablishmentSpeciesResult[] = [...bySpecies.values()].map((row) => {
    const plantsPerSqFt = row.plants / (row.frames * input.frameSqFt);
    const target = standTargetFor(row.species);
    const ratio = target ? plantsPerSqFt / target.plantsPerSqFt : null;
    return {
      ...row,
      plantsPerSqFt,
      targetPlantsPerSqFt: target?.plantsPerSqFt ?? null,
      targetSource: target?.source ?? null,
      ratio,
      status: ratio === null ? null : statusFromRatio(ratio),
    };
  });
  const judged = species.filter((s) => s.ratio !== null);
  if (judged.length === 0) {
    const cover = input.groundCoverPct;
    const status: EstablishmentStatus = cover >= COVER_ESTABLISHED_PCT ? 'established' : cover >= COVER_THIN_PCT ? 'thin' : 'failed';
    return { species, status, reason: `No target stand is known for ${species.map((s) => s.species).join(', ')}; judged by ground cover (${cover} %).` };
  }
  const meanRatio = judged.reduce((sum, s) => sum + Math.min(1, s.ratio!), 0) / judged.length;
  const status = statusFromRatio(meanRatio);
  const worst = [...judged].sort((a, b) => a.ratio! - b.ratio!)[0]!;
  const pct = (r: number) => `${Math.round(r * 100)} %`;
  const reason =
    status === 'established'
      ? `The stand is at ${pct(meanRatio)} of target on average.`
      : `The stand is at ${pct(meanRatio)} of target on average; ${worst.species} came up at ${worst.plantsPerSqFt.toFixed(1)} plants/ft² against ${worst.targetPlantsPerSqFt} wanted.`;
  return { species, status, reason };
}

/** Share of the full seeding rate a re-seeding drafts: thin plots are overseeded at half rate, failed ones sown again in full (common practice, no source). */
export function reseedRateFactor(status: EstablishmentStatus): number | null {
  if (status === 'thin') return 0.5;
  if (status === 'failed') return 1;
  return null;
}

// ---------------------------------------------------------------- browse

export interface BrowsePair {
  species: string;
  caged: number;
  open: number;
}

export interface BrowseSpeciesResult {
  species: string;
  pairs: number;
  cagedTotal: number;
  openTotal: number;
  /** (caged − open) ÷ caged × 100. */
  usePct: number;
  /** r: this species' share of all use. */
  useShare: number | null;
  /** p: this species' share of what was available (caged). */
  availableShare: number;
  /** Jacobs' D, −1 (avoided) … +1 (preferred); null when deer used nothing at all. */
  jacobsD: number | null;
}

export interface BrowseResult {
  species: BrowseSpeciesResult[];
  /** Use over all species together, percent. */
  overallUsePct: number;
}

/**
 * Jacobs' (1974, Oecologia 14:413–417) selectivity index D = (r − p) ÷ (r + p − 2rp), r the share of
 * use and p the share available; 0 when r = p (including both 0 or both 1, where the formula is 0/0).
 */
export function jacobsD(r: number, p: number): number {
  if (r < 0 || r > 1 || p < 0 || p > 1) throw new DomainValidationError('share', 'Shares of use and availability must lie between 0 and 1.');
  const denominator = r + p - 2 * r * p;
  if (denominator === 0) return 0;
  return (r - p) / denominator;
}

/** Use % = (caged − open) ÷ caged × 100. */
export function usePct(caged: number, open: number): number {
  return ((caged - open) / caged) * 100;
}

/**
 * Browse use per species from paired caged and open samples (heights or clipped weights summed per
 * species), each species' share of use against its share of what the cages show was there, and
 * Jacobs' D. An open sample larger than its cage cannot happen under this method (deer only
 * remove), so it is refused rather than read as negative use.
 */
export function browseResult(pairs: readonly BrowsePair[]): BrowseResult {
  if (pairs.length === 0) throw new DomainValidationError('pairs', 'Measure at least one caged and open pair.');
  const bySpecies = new Map<string, { species: string; pairs: number; cagedTotal: number; openTotal: number }>();
  pairs.forEach((pair, i) => {
    if (!(pair.caged > 0) || !Number.isFinite(pair.caged)) throw new DomainValidationError(`pairs.${i}.caged`, `The caged sample must be more than 0 (got ${pair.caged}): use % divides by it.`);
    if (!(pair.open >= 0) || !Number.isFinite(pair.open)) throw new DomainValidationError(`pairs.${i}.open`, `The open sample must be 0 or more (got ${pair.open}).`);
    if (pair.open > pair.caged) {
      throw new DomainValidationError(
        `pairs.${i}.open`,
        `The open sample of ${pair.species} (${pair.open}) is larger than its cage (${pair.caged}). The cage method measures what deer removed, so open cannot exceed caged: measure the pair again, or move the cage to a spot like the open one.`,
      );
    }
    const key = pair.species.trim().toLowerCase();
    const row = bySpecies.get(key) ?? { species: pair.species.trim(), pairs: 0, cagedTotal: 0, openTotal: 0 };
    row.pairs += 1;
    row.cagedTotal += pair.caged;
    row.openTotal += pair.open;
    bySpecies.set(key, row);
  });
  const rows = [...bySpecies.values()];
  const totalCaged = rows.reduce((s, r) => s + r.cagedTotal, 0);
  const totalUse = rows.reduce((s, r) => s + (r.cagedTotal - r.openTotal), 0);
  const species = rows.map((row) => {
    const use = row.cagedTotal - row.openTotal;
    const p = row.cagedTotal / totalCaged;
    const r = totalUse > 0 ? use / totalUse : null;
    return { ...row, usePct: usePct(row.cagedTotal, row.openTotal), useShare: r, availableShare: p, jacobsD: r === null ? null : jacobsD(r, p) };
  });
  return { species, overallUsePct: (totalUse / totalCaged) * 100 };
}

/** Species deer prefer by Jacobs' D (D > 0), most preferred first. */
export function preferredSpecies(result: BrowseResult): string[] {
  return result.species.filter((s) => s.jacobsD !== null && s.jacobsD > 0).sort((a, b) => b.jacobsD! - a.jacobsD!).map((s) => s.species);
}

export interface BrowseVisit {
  checkedOn: string;
  season: number;
  result: BrowseResult;
}

export interface BrowseTrendRow {
  checkedOn: string;
  season: number;
  overallUsePct: number;
  usePctBySpecies: Record<string, number>;
}

/** Browse use by visit, oldest first, for the trend on the unit's page and the season report. */
export function browseTrend(visits: readonly BrowseVisit[]): BrowseTrendRow[] {
  return [...visits]
    .sort((a, b) => a.checkedOn.localeCompare(b.checkedOn))
    .map((v) => ({
      checkedOn: v.checkedOn,
      season: v.season,
      overallUsePct: v.result.overallUsePct,
      usePctBySpecies: Object.fromEntries(v.result.species.map((s) => [s.species, s.usePct])),
    }));
}

// ---------------------------------------------------------------- timber cruise

/** Basal area of one tree, ft², from its DBH in inches: 0.005454 × DBH² (Univ. of Missouri NR 3110: 12 in → 0.785 ft²). */
export const BASAL_AREA_FACTOR_SQFT_PER_SQIN = 0.005454;

/** Basal area of a tree, ft², from DBH in inches. */
export function treeBasalAreaSqFt(dbhIn: number): number {
  return BASAL_AREA_FACTOR_SQFT_PER_SQIN * dbhIn * dbhIn;
}

export interface CruisePoint {
  inTrees: number;
  /** One DBH for every in-tree, or one mean DBH for the point's in-trees; inches. */
  dbhIn?: number | readonly number[];
}

export interface TimberInput {
  baf: number;
  points: readonly CruisePoint[];
  targetResidualBaSqFtPerAcre?: number | null;
}

export interface TimberResult {
  points: number;
  meanInTrees: number;
  basalAreaSqFtPerAcre: number;
  /** Null unless every in-tree has a DBH. */
  treesPerAcre: number | null;
  quadraticMeanDbhIn: number | null;
  targetResidualBaSqFtPerAcre: number | null;
  /** Basal area to remove to reach the target; 0 when at or below it; null without a target. */
  excessBaSqFtPerAcre: number | null;
}

/**
 * Prism cruise: basal area per acre = BAF × mean in-trees per point; with DBHs, each in-tree stands
 * for BAF ÷ (0.005454 × DBH²) trees per acre, summed and divided by the number of points (standard
 * forestry texts; Univ. of Missouri). Compared with the prescription's target residual basal area.
 */
export function timberResult(input: TimberInput): TimberResult {
  if (!(input.baf > 0) || !Number.isFinite(input.baf)) throw new DomainValidationError('baf', `The basal area factor must be more than 0 (got ${input.baf}); common prisms are 10 or 20.`);
  if (input.points.length === 0) throw new DomainValidationError('points', 'Record at least one prism point.');
  let inTrees = 0;
  let perAcre = 0;
  let everyDbh = true;
  input.points.forEach((point, i) => {
    wholeCount(`points.${i}.inTrees`, point.inTrees, 'An in-tree count');
    inTrees += point.inTrees;
    const dbh = point.dbhIn;
    if (dbh === undefined) {
      if (point.inTrees > 0) everyDbh = false;
      return;
    }
    const list = typeof dbh === 'number' ? Array.from({ length: point.inTrees }, () => dbh) : dbh;
    if (list.length !== point.inTrees) {
      throw new DomainValidationError(`points.${i}.dbhIn`, `Point ${i + 1} lists ${list.length} DBH${list.length === 1 ? '' : 's'} for ${point.inTrees} in-trees: give one per tree, or one mean for the point.`);
    }
    list.forEach((d, j) => {
      if (!(d > 0) || !Number.isFinite(d)) throw new DomainValidationError(`points.${i}.dbhIn${typeof dbh === 'number' ? '' : `.${j}`}`, `A DBH must be more than 0 inches (got ${d}).`);
      perAcre += input.baf / treeBasalAreaSqFt(d);
    });
  });
  const meanInTrees = inTrees / input.points.length;
  const basalAreaSqFtPerAcre = input.baf * meanInTrees;
  const treesPerAcre = everyDbh ? perAcre / input.points.length : null;
  const quadraticMeanDbhIn = treesPerAcre && treesPerAcre > 0 ? Math.sqrt(basalAreaSqFtPerAcre / (treesPerAcre * BASAL_AREA_FACTOR_SQFT_PER_SQIN)) : null;
  const target = input.targetResidualBaSqFtPerAcre ?? null;
  return {
    points: input.points.length,
    meanInTrees,
    basalAreaSqFtPerAcre,
    treesPerAcre,
    quadraticMeanDbhIn,
    targetResidualBaSqFtPerAcre: target,
    excessBaSqFtPerAcre: target === null ? null : Math.max(0, basalAreaSqFtPerAcre - target),
  };
}

// ---------------------------------------------------------------- plot status for maps and progress

export type PlotCheckStatus = EstablishmentStatus | 'browsed-hard' | 'over-target' | 'checked';

/** Use at or above this percent reads as heavy browsing on the map (common practice, no source). */
export const HEAVY_BROWSE_PCT = 50;

/** One word per checked plot for the plan map and Progress: the latest establishment status, else heavy browse or an over-stocked stand. */
export function plotStatus(latest: { kind: 'establishment'; status: EstablishmentStatus } | { kind: 'browse'; overallUsePct: number } | { kind: 'timber'; excessBaSqFtPerAcre: number | null }): PlotCheckStatus {
  if (latest.kind === 'establishment') return latest.status;
  if (latest.kind === 'browse') return latest.overallUsePct >= HEAVY_BROWSE_PCT ? 'browsed-hard' : 'checked';
  return latest.excessBaSqFtPerAcre !== null && latest.excessBaSqFtPerAcre > 0 ? 'over-target' : 'checked';
}

// ---------------------------------------------------------------- re-seeding

/** A seed step's components as a prescription's rates see them. */
export interface SeedRateComponent {
  materialKey: string;
  rateLbPerAcre: number;
}

/** Seeding rates per material scaled by a re-seeding's factor (half rate to overseed a thin stand), rounded to 0.01 lb. */
export function scaledSeedRates(components: readonly SeedRateComponent[], factor: number): Record<string, number> {
  if (!(factor > 0 && factor <= 2)) throw new DomainValidationError('rateFactor', `A re-seeding takes 0 to 2 times the full rate (got ${factor}).`);
  return Object.fromEntries(components.map((c) => [c.materialKey, Math.round(c.rateLbPerAcre * factor * 100) / 100]));
}
