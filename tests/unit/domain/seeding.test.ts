import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_BROADCAST_FACTOR,
  broadcastFactorFromExtraPct,
  bulkLbFromPlsLb,
  bulkLbPerPlsLb,
  computeSeedMix,
  methodRateMultiplier,
  plsFraction,
  plsLbFromBulkLb,
  plsPercent,
} from '../../../shared/domain/seeding';
import { validationErrorOf } from './support';

const fieldOf = (fn: () => unknown): string => validationErrorOf(fn).field;

describe('pure live seed', () => {
  it('multiplies purity by germination (TxDOT "Pure live seed")', () => {
    expect(plsFraction({ purityPct: 85, germinationPct: 75 })).toBeCloseTo(0.6375, 10); // TxDOT: 85 % × 75 % = 0.6375
    expect(bulkLbPerPlsLb({ purityPct: 85, germinationPct: 75 })).toBeCloseTo(1.569, 3); // TxDOT: 1 lb PLS needs 1.569 lb bulk
  });

  it('turns a PLS rate into bulk pounds (LSU AgCenter "Pure Live Seed Calculation")', () => {
    // LSU AgCenter: 20 lb PLS at 48 % purity × 80 % germination → 52.08 lb bulk
    expect(bulkLbFromPlsLb(20, { purityPct: 48, germinationPct: 80 })).toBeCloseTo(52.08, 2);
  });

  it('matches the USGS NPWRC bulk-per-PLS table within ±0.05', () => {
    // USGS NPWRC grassland Table 4 (after USDA-SCS job sheet ND-20)
    expect(Math.abs(bulkLbPerPlsLb({ purityPct: 90, germinationPct: 80 }) - 1.4)).toBeLessThanOrEqual(0.05); // 90/80 → 1.4
    expect(Math.abs(bulkLbPerPlsLb({ purityPct: 75, germinationPct: 75 }) - 1.8)).toBeLessThanOrEqual(0.05); // 75/75 → 1.8
    expect(Math.abs(bulkLbPerPlsLb({ purityPct: 50, germinationPct: 50 }) - 4.0)).toBeLessThanOrEqual(0.05); // 50/50 → 4.0
  });

  it('counts dormant (hard) seed as live (Allamakee SWCD, Iowa)', () => {
    // Allamakee SWCD: 98.75 % purity × (88 % germination + 5 % dormant) → 91.83 % PLS
    const pct = plsPercent({ purityPct: 98.75, germinationPct: 88, dormantPct: 5 });
    expect(Math.abs(pct - 91.83)).toBeLessThan(0.01);
    expect(pct).toBeGreaterThan(plsPercent({ purityPct: 98.75, germinationPct: 88 }));
  });

  it('goes back from bulk to PLS pounds', () => {
    expect(plsLbFromBulkLb(52.083333, { purityPct: 48, germinationPct: 80 })).toBeCloseTo(20, 4); // LSU AgCenter example, reversed
  });

  it('rejects impossible seed-tag values with the field named', () => {
    expect(fieldOf(() => plsFraction({ purityPct: 120, germinationPct: 80 }))).toBe('seedLot.purityPct');
    expect(fieldOf(() => plsFraction({ purityPct: 90, germinationPct: -1 }))).toBe('seedLot.germinationPct');
    expect(fieldOf(() => plsFraction({ purityPct: 90, germinationPct: 90, dormantPct: 20 }))).toBe('seedLot.dormantPct');
    expect(() => bulkLbPerPlsLb({ purityPct: 0, germinationPct: 80 })).toThrow(/no live seed/);
    expect(() => plsFraction({ purityPct: Number.NaN, germinationPct: 80 })).toThrow(/Purity must be a number/);
  });
});

describe('broadcast and drilled rates', () => {
  it('uses the UGA Extension 25–30 % extra seed for broadcasting', () => {
    expect(broadcastFactorFromExtraPct(25)).toBe(1.25); // UGA Extension: broadcast ≈ 25–30 % more seed than drilling
    expect(broadcastFactorFromExtraPct(30)).toBe(1.3); // UGA Extension
    expect(DEFAULT_BROADCAST_FACTOR).toBe(1.25); // UGA lower end
  });

  it('applies no factor when the rate is already written for the method used', () => {
    expect(methodRateMultiplier('broadcast', 'broadcast', 1.3)).toBe(1);
    const mix = computeSeedMix({ acres: 1, components: [{ species: 'rape', rateLbPerAcre: 10, rateBasis: 'bulk', packageSizeLb: 10, packagePriceCents: 3000 }] });
    expect(mix.methodMultiplier).toBe(1);
    expect(mix.bulkLbPerAcre).toBe(10); // Cook & Gray (2003) rape 10–12 lb/acre broadcast, used as given
  });

  it('raises a drilled rate for broadcasting and lowers a broadcast rate for drilling', () => {
    expect(methodRateMultiplier('broadcast', 'drilled', 1.3)).toBe(1.3);
    expect(methodRateMultiplier('drilled', 'broadcast', 1.25)).toBeCloseTo(0.8, 10);
    const mix = computeSeedMix({
      acres: 2,
      method: 'broadcast',
      rateMethod: 'drilled',
      broadcastFactor: 1.3,
      components: [{ species: 'wheat', rateLbPerAcre: 90, rateBasis: 'bulk', packageSizeLb: 50, packagePriceCents: 2000 }],
    });
    expect(mix.components[0].bulkLbPerAcre).toBeCloseTo(117, 10); // 90 × 1.30 (UGA upper end), worked example
    expect(mix.bulkSeedLb).toBeCloseTo(234, 10);
    expect(mix.packages).toBe(5);
  });

  it('refuses a broadcast factor outside 1–2', () => {
    expect(fieldOf(() => methodRateMultiplier('broadcast', 'drilled', 3))).toBe('broadcastFactor');
  });
});

describe('seed mixes and packages', () => {
  it('rounds each species up to whole packages and shows the leftover', () => {
    const mix = computeSeedMix({
      acres: 2.4,
      components: [
        // Cook & Gray (2003) rape 10–12 lb/acre; 2.4 acres × 10 = 24 lb → 3 × 10-lb bags, 6 lb left (worked example)
        { species: 'rape', rateLbPerAcre: 10, rateBasis: 'bulk', packageSizeLb: 10, packagePriceCents: 3000 },
        // UF/IFAS turnips 5–6 lb/acre; 2.4 × 5 = 12 lb → 1 × 25-lb bag, 13 lb left (worked example)
        { species: 'turnip', rateLbPerAcre: 5, rateBasis: 'bulk', packageSizeLb: 25, packagePriceCents: 7000 },
      ],
    });
    expect(mix.components[0]).toMatchObject({ bulkSeedLb: 24, packages: 3, leftoverLb: 6, costCents: 9000 });
    expect(mix.components[1]).toMatchObject({ bulkSeedLb: 12, packages: 1, leftoverLb: 13, costCents: 7000 });
    expect(mix.packages).toBe(4);
    expect(mix.costCents).toBe(16000);
    expect(mix.bulkLbPerAcre).toBe(15);
  });

  it('works out bulk pounds and packages for a PLS rate', () => {
    const mix = computeSeedMix({
      acres: 10,
      method: 'drilled',
      rateMethod: 'drilled',
      components: [
        // McGinty (Texas AgriLife): switchgrass 3.5 lb PLS/acre; lot 85 % × 75 % (TxDOT example) → 5.49 lb bulk/acre
        { species: 'switchgrass', rateLbPerAcre: 3.5, rateBasis: 'pls', seedLot: { purityPct: 85, germinationPct: 75 }, packageSizeLb: 25, packagePriceCents: 25000 },
      ],
    });
    const c = mix.components[0];
    expect(c.bulkLbPerAcre).toBeCloseTo(3.5 / 0.6375, 10);
    expect(c.bulkSeedLb).toBeCloseTo(54.90, 2);
    expect(c.plsSeedLb).toBeCloseTo(35, 10);
    expect(c.packages).toBe(3);
    expect(c.leftoverLb).toBeCloseTo(20.1, 2);
    expect(c.costCents).toBe(75000);
  });

  it('buys exactly enough when the need is a whole number of packages despite float noise', () => {
    const mix = computeSeedMix({ acres: 0.3, components: [{ species: 'oats', rateLbPerAcre: 10, rateBasis: 'bulk', packageSizeLb: 1, packagePriceCents: 100 }] });
    expect(mix.components[0].packages).toBe(3); // 0.3 × 10 = 3.0000000000000004 lb → 3 one-pound packages (worked example)
    expect(mix.components[0].leftoverLb).toBe(0);
  });

  it('never buys less than needed and leaves less than one package over', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 500, noNaN: true }),
        fc.double({ min: 0.1, max: 300, noNaN: true }),
        fc.double({ min: 0.5, max: 100, noNaN: true }),
        (acres, rate, size) => {
          const c = computeSeedMix({ acres, components: [{ species: 'x', rateLbPerAcre: rate, rateBasis: 'bulk', packageSizeLb: size, packagePriceCents: 1 }] }).components[0];
          expect(c.packages * size).toBeGreaterThanOrEqual(c.bulkSeedLb - 1e-6);
          expect(c.leftoverLb).toBeLessThan(size);
        },
      ),
    );
  });

  it('rejects absurd rates, missing tags and empty mixes', () => {
    const base = { species: 'rape', rateBasis: 'bulk' as const, packageSizeLb: 10, packagePriceCents: 3000 };
    expect(fieldOf(() => computeSeedMix({ acres: 1, components: [{ ...base, rateLbPerAcre: 0 }] }))).toBe('components[0].rateLbPerAcre');
    expect(fieldOf(() => computeSeedMix({ acres: 1, components: [{ ...base, rateLbPerAcre: 5000 }] }))).toBe('components[0].rateLbPerAcre');
    expect(fieldOf(() => computeSeedMix({ acres: 1, components: [{ ...base, rateLbPerAcre: 4, rateBasis: 'pls' }] }))).toBe('components[0].seedLot');
    expect(fieldOf(() => computeSeedMix({ acres: 1, components: [{ ...base, rateLbPerAcre: 4, packageSizeLb: 0 }] }))).toBe('components[0].packageSizeLb');
    expect(fieldOf(() => computeSeedMix({ acres: 1, components: [{ ...base, rateLbPerAcre: 4, packagePriceCents: 12.5 }] }))).toBe('components[0].packagePriceCents');
    expect(fieldOf(() => computeSeedMix({ acres: -1, components: [{ ...base, rateLbPerAcre: 4 }] }))).toBe('acres');
    expect(fieldOf(() => computeSeedMix({ acres: 1, components: [] }))).toBe('components');
    expect(() => computeSeedMix({ acres: 1, components: [{ ...base, rateLbPerAcre: 5000 }] })).toThrow(/between 0 and|greater than 0 and at most 400/);
  });
});
