import { describe, expect, it } from 'vitest';
import type { MaterialDefinition, PracticeDefinition } from '../../../shared/domain/practice';
import { computePrescription, type PrescriptionResult } from '../../../shared/domain/prescription-quantities';
import { lineAmountCents } from '../../../shared/domain/rounding';
import type { ServiceRate } from '../../../shared/domain/service-rates';
import { STARTER_MATERIALS, STARTER_RATES, starterPractice } from '../../../shared/domain/starter-library';
import { validationErrorOf } from './support';

const starter = (key: string, unit: Parameters<typeof computePrescription>[0]['unit'], parameters?: Parameters<typeof computePrescription>[0]['parameters']) =>
  computePrescription({ unit, practice: starterPractice(key), materials: STARTER_MATERIALS, rates: STARTER_RATES, parameters });

function expectConsistentMoney(result: PrescriptionResult): void {
  for (const line of result.lines) {
    expect(Number.isInteger(line.amountCents)).toBe(true);
    if (line.unit !== 'minimum') expect(line.amountCents).toBe(lineAmountCents(line.quantity, line.unitPriceCents));
  }
  const sum = result.lines.reduce((total, line) => total + line.amountCents, 0);
  expect(result.totalCents).toBe(sum);
  expect(result.materialCents + result.laborCents + result.equipmentCents + result.feesCents).toBe(result.totalCents);
}

describe('computePrescription on the starter fall brassica plot', () => {
  const result = starter('fall-brassica-plot', { acres: 2.4 });

  it('totals seed, lime, fertilizer and herbicide over the acres', () => {
    expect(result.bulkSeedLb).toBeCloseTo((2.7 + 1.65 + 4) * 2.4, 9); // starter rates (pure-stand shares of Cook & Gray / UF/IFAS ranges) × 2.4 acres
    expect(result.packages).toBe(3); // 6.48, 3.96 and 9.6 lb each fit one 10-lb bag
    expect(result.limeTons).toBeCloseTo(4.8, 9); // default 2 t/acre × 2.4
    // 40 lb N from 13-13-13 and 40 lb N from 46-0-0 (standard formula): (307.69 + 86.96) lb/acre × 2.4
    expect(result.fertilizerProductLb).toBeCloseTo((40 / 0.13 + 40 / 0.46) * 2.4, 6);
    expect(result.fertilizerBags).toBe(15 + 5);
    expect(result.herbicideProductGal).toBeCloseTo(1.2, 9); // 2 qt/acre × 2.4 acres
    expect(result.tankLoads).toBe(2); // 25-gal tank at 15 GPA covers 1.67 acres: 2.4 acres need 2 loads
    expect(result.laborHours).toBeCloseTo(1.2 + 1.8 + 0.72, 9); // spray, disc and seeding productivities × 2.4 acres
  });

  it('keeps money in integer cents with each line rounded once', () => {
    expectConsistentMoney(result);
    expect(result.lines.every((l) => ['materials', 'labor', 'equipment', 'fees'].includes(l.category))).toBe(true);
  });

  it('gives proposal-ready lines with units', () => {
    const lime = result.lines.find((l) => l.materialKey === 'lime-ag-spread');
    expect(lime).toMatchObject({ quantity: 4.8, unit: 'ton', unitPriceCents: 4800, amountCents: 23040, category: 'materials' });
    const rape = result.lines.find((l) => l.materialKey === 'seed-rape');
    expect(rape).toMatchObject({ quantity: 1, unit: '10-lb bag', amountCents: 3000 });
    expect(rape?.description).toMatch(/Dwarf Essex rape seed \(4 lb\/acre broadcast, 9\.6 lb needed\)/);
    const minimum = result.lines.find((l) => l.unit === 'minimum');
    expect(minimum?.description).toMatch(/minimum charge/);
  });
});

describe('prescription parameters', () => {
  it('takes the lime rate from the soil test, as tons or as ENM (University of Missouri)', () => {
    expect(starter('fall-brassica-plot', { acres: 2.4 }, { steps: { lime: { limeTonsPerAcre: 3 } } }).limeTons).toBeCloseTo(7.2, 9);
    // 1,600 lb ENM ÷ 400 lb ENM/ton = 4 t/acre (University of Missouri) × 2.4 acres
    expect(starter('fall-brassica-plot', { acres: 2.4 }, { steps: { lime: { limeEnmLbPerAcre: 1600 } } }).limeTons).toBeCloseTo(9.6, 9);
  });

  it('overrides seeding rates, fertilizer need and material, and skips steps', () => {
    const result = starter('fall-brassica-plot', { acres: 1 }, {
      steps: {
        seed: { seedRatesLbPerAcre: { 'seed-rape': 10 } }, // Cook & Gray (2003): rape 10–12 lb/acre pure stand
        fertilize: { materialKey: 'fert-19-19-19', nLbPerAcre: 38, p2o5LbPerAcre: 0, k2oLbPerAcre: 0 },
        'burn-down': { skip: true },
        topdress: { skip: true },
      },
    });
    expect(result.bulkSeedLb).toBeCloseTo(2.7 + 1.65 + 10, 9);
    expect(result.fertilizerProductLb).toBeCloseTo(200, 9); // 38 lb N ÷ 0.19 = 200 lb (standard formula)
    expect(result.herbicideProductGal).toBe(0);
    expect(result.tankLoads).toBe(0);
    expect(result.lines.some((l) => l.stepKeys.includes('burn-down'))).toBe(false);
  });

  it('switches a broadcast rate to drilling with the UGA factor', () => {
    const drilled = starter('cereal-grain-plot', { acres: 1 }, { steps: { seed: { seedMethod: 'drilled', broadcastFactor: 1.25 } } });
    expect(drilled.bulkSeedLb).toBeCloseTo((50 + 33 + 4.6) / 1.25, 9); // UGA Extension: broadcasting takes ~25 % more than drilling
  });

  it('names the field of a bad override or missing measure', () => {
    expect(validationErrorOf(() => starter('fall-brassica-plot', { acres: 1 }, { steps: { nosuch: { skip: true } } })).field).toBe('parameters.steps.nosuch');
    expect(validationErrorOf(() => starter('fall-brassica-plot', { acres: 1 }, { steps: { seed: { seedRatesLbPerAcre: { 'seed-oats': 90 } } } })).field).toBe('parameters.steps.seed.seedRatesLbPerAcre.seed-oats');
    expect(validationErrorOf(() => starter('fall-brassica-plot', { lengthFt: 500 })).field).toBe('unit.acres');
    expect(validationErrorOf(() => starter('fall-brassica-plot', { acres: -2 })).field).toBe('unit.acres');
    const deep = validationErrorOf(() => starter('fall-brassica-plot', { acres: 1 }, { steps: { seed: { seedRatesLbPerAcre: { 'seed-rape': 900 } } } }));
    expect(deep.field).toBe('practice.steps[5].components[2].rateLbPerAcre');
    expect(deep.message).toMatch(/^Step "Broadcast brassica seed": Seeding rate of rape/);
    expect(validationErrorOf(() => starter('sanctuary-posting', { acres: 10 })).field).toBe('unit.lengthFt');
  });
});

describe('pooling purchases across steps', () => {
  it('buys one jug for two burn-downs that fit in it', () => {
    const result = starter('native-grass-planting', { acres: 2.4 });
    const glyphosate = result.purchases.find((p) => p.materialKey === 'herb-glyphosate-41');
    expect(glyphosate).toMatchObject({ stepKeys: ['fall-spray', 'burn-down'], packages: 1, packageSize: 2.5 });
    expect(glyphosate?.needed).toBeCloseTo(2.4, 9); // 2 × (0.5 gal/acre × 2.4 acres)
    expect(glyphosate?.leftover).toBeCloseTo(0.1, 9);
    expect(result.lines.filter((l) => l.materialKey === 'herb-glyphosate-41')).toHaveLength(1);
    expectConsistentMoney(result);
  });
});

describe('words a landowner reads on the lines', () => {
  it('names each labor and equipment line by its step, so no two lines of a prescription read the same', () => {
    const result = starter('fall-brassica-plot', { acres: 3.3 });
    const services = result.lines.filter((l) => l.rateKey !== null);
    const spreader = services.filter((l) => l.rateKey === services.find((s) => /spreader/i.test(s.description))?.rateKey);
    expect(spreader.length).toBeGreaterThan(1); // the starter plot spreads seed and fertilizer (invented demo practice)
    expect(new Set(spreader.map((l) => l.description)).size).toBe(spreader.length);
    expect(spreader.every((l) => /^Broadcast spreader — \S/.test(l.description))).toBe(true);
    const descriptions = result.lines.map((l) => l.description);
    expect(new Set(descriptions).size).toBe(descriptions.length);
  });

  it('keeps the pricing working of a minimum charge in a staff note, out of the description', () => {
    const result = starter('access-route-clearing', { lengthFt: 1250 });
    const minimum = result.lines.find((l) => l.rateKey === 'rate-brush-mower')!;
    expect(minimum.description).toMatch(/\(minimum charge\)$/);
    expect(minimum.description).not.toMatch(/would be|\$/);
    // 12.5 × $22.00 = $275.00 (invented demo rate), under the $350.00 minimum
    expect(minimum.pricingNote).toBe("12.5 100 ft would be $275.00; the rate's minimum charge applies.");
    expect(result.lines.filter((l) => l.unit !== 'minimum').every((l) => l.pricingNote === undefined)).toBe(true);
  });
});

describe('line and point units', () => {
  it('prices an access route by its length with minimum charges', () => {
    const result = starter('access-route-clearing', { lengthFt: 1250 });
    expect(result.lengthFt).toBe(1250);
    expect(result.lines.find((l) => l.rateKey === 'rate-trail-crew')).toMatchObject({ quantity: 12.5, unit: '100 ft', amountCents: 37500 });
    // 12.5 × $22.00 = $275.00 is under the $350.00 minimum (invented demo rate)
    expect(result.lines.find((l) => l.rateKey === 'rate-brush-mower')).toMatchObject({ quantity: 1, unit: 'minimum', amountCents: 35000 });
    expect(result.lines.find((l) => l.materialKey === 'item-straw-bale')).toMatchObject({ quantity: 4, unit: 'bale' }); // 0.25 per 100 ft × 12.5 = 3.13 → 4 bales
    expect(result.laborHours).toBeCloseTo(1250 / 100 * (0.05 + 0.6), 9);
    expectConsistentMoney(result);
  });

  it('posts a sanctuary along its perimeter', () => {
    const result = starter('sanctuary-posting', { acres: 12, perimeterFt: 3000 });
    expect(result.lines.find((l) => l.materialKey === 'item-no-entry-sign')).toMatchObject({ quantity: 2, unit: 'pack of 10' }); // 15 signs → 2 packs
    expect(result.lines.find((l) => l.rateKey === 'rate-posting-labor')).toMatchObject({ quantity: 30, amountCents: 27000 });
  });

  it('multiplies per-each work by the count of points', () => {
    const one = starter('mock-scrape', { count: 1 });
    const four = starter('mock-scrape', { count: 4 });
    expect(four.laborHours).toBeCloseTo(4 * one.laborHours, 9);
    expect(four.lines.find((l) => l.materialKey === 'item-licking-branch-rope')?.quantity).toBe(4);
  });
});

describe('a sprayed practice checked against the University of Missouri example', () => {
  const materials: MaterialDefinition[] = [
    { key: 'h', type: 'herbicide', name: 'Herbicide, 4 lb a.i./gal', activeIngredient: 'generic, 4 lb a.i./gal', lbAiPerGal: 4, restrictedUse: false, pricing: { basis: 'per-gal', pricePerGalCents: 3000 } },
  ];
  const rates: ServiceRate[] = [{ key: 'sprayer', name: 'Field sprayer', category: 'equipment', basis: 'per-acre', unitPriceCents: 800, minimumCents: 20000 }];
  const practice: PracticeDefinition = {
    key: 'test-spray',
    name: 'Test spray',
    description: 'test',
    unitKinds: ['food-plot'],
    measure: 'acres',
    windowKey: 'summer-work',
    anchorStepKey: 'spray',
    summary: { action: 'Spray', subject: 'weeds', purpose: 'test' },
    steps: [
      {
        key: 'spray',
        kind: 'spray',
        name: 'Spray',
        application: { type: 'spray', gpa: 20, tankGal: 500, products: [{ materialKey: 'h', rate: { kind: 'active', lbAiPerAcre: 1.5 } }] },
        services: [{ rateKey: 'sprayer' }],
      },
    ],
  };

  it('needs 9.375 gal per 25-acre tank and rounds tank loads up', () => {
    const result = computePrescription({ unit: { acres: 60 }, practice, materials, rates });
    expect(result.tankLoads).toBe(3); // 60 acres ÷ 25 acres per 500-gal tank at 20 GPA (Univ. of Missouri tank) → 3 loads
    expect(result.herbicideProductGal).toBeCloseTo(22.5, 9); // 0.375 gal/acre (Univ. of Missouri) × 60 acres
    expect(result.steps[0].spray?.tank?.productGalPerFullTank[0]).toBeCloseTo(9.375, 9); // Univ. of Missouri: 9.375 gal per tank
    expect(result.materialCents).toBe(67500); // 22.5 gal × $30.00
    expect(result.equipmentCents).toBe(48000); // 60 acres × $8.00, above the minimum
    expect(computePrescription({ unit: { acres: 5 }, practice, materials, rates }).equipmentCents).toBe(20000); // 5 × $8 = $40 < $200 minimum
  });
});
