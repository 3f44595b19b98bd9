/**
 * The practice library's shapes: materials (seed, lime, fertilizer, spray products, other items),
 * practices made of ordered steps, and the parameters a prescription may override. Plain data,
 * so the database seed, the server and the client share one definition.
 */
import type { CautionId } from './cautions';
import type { FertilizerGrade } from './fertilizer';
import type { LimePricing } from './lime';
import type { SeedingMethod, SeedRateBasis } from './seeding';
import { DomainValidationError } from './errors';
import { validateFertilizerGrade } from './fertilizer';
import { validateLimePricing } from './lime';
import { validateSeedLot } from './seeding';
import { validateSprayPricing } from './spraying';
import { requireCents, requireNumber, requireText } from './validation';
import type { Productivity, ServiceRate } from './service-rates';
import type { SprayProductPricing, SprayRate } from './spraying';
import type { UnitKind } from './unit-kinds';
import type { WindowKey } from './planting-windows';

export interface SeedMaterial {
  key: string;
  type: 'seed';
  name: string;
  /** Common name of the species, as used in summaries ("forage radish"). */
  species: string;
  purityPct: number;
  germinationPct: number;
  dormantPct?: number;
  packageSizeLb: number;
  packagePriceCents: number;
}

export interface LimeMaterial {
  key: string;
  type: 'lime';
  name: string;
  /** ENM guarantee, lb per ton (for ENM-based recommendations). */
  enmLbPerTon?: number;
  pricing: LimePricing;
}

export interface FertilizerMaterial {
  key: string;
  type: 'fertilizer';
  name: string;
  grade: FertilizerGrade;
  bagSizeLb: number;
  bagPriceCents: number;
}

/** Longest plant-back interval accepted, days (labels give up to about 4 years for some residual herbicides). */
export const PLANT_BACK_MAX_DAYS = 1500;

/**
 * An EPA registration number as a label prints it: the registrant's company number, a hyphen, the product
 * number, and for a supplemental distributor's product the distributor's company number after a third hyphen
 * (40 CFR 152.132; from memory), e.g. "524-475" or "524-475-123".
 */
export const EPA_REG_NO_PATTERN = /^\d{1,7}-\d{1,7}(-\d{1,7})?$/;

export interface SprayMaterial {
  key: string;
  type: 'herbicide' | 'adjuvant';
  name: string;
  /** Generic active ingredient and concentration, e.g. "glyphosate, 3 lb a.e./gal". */
  activeIngredient: string;
  lbAiPerGal?: number;
  /** Restricted-use products need a certified applicator. */
  restrictedUse: boolean;
  /** EPA registration number from the label, e.g. "524-475" (spray records, 7 CFR 110.3). */
  epaRegNo?: string;
  /** Days from application until the follow crop may be seeded, from the product's label (plant-back interval). */
  plantBackDays?: number;
  pricing: SprayProductPricing;
}

export interface ItemMaterial {
  key: string;
  type: 'item';
  name: string;
  /** How one item is counted, e.g. "seedling", "sign", "ton". */
  itemLabel: string;
  /** Items per pack as sold (1 when sold singly). */
  packSize: number;
  /** How one pack is named on a line, e.g. "bundle of 25". */
  packLabel: string;
  packPriceCents: number;
}

export type MaterialDefinition = SeedMaterial | LimeMaterial | FertilizerMaterial | SprayMaterial | ItemMaterial;
export type MaterialType = MaterialDefinition['type'];

export type StepKind =
  | 'soil-test'
  | 'inspect'
  | 'spray'
  | 'mow'
  | 'lime'
  | 'fertilize'
  | 'till'
  | 'seed'
  | 'cultipack'
  | 'plant'
  | 'chainsaw'
  | 'hinge-cut'
  | 'burn'
  | 'firebreak'
  | 'post-signs'
  | 'clear'
  | 'build'
  | 'scent'
  | 'water-work'
  | 'tree-stand';

export interface SeedComponentDefinition {
  materialKey: string;
  rateLbPerAcre: number;
  rateBasis: SeedRateBasis;
  /**
   * Share of a pure-stand rate this species takes in the mix, in percent (100 for a pure stand).
   * The component's rate = pure-stand rate × share, the usual way to design a mix.
   */
  mixSharePct?: number;
}

export type ItemBasis = 'per-acre' | 'per-100-ft' | 'per-each' | 'fixed';

export type StepApplication =
  | {
      type: 'seed';
      method: SeedingMethod;
      rateMethod?: SeedingMethod;
      broadcastFactor?: number;
      components: SeedComponentDefinition[];
    }
  | { type: 'lime'; materialKey: string; tonsPerAcre?: number; enmLbPerAcre?: number }
  | { type: 'fertilizer'; materialKey: string; nLbPerAcre: number; p2o5LbPerAcre: number; k2oLbPerAcre: number }
  | {
      type: 'spray';
      /** Spray volume, gallons per acre; omit for undiluted direct application. */
      gpa?: number;
      tankGal?: number;
      /** Share of the unit actually sprayed (spot treatment), 0–1. */
      treatedFraction?: number;
      products: { materialKey: string; rate: SprayRate }[];
    }
  | { type: 'items'; items: { materialKey: string; quantity: number; basis: ItemBasis }[] };

export interface StepService {
  rateKey: string;
  productivity?: Productivity;
  /** Fixed quantity instead of the one the rate's basis takes from the unit. */
  quantity?: number;
}

/** Timing of a step relative to the practice's anchor step (negative = days before). */
export interface StepTiming {
  offsetEarliestDays: number;
  offsetLatestDays: number;
  /** Where the lead time comes from. */
  source: string;
}

export interface PracticeStep {
  key: string;
  kind: StepKind;
  name: string;
  /** Steps that must be done before this one. */
  dependsOn?: string[];
  /** Omitted only on the anchor step. */
  timing?: StepTiming;
  application?: StepApplication;
  services?: StepService[];
  /** Extra cautions beyond those the step kind implies. */
  cautions?: CautionId[];
}

/** What the work is measured in: an area's acres, a line's feet, or a count of points. */
export type PracticeMeasure = 'acres' | 'feet' | 'each';

export interface PracticeDefinition {
  key: string;
  name: string;
  description: string;
  unitKinds: UnitKind[];
  measure: PracticeMeasure;
  /** Seasonal window of the anchor step (planting-windows.ts). */
  windowKey: WindowKey;
  /** The step the others are timed from (the seeding, planting or main work). */
  anchorStepKey: string;
  summary: {
    /** Imperative verb: "Plant", "Clear", "Build". */
    action: string;
    /** What is done, e.g. "fall brassicas"; for counted units, the singular with its article. */
    subject: string;
    /** For counted units, the plural used when there are several ("mock scrapes under licking branches"). */
    subjectPlural?: string;
    /** Why, completing "to …", e.g. "give deer a high-energy food source in late fall and winter". */
    purpose: string;
  };
  steps: PracticeStep[];
}

/** Per-step values a prescription overrides (soil-test results, the firm's calibration, counts). */
export interface StepParameters {
  skip?: boolean;
  /** Substitute material for a lime or fertilizer step. */
  materialKey?: string;
  seedMethod?: SeedingMethod;
  broadcastFactor?: number;
  /** Seeding rate per seed material key, in the component's own basis. */
  seedRatesLbPerAcre?: Record<string, number>;
  limeTonsPerAcre?: number;
  limeEnmLbPerAcre?: number;
  nLbPerAcre?: number;
  p2o5LbPerAcre?: number;
  k2oLbPerAcre?: number;
  gpa?: number;
  tankGal?: number;
  treatedFraction?: number;
  sprayRates?: Record<string, SprayRate>;
  /** Item quantity per item material key, in the item's basis. */
  itemQuantities?: Record<string, number>;
  /** Productivity per rate key. */
  productivity?: Record<string, Productivity>;
}

export interface PrescriptionParameters {
  steps?: Record<string, StepParameters>;
}

/** The size of the unit a prescription is written for. */
export interface UnitMeasures {
  acres?: number;
  /** Length of a line unit. */
  lengthFt?: number;
  /** Perimeter of an area unit, for work along its edge (posting, firebreaks). */
  perimeterFt?: number;
  /** Number of items for point units; default 1. */
  count?: number;
}

/** Find a material by key; null when missing. */
export function findMaterial(materials: readonly MaterialDefinition[], key: string): MaterialDefinition | null {
  return materials.find((m) => m.key === key) ?? null;
}

/** Seed materials a practice sows, in step order (for summaries). */
export function practiceSeedMaterials(practice: PracticeDefinition, materials: readonly MaterialDefinition[]): SeedMaterial[] {
  const found: SeedMaterial[] = [];
  for (const step of practice.steps) {
    if (step.application?.type !== 'seed') continue;
    for (const component of step.application.components) {
      const material = findMaterial(materials, component.materialKey);
      if (material?.type === 'seed' && !found.includes(material)) found.push(material);
    }
  }
  return found;
}

/** Check a practice's internal references (unique step keys, anchor, dependencies, timings, material and rate keys); throws DomainValidationError. */
export function validatePracticeDefinition(
  practice: PracticeDefinition,
  materials: readonly MaterialDefinition[],
  rates: readonly ServiceRate[],
): void {
  const field = `practices.${practice.key}`;
  if (!Array.isArray(practice.steps) || practice.steps.length === 0) {
    throw new DomainValidationError(`${field}.steps`, `Practice "${practice.name}" needs at least one step.`);
  }
  const keys = new Set<string>();
  for (const step of practice.steps) {
    if (keys.has(step.key)) throw new DomainValidationError(`${field}.steps.${step.key}`, `Practice "${practice.name}" has two steps keyed "${step.key}".`);
    keys.add(step.key);
  }
  if (!keys.has(practice.anchorStepKey)) {
    throw new DomainValidationError(`${field}.anchorStepKey`, `Practice "${practice.name}" has no step "${practice.anchorStepKey}" to time the others from.`);
  }
  for (const step of practice.steps) {
    const stepField = `${field}.steps.${step.key}`;
    if (step.key !== practice.anchorStepKey && !step.timing) {
      throw new DomainValidationError(`${stepField}.timing`, `Step "${step.name}" needs a lead time relative to the anchor step.`);
    }
    for (const dep of step.dependsOn ?? []) {
      if (!keys.has(dep) || dep === step.key) {
        throw new DomainValidationError(`${stepField}.dependsOn`, `Step "${step.name}" depends on "${dep}", which is not another step of this practice.`);
      }
    }
    const materialKeys: string[] = [];
    const application = step.application;
    if (application?.type === 'seed') materialKeys.push(...application.components.map((c) => c.materialKey));
    if (application?.type === 'lime' || application?.type === 'fertilizer') materialKeys.push(application.materialKey);
    if (application?.type === 'spray') materialKeys.push(...application.products.map((p) => p.materialKey));
    if (application?.type === 'items') materialKeys.push(...application.items.map((i) => i.materialKey));
    for (const key of materialKeys) {
      if (!findMaterial(materials, key)) throw new DomainValidationError(`${stepField}.application`, `Step "${step.name}" uses material "${key}", which is not in the library.`);
    }
    for (const service of step.services ?? []) {
      if (!rates.some((r) => r.key === service.rateKey)) {
        throw new DomainValidationError(`${stepField}.services`, `Step "${step.name}" uses rate "${service.rateKey}", which is not in the library.`);
      }
    }
  }
  // No step may depend on itself through others.
  const dependsOn = new Map(practice.steps.map((s) => [s.key, s.dependsOn ?? []] as const));
  const state = new Map<string, 'visiting' | 'done'>();
  const visit = (key: string, path: string[]): void => {
    if (state.get(key) === 'done') return;
    if (state.get(key) === 'visiting') {
      throw new DomainValidationError(`${field}.steps.${key}.dependsOn`, `Steps of "${practice.name}" depend on each other in a circle: ${[...path, key].join(' → ')}.`);
    }
    state.set(key, 'visiting');
    for (const dep of dependsOn.get(key) ?? []) visit(dep, [...path, key]);
    state.set(key, 'done');
  };
  for (const step of practice.steps) visit(step.key, []);
}

/** Validate one library material (tag values, grade, pricing, package sizes); throws DomainValidationError naming the field. */
export function validateMaterialDefinition(material: MaterialDefinition, field = 'material'): void {
  requireText(`${field}.key`, material.key, 'Material key');
  requireText(`${field}.name`, material.name, 'Material name');
  const positive = (name: string, value: number, label: string, unit: string, max: number) =>
    requireNumber(`${field}.${name}`, value, { label, unit, min: 0, minExclusive: true, max });
  switch (material.type) {
    case 'seed':
      requireText(`${field}.species`, material.species, 'Species');
      validateSeedLot(material, field);
      positive('packageSizeLb', material.packageSizeLb, 'Package size', 'lb', 5000);
      requireCents(`${field}.packagePriceCents`, material.packagePriceCents, 'Package price');
      return;
    case 'lime':
      if (material.enmLbPerTon !== undefined) positive('enmLbPerTon', material.enmLbPerTon, 'ENM guarantee', 'lb ENM/ton', 4000);
      validateLimePricing(material.pricing, `${field}.pricing`);
      return;
    case 'fertilizer':
      validateFertilizerGrade(material.grade, `${field}.grade`);
      positive('bagSizeLb', material.bagSizeLb, 'Bag size', 'lb', 4000);
      requireCents(`${field}.bagPriceCents`, material.bagPriceCents, 'Bag price');
      return;
    case 'herbicide':
    case 'adjuvant':
      requireText(`${field}.activeIngredient`, material.activeIngredient, 'Active ingredient');
      if (material.lbAiPerGal !== undefined) positive('lbAiPerGal', material.lbAiPerGal, 'Product concentration', 'lb a.i./gal', 12);
      if (material.plantBackDays !== undefined && !(Number.isInteger(material.plantBackDays) && material.plantBackDays >= 0 && material.plantBackDays <= PLANT_BACK_MAX_DAYS)) {
        throw new DomainValidationError(`${field}.plantBackDays`, `Plant-back interval (plantBackDays) must be a whole number of days from 0 to ${PLANT_BACK_MAX_DAYS}, as the label gives it (months × 30).`);
      }
      if (material.epaRegNo !== undefined && !EPA_REG_NO_PATTERN.test(material.epaRegNo)) {
        throw new DomainValidationError(`${field}.epaRegNo`, `EPA Reg. No. (epaRegNo) “${material.epaRegNo}” is not written as on a label: company and product numbers with a hyphen, e.g. 524-475, or 524-475-123 for a distributor's product.`);
      }
      validateSprayPricing(material.pricing, `${field}.pricing`);
      return;
    case 'item':
      requireText(`${field}.itemLabel`, material.itemLabel, 'Item label');
      requireText(`${field}.packLabel`, material.packLabel, 'Pack label');
      positive('packSize', material.packSize, 'Pack size', 'items', 100000);
      requireCents(`${field}.packPriceCents`, material.packPriceCents, 'Pack price');
      return;
    default:
      throw new DomainValidationError(`${field}.type`, 'Material type must be seed, lime, fertilizer, herbicide, adjuvant or item.');
  }
}
