/**
 * Quantities and cost of one prescription: a practice's steps applied to one unit's acres, length
 * or count, with the prescription's parameters overriding the practice defaults. Returns totals
 * with units in their names and lines ready to become proposal lines.
 *
 * Purchases are pooled per material across the steps (two burn-downs share one jug), so packages
 * are rounded up once per material; each step's own results still show what that step uses.
 * Money rule: each line's amount is rounded once, half up, to whole cents (rounding.ts); totals are
 * sums of integer cents. Materials bought by the package (seed, fertilizer, containers, packs) are
 * whole packages × package price; materials bought by measure (lime per ton, product per gallon)
 * bill the quantity rounded to 2 decimals. Labor, equipment and fee lines stay per step, each with
 * its own minimum charge (one visit each).
 */
import { DomainValidationError } from './errors';
import { computeFertilizer, formatGrade, type FertilizerResult } from './fertilizer';
import { computeLime, type LimeRecommendation, type LimeResult } from './lime';
import type {
  ItemBasis,
  MaterialDefinition,
  MaterialType,
  PracticeDefinition,
  PracticeStep,
  PrescriptionParameters,
  StepParameters,
  UnitMeasures,
} from './practice';
import { lineAmountCents, packagesFor, roundHalfUp, roundLineQuantity, sumCents } from './rounding';
import { computeSeedMix, type SeedMixResult } from './seeding';
import { computeServiceLine, type LineCategory, type ServiceLineResult, type ServiceRate, type WorkMeasures } from './service-rates';
import { computeSprayApplication, type SprayApplicationResult, type SprayRate } from './spraying';
import { requireNumber } from './validation';

/** One priced line, shaped like a proposal line. */
export interface PrescriptionLine {
  /** The steps the line serves (several when a material is pooled). */
  stepKeys: string[];
  materialKey: string | null;
  rateKey: string | null;
  description: string;
  quantity: number;
  unit: string;
  unitPriceCents: number;
  amountCents: number;
  category: LineCategory;
  /**
   * How the firm arrived at the price, for staff only (e.g. what the work would cost without the
   * rate's minimum charge). Never copied into a proposal, invoice or anything a landowner reads.
   */
  pricingNote?: string;
}

export interface ItemResult {
  materialKey: string;
  name: string;
  basis: ItemBasis;
  itemsNeeded: number;
  packs: number;
  leftoverItems: number;
  costCents: number;
}

/** What one step needs of one material, in the unit the material is bought by (lb, ton, gal or items). */
export interface MaterialNeed {
  materialKey: string;
  stepKey: string;
  amount: number;
  /** The rate as written for the step, e.g. "2.7 lb/acre broadcast". */
  rateText: string;
}

export type NeededUnit = 'lb' | 'ton' | 'gal' | 'item';

/** What to buy of one material for the whole prescription. */
export interface MaterialPurchase {
  materialKey: string;
  name: string;
  type: MaterialType;
  stepKeys: string[];
  needed: number;
  neededUnit: NeededUnit;
  /** Whole packages (bags, containers, packs) to buy; null when bought by measure (per ton, per gallon). */
  packages: number | null;
  packageSize: number | null;
  leftover: number | null;
  amountCents: number;
}

export interface StepQuantities {
  stepKey: string;
  name: string;
  kind: PracticeStep['kind'];
  skipped: boolean;
  seed: SeedMixResult | null;
  lime: LimeResult | null;
  fertilizer: (FertilizerResult & { materialKey: string; grade: string }) | null;
  spray: SprayApplicationResult | null;
  /** Herbicide product (not adjuvants) sprayed in this step, gallons. */
  herbicideProductGal: number;
  items: ItemResult[];
  needs: MaterialNeed[];
  services: ServiceLineResult[];
  /** This step's labor, equipment and fee lines. */
  serviceLines: PrescriptionLine[];
}

export interface PrescriptionInput {
  unit: UnitMeasures;
  practice: PracticeDefinition;
  materials: readonly MaterialDefinition[];
  rates: readonly ServiceRate[];
  parameters?: PrescriptionParameters;
}

export interface PrescriptionResult {
  practiceKey: string;
  acres: number | null;
  lengthFt: number | null;
  count: number;
  bulkSeedLb: number;
  plsSeedLb: number;
  /** Seed packages to buy. */
  packages: number;
  limeTons: number;
  fertilizerProductLb: number;
  fertilizerBags: number;
  herbicideProductGal: number;
  tankLoads: number;
  laborHours: number;
  equipmentHours: number;
  materialCents: number;
  laborCents: number;
  equipmentCents: number;
  feesCents: number;
  totalCents: number;
  steps: StepQuantities[];
  purchases: MaterialPurchase[];
  /** Material lines (pooled per material) first, then labor, equipment and fee lines in step order. */
  lines: PrescriptionLine[];
}

const fmt = (value: number, decimals = 2): string => roundHalfUp(value, decimals).toLocaleString('en-US', { maximumFractionDigits: decimals });

function requireAcres(unit: UnitMeasures, what: string): number {
  if (unit.acres === undefined || unit.acres === null) {
    throw new DomainValidationError('unit.acres', `${what} is figured per acre, but the unit has no acreage; draw it as an area or enter its acres.`);
  }
  return requireNumber('unit.acres', unit.acres, { label: 'Unit acres', unit: 'acres', min: 0, max: 100000 });
}

function material<T extends MaterialType>(
  materials: readonly MaterialDefinition[],
  key: string,
  types: readonly T[],
  field: string,
): Extract<MaterialDefinition, { type: T }> {
  const found = materials.find((m) => m.key === key);
  if (!found) {
    throw new DomainValidationError(field, `Material "${key}" is not in the practice library; add it or pick another.`);
  }
  if (!(types as readonly string[]).includes(found.type)) {
    throw new DomainValidationError(field, `Material "${found.name}" is ${found.type}, but this step needs ${types.join(' or ')}.`);
  }
  return found as Extract<MaterialDefinition, { type: T }>;
}

function checkParameterKeys(practice: PracticeDefinition, parameters: PrescriptionParameters | undefined): void {
  const keys = new Set(practice.steps.map((s) => s.key));
  for (const stepKey of Object.keys(parameters?.steps ?? {})) {
    if (!keys.has(stepKey)) {
      throw new DomainValidationError(`parameters.steps.${stepKey}`, `Practice "${practice.name}" has no step "${stepKey}" to override.`);
    }
  }
}

function checkOverrideKeys(overrides: Record<string, unknown> | undefined, allowed: readonly string[], field: string, what: string): void {
  for (const key of Object.keys(overrides ?? {})) {
    if (!allowed.includes(key)) {
      throw new DomainValidationError(`${field}.${key}`, `This step has no ${what} "${key}" to override.`);
    }
  }
}

function workMeasures(unit: UnitMeasures): WorkMeasures {
  return { acres: unit.acres, lengthFt: unit.lengthFt ?? unit.perimeterFt, count: unit.count ?? 1 };
}

function itemQuantity(basis: ItemBasis, quantity: number, unit: UnitMeasures, field: string): number {
  if (basis === 'fixed') return quantity;
  if (basis === 'per-each') return quantity * (unit.count ?? 1);
  if (basis === 'per-acre') return quantity * requireAcres(unit, 'This item');
  const lengthFt = unit.lengthFt ?? unit.perimeterFt;
  if (lengthFt === undefined) {
    throw new DomainValidationError('unit.lengthFt', `This item is figured per 100 ft, but the unit has no length or perimeter; draw it or enter the feet (${field}).`);
  }
  requireNumber('unit.lengthFt', lengthFt, { label: 'Length', unit: 'ft', min: 0 });
  return (quantity * lengthFt) / 100;
}

const ITEM_BASIS_TEXT: Record<ItemBasis, string> = { 'per-acre': 'per acre', 'per-100-ft': 'per 100 ft', 'per-each': 'each', fixed: 'in all' };

const PLURAL_UNITS = new Set(['acre', 'hour', 'ton']);
function unitWithCount(quantity: number, unit: string): string {
  return PLURAL_UNITS.has(unit) && quantity !== 1 ? `${unit}s` : unit;
}

function computeStep(step: PracticeStep, input: PrescriptionInput, params: StepParameters, index: number): StepQuantities {
  const { unit, materials } = input;
  const field = `practice.steps[${index}]`;
  const needs: MaterialNeed[] = [];
  const serviceLines: PrescriptionLine[] = [];
  const result: StepQuantities = {
    stepKey: step.key,
    name: step.name,
    kind: step.kind,
    skipped: Boolean(params.skip),
    seed: null,
    lime: null,
    fertilizer: null,
    spray: null,
    herbicideProductGal: 0,
    items: [],
    needs,
    services: [],
    serviceLines,
  };
  if (params.skip) return result;
  const application = step.application;

  if (application?.type === 'seed') {
    const keys = application.components.map((c) => c.materialKey);
    checkOverrideKeys(params.seedRatesLbPerAcre, keys, `parameters.steps.${step.key}.seedRatesLbPerAcre`, 'seed');
    const seedMaterials = application.components.map((c, i) => material(materials, c.materialKey, ['seed'] as const, `${field}.application.components[${i}].materialKey`));
    const seed = computeSeedMix({
      acres: requireAcres(unit, `Seeding "${step.name}"`),
      method: params.seedMethod ?? application.method,
      rateMethod: application.rateMethod ?? application.method,
      broadcastFactor: params.broadcastFactor ?? application.broadcastFactor,
      components: application.components.map((c, i) => {
        const m = seedMaterials[i];
        return {
          species: m.species,
          rateLbPerAcre: params.seedRatesLbPerAcre?.[c.materialKey] ?? c.rateLbPerAcre,
          rateBasis: c.rateBasis,
          seedLot: { purityPct: m.purityPct, germinationPct: m.germinationPct, dormantPct: m.dormantPct },
          packageSizeLb: m.packageSizeLb,
          packagePriceCents: m.packagePriceCents,
        };
      }),
    });
    result.seed = seed;
    seed.components.forEach((c, i) => {
      const rateText = c.rateBasis === 'pls' ? `${fmt(c.rateLbPerAcre)} lb PLS/acre` : `${fmt(c.rateLbPerAcre)} lb/acre`;
      needs.push({ materialKey: seedMaterials[i].key, stepKey: step.key, amount: c.bulkSeedLb, rateText: `${rateText} ${seed.method}` });
    });
  }

  if (application?.type === 'lime') {
    const m = material(materials, params.materialKey ?? application.materialKey, ['lime'] as const, `${field}.application.materialKey`);
    let recommendation: LimeRecommendation;
    const enm = params.limeTonsPerAcre === undefined ? (params.limeEnmLbPerAcre ?? application.enmLbPerAcre) : undefined;
    if (enm !== undefined) {
      if (m.enmLbPerTon === undefined) {
        throw new DomainValidationError(`${field}.application.materialKey`, `An ENM recommendation needs the ENM guarantee per ton of "${m.name}"; add it to the material.`);
      }
      recommendation = { enmLbPerAcre: enm, productEnmLbPerTon: m.enmLbPerTon };
    } else {
      const tonsPerAcre = params.limeTonsPerAcre ?? application.tonsPerAcre;
      if (tonsPerAcre === undefined) {
        throw new DomainValidationError(`parameters.steps.${step.key}.limeTonsPerAcre`, `Enter the lime recommendation from the soil test (tons per acre or lb ENM per acre).`);
      }
      recommendation = { tonsPerAcre };
    }
    const lime = computeLime({ acres: requireAcres(unit, `Liming "${step.name}"`), recommendation, pricing: m.pricing });
    result.lime = lime;
    needs.push({ materialKey: m.key, stepKey: step.key, amount: m.pricing.basis === 'per-ton' ? lime.limeTons : lime.limeLb, rateText: `${fmt(lime.tonsPerAcre)} t/acre` });
  }

  if (application?.type === 'fertilizer') {
    const materialKey = params.materialKey ?? application.materialKey;
    const m = material(materials, materialKey, ['fertilizer'] as const, `${field}.application.materialKey`);
    const fertilizer = computeFertilizer({
      acres: requireAcres(unit, `Fertilizing "${step.name}"`),
      need: {
        nLbPerAcre: params.nLbPerAcre ?? application.nLbPerAcre,
        p2o5LbPerAcre: params.p2o5LbPerAcre ?? application.p2o5LbPerAcre,
        k2oLbPerAcre: params.k2oLbPerAcre ?? application.k2oLbPerAcre,
      },
      grade: m.grade,
      bagSizeLb: m.bagSizeLb,
      bagPriceCents: m.bagPriceCents,
    });
    result.fertilizer = { ...fertilizer, materialKey, grade: formatGrade(m.grade) };
    needs.push({ materialKey: m.key, stepKey: step.key, amount: fertilizer.fertilizerProductLb, rateText: `${fmt(fertilizer.productLbPerAcre, 0)} lb/acre` });
  }

  if (application?.type === 'spray') {
    const keys = application.products.map((p) => p.materialKey);
    checkOverrideKeys(params.sprayRates, keys, `parameters.steps.${step.key}.sprayRates`, 'spray product');
    const sprayMaterials = application.products.map((p, i) => material(materials, p.materialKey, ['herbicide', 'adjuvant'] as const, `${field}.application.products[${i}].materialKey`));
    const spray = computeSprayApplication({
      acres: requireAcres(unit, `Spraying "${step.name}"`),
      treatedFraction: params.treatedFraction ?? application.treatedFraction,
      gpa: params.gpa ?? application.gpa,
      tankGal: params.tankGal ?? application.tankGal,
      products: application.products.map((p, i) => ({
        name: sprayMaterials[i].name,
        rate: (params.sprayRates?.[p.materialKey] ?? p.rate) as SprayRate,
        lbAiPerGal: sprayMaterials[i].lbAiPerGal,
        pricing: sprayMaterials[i].pricing,
      })),
    });
    result.spray = spray;
    result.herbicideProductGal = spray.products.reduce((sum, p, i) => (sprayMaterials[i].type === 'herbicide' ? sum + p.productGal : sum), 0);
    spray.products.forEach((p, i) => {
      const on = spray.treatedAcres === unit.acres ? '' : ` on ${fmt(spray.treatedAcres)} acres treated`;
      needs.push({ materialKey: sprayMaterials[i].key, stepKey: step.key, amount: p.productGal, rateText: `${fmt(p.productGalPerAcre, 3)} gal/acre${on}` });
    });
  }

  if (application?.type === 'items') {
    const keys = application.items.map((i) => i.materialKey);
    checkOverrideKeys(params.itemQuantities, keys, `parameters.steps.${step.key}.itemQuantities`, 'item');
    application.items.forEach((item, i) => {
      const itemField = `${field}.application.items[${i}]`;
      const m = material(materials, item.materialKey, ['item'] as const, `${itemField}.materialKey`);
      const quantity = requireNumber(`${itemField}.quantity`, params.itemQuantities?.[item.materialKey] ?? item.quantity, { label: `Quantity of ${m.name}`, min: 0, max: 1_000_000 });
      requireNumber(`${itemField}.packSize`, m.packSize, { label: `Pack size of ${m.name}`, min: 0, minExclusive: true });
      const itemsNeeded = itemQuantity(item.basis, quantity, unit, itemField);
      const { packages, leftover } = packagesFor(itemsNeeded, m.packSize);
      const itemResult: ItemResult = { materialKey: m.key, name: m.name, basis: item.basis, itemsNeeded, packs: packages, leftoverItems: leftover, costCents: packages * m.packPriceCents };
      result.items.push(itemResult);
      needs.push({ materialKey: m.key, stepKey: step.key, amount: itemsNeeded, rateText: `${fmt(quantity)} ${ITEM_BASIS_TEXT[item.basis]}` });
    });
  }

  const serviceKeys = (step.services ?? []).map((s) => s.rateKey);
  checkOverrideKeys(params.productivity, serviceKeys, `parameters.steps.${step.key}.productivity`, 'rate');
  (step.services ?? []).forEach((service, i) => {
    const rate = input.rates.find((r) => r.key === service.rateKey);
    if (!rate) {
      throw new DomainValidationError(`${field}.services[${i}].rateKey`, `Rate "${service.rateKey}" is not in the practice library; add it or pick another.`);
    }
    const line = computeServiceLine(
      { rate, measures: workMeasures(unit), productivity: params.productivity?.[service.rateKey] ?? service.productivity, quantity: service.quantity },
      `${field}.services[${i}]`,
    );
    result.services.push(line);
    const base = { stepKeys: [step.key], materialKey: null, rateKey: line.rateKey, category: line.category };
    // Named by the step it serves, so a spreader used for seed and for fertilizer reads as two jobs, not one line twice.
    const named = serviceLineName(line.name, step.name);
    serviceLines.push(
      line.minimumApplied
        ? {
            ...base,
            description: `${named} (minimum charge)`,
            quantity: 1,
            unit: 'minimum',
            unitPriceCents: line.amountCents,
            amountCents: line.amountCents,
            pricingNote: `${fmt(line.quantity)} ${unitWithCount(line.quantity, line.unit)} would be ${formatCentsPlain(line.calculatedCents)}; the rate's minimum charge applies.`,
          }
        : { ...base, description: named, quantity: line.quantity, unit: line.unit, unitPriceCents: line.unitPriceCents, amountCents: line.amountCents },
    );
  });
  return result;
}

/** "Broadcast spreader — Fertilize at planting": a labor, equipment or fee line named with the step it serves. */
export function serviceLineName(rateName: string, stepName: string): string {
  return `${rateName} — ${stepName}`;
}

function formatCentsPlain(cents: number): string {
  return `$${(cents / 100).toFixed(2)}`;
}

/** Validate a unit's measures; throws DomainValidationError for negative or absurd sizes. */
export function validateUnitMeasures(unit: UnitMeasures): void {
  if (unit.acres !== undefined) requireNumber('unit.acres', unit.acres, { label: 'Unit acres', unit: 'acres', min: 0, max: 100000 });
  if (unit.lengthFt !== undefined) requireNumber('unit.lengthFt', unit.lengthFt, { label: 'Unit length', unit: 'ft', min: 0, max: 10_000_000 });
  if (unit.perimeterFt !== undefined) requireNumber('unit.perimeterFt', unit.perimeterFt, { label: 'Unit perimeter', unit: 'ft', min: 0, max: 10_000_000 });
  if (unit.count !== undefined) requireNumber('unit.count', unit.count, { label: 'Count', min: 0, max: 100000, integer: true });
}

const NEEDED_UNITS: Record<MaterialType, NeededUnit> = { seed: 'lb', fertilizer: 'lb', lime: 'ton', herbicide: 'gal', adjuvant: 'gal', item: 'item' };

/** Pool each material's needs across steps and work out what to buy: whole packages, or the measure rounded to 2 decimals. */
export function poolPurchases(needs: readonly MaterialNeed[], materials: readonly MaterialDefinition[]): { purchases: MaterialPurchase[]; lines: PrescriptionLine[] } {
  const order: string[] = [];
  const byKey = new Map<string, MaterialNeed[]>();
  for (const need of needs) {
    if (!byKey.has(need.materialKey)) {
      byKey.set(need.materialKey, []);
      order.push(need.materialKey);
    }
    (byKey.get(need.materialKey) as MaterialNeed[]).push(need);
  }
  const purchases: MaterialPurchase[] = [];
  const lines: PrescriptionLine[] = [];
  for (const key of order) {
    const group = byKey.get(key) as MaterialNeed[];
    const m = materials.find((x) => x.key === key) as MaterialDefinition;
    const needed = group.reduce((sum, n) => sum + n.amount, 0);
    const stepKeys = [...new Set(group.map((n) => n.stepKey))];
    let neededUnit = NEEDED_UNITS[m.type];
    let packageSize: number | null = null;
    let packagePriceCents = 0;
    let unit = '';
    let measurePriceCents: number | null = null;
    if (m.type === 'seed') {
      [packageSize, packagePriceCents, unit] = [m.packageSizeLb, m.packagePriceCents, `${fmt(m.packageSizeLb)}-lb bag`];
    } else if (m.type === 'fertilizer') {
      [packageSize, packagePriceCents, unit] = [m.bagSizeLb, m.bagPriceCents, `${fmt(m.bagSizeLb)}-lb bag`];
    } else if (m.type === 'lime') {
      if (m.pricing.basis === 'per-ton') {
        [measurePriceCents, unit] = [m.pricing.pricePerTonCents, 'ton'];
      } else {
        neededUnit = 'lb';
        [packageSize, packagePriceCents, unit] = [m.pricing.bagSizeLb, m.pricing.bagPriceCents, `${fmt(m.pricing.bagSizeLb)}-lb bag`];
      }
    } else if (m.type === 'herbicide' || m.type === 'adjuvant') {
      if (m.pricing.basis === 'per-gal') {
        [measurePriceCents, unit] = [m.pricing.pricePerGalCents, 'gal'];
      } else {
        [packageSize, packagePriceCents, unit] = [m.pricing.containerSizeGal, m.pricing.containerPriceCents, `${fmt(m.pricing.containerSizeGal)}-gal container`];
      }
    } else if (m.type === 'item') {
      [packageSize, packagePriceCents, unit] = [m.packSize, m.packPriceCents, m.packLabel];
    }
    const rateText = group.length === 1 ? `${group[0].rateText}, ` : '';
    const neededLabel = m.type === 'item' ? `${m.itemLabel}${needed === 1 ? '' : 's'}` : unitWithCount(needed, neededUnit);
    const neededText = `${rateText}${fmt(needed, neededUnit === 'gal' ? 3 : 2)} ${neededLabel} needed${group.length > 1 ? ` for ${group.length} steps` : ''}`;
    const description = `${m.name} (${neededText})`;
    if (measurePriceCents !== null) {
      const quantity = roundLineQuantity(needed);
      const amountCents = lineAmountCents(quantity, measurePriceCents);
      purchases.push({ materialKey: key, name: m.name, type: m.type, stepKeys, needed, neededUnit, packages: null, packageSize: null, leftover: null, amountCents });
      lines.push({ stepKeys, materialKey: key, rateKey: null, description, quantity, unit, unitPriceCents: measurePriceCents, amountCents, category: 'materials' });
    } else {
      const { packages, leftover } = packagesFor(needed, packageSize as number);
      const amountCents = packages * packagePriceCents;
      purchases.push({ materialKey: key, name: m.name, type: m.type, stepKeys, needed, neededUnit, packages, packageSize, leftover, amountCents });
      lines.push({ stepKeys, materialKey: key, rateKey: null, description, quantity: packages, unit, unitPriceCents: packagePriceCents, amountCents, category: 'materials' });
    }
  }
  return { purchases, lines };
}

/** Quantities, hours and cost in cents of a practice applied to one unit, with proposal-ready lines. */
export function computePrescription(input: PrescriptionInput): PrescriptionResult {
  const { practice, unit } = input;
  validateUnitMeasures(unit);
  checkParameterKeys(practice, input.parameters);
  const steps = practice.steps.map((step, index) => {
    try {
      return computeStep(step, input, input.parameters?.steps?.[step.key] ?? {}, index);
    } catch (error) {
      // Put the step's name in front of errors raised deep in a computation, so a person knows where to look.
      if (error instanceof DomainValidationError && !/^(unit|parameters|practice)\./.test(error.field)) {
        throw new DomainValidationError(`practice.steps[${index}].${error.field}`, `Step "${step.name}": ${error.message}`);
      }
      throw error;
    }
  });
  const active = steps.filter((s) => !s.skipped);
  const { purchases, lines: materialLines } = poolPurchases(active.flatMap((s) => s.needs), input.materials);
  const lines = [...materialLines, ...active.flatMap((s) => s.serviceLines)];
  const services = active.flatMap((s) => s.services);
  const hoursOf = (category: 'labor' | 'equipment') => services.filter((s) => s.category === category).reduce((sum, s) => sum + (s.hours ?? 0), 0);
  const centsOf = (category: LineCategory) => sumCents(lines.filter((l) => l.category === category).map((l) => l.amountCents));
  const packagesOf = (type: MaterialType) => purchases.filter((p) => p.type === type).reduce((sum, p) => sum + (p.packages ?? 0), 0);
  const materialCents = centsOf('materials');
  const laborCents = centsOf('labor');
  const equipmentCents = centsOf('equipment');
  const feesCents = centsOf('fees');
  return {
    practiceKey: practice.key,
    acres: unit.acres ?? null,
    lengthFt: unit.lengthFt ?? null,
    count: unit.count ?? 1,
    bulkSeedLb: active.reduce((sum, s) => sum + (s.seed?.bulkSeedLb ?? 0), 0),
    plsSeedLb: active.reduce((sum, s) => sum + (s.seed?.components.reduce((inner, c) => inner + (c.plsSeedLb ?? 0), 0) ?? 0), 0),
    packages: packagesOf('seed'),
    limeTons: active.reduce((sum, s) => sum + (s.lime?.limeTons ?? 0), 0),
    fertilizerProductLb: active.reduce((sum, s) => sum + (s.fertilizer?.fertilizerProductLb ?? 0), 0),
    fertilizerBags: packagesOf('fertilizer'),
    herbicideProductGal: active.reduce((sum, s) => sum + s.herbicideProductGal, 0),
    tankLoads: active.reduce((sum, s) => sum + (s.spray?.tank?.tankLoads ?? 0), 0),
    laborHours: hoursOf('labor'),
    equipmentHours: hoursOf('equipment'),
    materialCents,
    laborCents,
    equipmentCents,
    feesCents,
    totalCents: materialCents + laborCents + equipmentCents + feesCents,
    steps,
    purchases,
    lines,
  };
}
