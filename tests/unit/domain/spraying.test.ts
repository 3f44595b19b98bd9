import { describe, expect, it } from 'vitest';
import {
  acresPerTank,
  computeSprayApplication,
  gallonsPerAcre,
  ouncesEqualGallonsCourseFt,
  planTankLoads,
  productGalPerAcre,
  sprayProductCost,
  toGallons,
} from '../../../shared/domain/spraying';
import { validationErrorOf } from './support';

describe('sprayer calibration', () => {
  it('computes GPA = 5,940 × GPM ÷ (mph × spacing) (Albany County Weed & Pest)', () => {
    expect(gallonsPerAcre({ gpm: 3.75, mph: 5, nozzleSpacingIn: 222 })).toBeCloseTo(20.07, 2); // Albany County Weed & Pest, Wyoming: 20.07 GPA
  });

  it('gives the "ounces equal gallons" course length (LSU AgCenter)', () => {
    expect(ouncesEqualGallonsCourseFt(20)).toBeCloseTo(204, 9); // LSU AgCenter: 204 ft at 20-in spacing
    expect(ouncesEqualGallonsCourseFt(30)).toBeCloseTo(136, 9); // LSU AgCenter: 136 ft at 30-in spacing
  });

  it('rejects zero speed, output or spacing', () => {
    expect(validationErrorOf(() => gallonsPerAcre({ gpm: 3.75, mph: 0, nozzleSpacingIn: 20 })).field).toBe('mph');
    expect(validationErrorOf(() => gallonsPerAcre({ gpm: 0, mph: 5, nozzleSpacingIn: 20 })).field).toBe('gpm');
    expect(validationErrorOf(() => ouncesEqualGallonsCourseFt(0)).field).toBe('nozzleSpacingIn');
  });
});

describe('product per acre', () => {
  it('turns lb a.i. per acre into product volume (Univ. of Missouri)', () => {
    const gal = productGalPerAcre({ kind: 'active', lbAiPerAcre: 1.5, lbAiPerGal: 4 });
    expect(gal).toBe(0.375); // Univ. of Missouri (Casady): 1.5 lb a.i. from a 4 lb/gal product = 0.375 gal/acre
    expect(gal * 8).toBe(3); // = 3 pt/acre (same source)
  });

  it('reads product rates in gal, qt, pt and fl oz, and percent solutions', () => {
    expect(toGallons(2, 'qt')).toBe(0.5); // 4 qt per gal (US liquid measure)
    expect(toGallons(3, 'pt')).toBe(0.375); // 8 pt per gal
    expect(productGalPerAcre({ kind: 'product', amountPerAcre: 6, unit: 'fl-oz' })).toBeCloseTo(0.046875, 12); // 128 fl oz per gal
    expect(productGalPerAcre({ kind: 'solution', pctOfSpray: 2 }, { gpa: 30 })).toBeCloseTo(0.6, 12); // 2 % of 30 gal (worked example)
  });

  it('asks for the concentration or the spray volume when a rate needs it', () => {
    expect(validationErrorOf(() => productGalPerAcre({ kind: 'active', lbAiPerAcre: 1 })).field).toBe('rate.lbAiPerGal');
    expect(validationErrorOf(() => productGalPerAcre({ kind: 'solution', pctOfSpray: 2 })).message).toMatch(/gallons per acre/);
    expect(validationErrorOf(() => productGalPerAcre({ kind: 'product', amountPerAcre: 0, unit: 'qt' })).field).toBe('rate.amountPerAcre');
  });
});

describe('tank loads', () => {
  it('covers tank ÷ GPA acres per tank and carries product per tank (Univ. of Missouri)', () => {
    expect(acresPerTank(500, 20)).toBe(25); // Univ. of Missouri: 500-gal tank at 20 GPA covers 25 acres
    const plan = planTankLoads({ acres: 25, tankGal: 500, gpa: 20, productGalPerAcre: [0.375] });
    expect(plan.productGalPerFullTank[0]).toBeCloseTo(9.375, 12); // Univ. of Missouri: 9.375 gal of product per tank
    expect(plan.tankLoads).toBe(1);
  });

  it('rounds tank loads up and sizes the last partial load', () => {
    // 60 acres at 25 acres per tank: 2 full loads + 10 acres → 3 loads, last fill 200 gal with 3.75 gal product (worked example)
    const plan = planTankLoads({ acres: 60, tankGal: 500, gpa: 20, productGalPerAcre: [0.375] });
    expect(plan.tankLoads).toBe(3);
    expect(plan.fullLoads).toBe(2);
    expect(plan.lastLoadAcres).toBeCloseTo(10, 9);
    expect(plan.lastLoadFillGal).toBeCloseTo(200, 9);
    expect(plan.lastLoadProductGal[0]).toBeCloseTo(3.75, 9);
    expect(plan.sprayGal).toBe(1200);
  });

  it('counts an exact multiple as full loads only', () => {
    const plan = planTankLoads({ acres: 50, tankGal: 500, gpa: 20, productGalPerAcre: [0.375] });
    expect(plan.tankLoads).toBe(2);
    expect(plan.fullLoads).toBe(2);
    expect(plan.lastLoadAcres).toBeCloseTo(25, 9);
  });

  it('rejects a zero tank or spray volume', () => {
    expect(validationErrorOf(() => acresPerTank(0, 20)).field).toBe('tankGal');
    expect(validationErrorOf(() => acresPerTank(500, 0)).field).toBe('gpa');
    expect(validationErrorOf(() => acresPerTank(500, 0)).message).toMatch(/Spray volume must be greater than 0/);
  });
});

describe('a spray application', () => {
  it('totals product over the treated acres with tank loads and cost (Univ. of Missouri rate)', () => {
    const result = computeSprayApplication({
      acres: 60,
      gpa: 20,
      tankGal: 500,
      products: [{ name: 'herbicide A', rate: { kind: 'active', lbAiPerAcre: 1.5 }, lbAiPerGal: 4, pricing: { basis: 'container', containerSizeGal: 2.5, containerPriceCents: 9000 } }],
    });
    // 0.375 gal/acre (Univ. of Missouri) × 60 acres = 22.5 gal = 2,880 fl oz → 9 containers of 2.5 gal, none left
    expect(result.tank?.tankLoads).toBe(3);
    expect(result.products[0].productGal).toBeCloseTo(22.5, 9);
    expect(result.products[0].productFlOz).toBeCloseTo(2880, 6);
    expect(result.products[0].containers).toBe(9);
    expect(result.products[0].leftoverGal).toBeCloseTo(0, 9);
    expect(result.costCents).toBe(81000);
  });

  it('sprays only the treated share for spot treatment', () => {
    const result = computeSprayApplication({
      acres: 2.4,
      treatedFraction: 0.35,
      gpa: 30,
      tankGal: 25,
      products: [{ name: 'triclopyr', rate: { kind: 'solution', pctOfSpray: 2 }, pricing: { basis: 'per-gal', pricePerGalCents: 5400 } }],
    });
    expect(result.treatedAcres).toBeCloseTo(0.84, 12);
    expect(result.tank?.tankLoads).toBe(2); // 0.84 acre × 30 GPA = 25.2 gal > one 25-gal tank (worked example)
    expect(result.products[0].productGal).toBeCloseTo(0.504, 12); // 0.6 gal/acre × 0.84 acre
    expect(result.products[0].costCents).toBe(2700); // 0.50 gal billed × $54.00 (2-decimal quantity, half up)
  });

  it('skips tank loads for undiluted direct application', () => {
    const result = computeSprayApplication({ acres: 2, products: [{ name: 'triclopyr', rate: { kind: 'product', amountPerAcre: 1, unit: 'qt' }, pricing: { basis: 'per-gal', pricePerGalCents: 5400 } }] });
    expect(result.tank).toBeNull();
    expect(result.productGal).toBe(0.5);
  });

  it('prices by the gallon or by whole containers', () => {
    expect(sprayProductCost(0.113, { basis: 'per-gal', pricePerGalCents: 22000 }).costCents).toBe(2420); // 0.11 gal × $220 (2-decimal quantity)
    expect(sprayProductCost(1.2, { basis: 'container', containerSizeGal: 2.5, containerPriceCents: 4800 })).toEqual({ containers: 1, leftoverGal: 1.3, costCents: 4800 });
  });

  it('rejects a percent solution without spray volume and a tank without GPA', () => {
    const pricing = { basis: 'per-gal' as const, pricePerGalCents: 100 };
    expect(validationErrorOf(() => computeSprayApplication({ acres: 1, products: [{ name: 'x', rate: { kind: 'solution', pctOfSpray: 2 }, pricing }] })).field).toBe('gpa');
    expect(validationErrorOf(() => computeSprayApplication({ acres: 1, tankGal: 25, products: [{ name: 'x', rate: { kind: 'product', amountPerAcre: 1, unit: 'qt' }, pricing }] })).field).toBe('gpa');
    expect(validationErrorOf(() => computeSprayApplication({ acres: 1, gpa: 20, tankGal: 0, products: [{ name: 'x', rate: { kind: 'product', amountPerAcre: 1, unit: 'qt' }, pricing }] })).field).toBe('tankGal');
    expect(validationErrorOf(() => computeSprayApplication({ acres: 1, treatedFraction: 1.5, products: [{ name: 'x', rate: { kind: 'product', amountPerAcre: 1, unit: 'qt' }, pricing }] })).field).toBe('treatedFraction');
  });
});
