import { describe, expect, it } from 'vitest';
import {
  browseResult,
  browseTrend,
  establishmentResult,
  jacobsD,
  plotStatus,
  preferredSpecies,
  reseedRateFactor,
  standTargetFor,
  timberResult,
  treeBasalAreaSqFt,
  usePct,
} from '../../../shared/domain/plot-checks';
import { validationErrorOf } from './support';

describe('establishment check', () => {
  it('divides plants by frames × frame area, per species', () => {
    // 3 tosses of a 1 ft² frame with 9, 12 and 9 clover seedlings → 30 ÷ 3 ft² = 10 plants/ft² (definition of a density)
    const result = establishmentResult({ frameSqFt: 1, samples: [{ species: 'white clover', plants: 9 }, { species: 'White Clover', plants: 12 }, { species: 'white clover', plants: 9 }], groundCoverPct: 80, weedPressure: 'low' });
    expect(result.species).toHaveLength(1);
    expect(result.species[0]!.plantsPerSqFt).toBe(10);
    expect(result.species[0]!.targetPlantsPerSqFt).toBe(10); // white clover: from memory (no published stand count found)
    expect(result.species[0]!.targetSource).toMatch(/from memory/);
    expect(result.status).toBe('established');
  });

  it('calls a stand thin or failed by its share of target (thresholds: common practice, no source)', () => {
    // 2.5 ft² hoop: 12 radish → 4.8/ft²… use 0.25 ft² frames: 1 radish in 2 frames → 2/ft² of 4 wanted = 50 % → thin
    const thin = establishmentResult({ frameSqFt: 0.25, samples: [{ species: 'forage radish', plants: 1 }, { species: 'forage radish', plants: 0 }], groundCoverPct: 30, weedPressure: 'moderate' });
    expect(thin.species[0]!.plantsPerSqFt).toBe(2);
    expect(thin.status).toBe('thin');
    const failed = establishmentResult({ frameSqFt: 1, samples: [{ species: 'rape', plants: 1 }, { species: 'turnip', plants: 2 }], groundCoverPct: 10, weedPressure: 'high' });
    expect(failed.status).toBe('failed'); // rape 1/5 (OMAFRA canola guide), turnip 2/5 (from memory): mean 0.3 < 0.4
    expect(failed.reason).toMatch(/rape came up at 1\.0 plants\/ft² against 5/);
  });

  it('caps each species at its target so a thick one cannot hide a failed one', () => {
    const result = establishmentResult({ frameSqFt: 1, samples: [{ species: 'white clover', plants: 40 }, { species: 'forage chicory', plants: 0 }], groundCoverPct: 60, weedPressure: 'none' });
    expect(result.status).toBe('thin'); // mean of min(1, 4) and 0 = 0.5
  });

  it('judges by ground cover when no species has a target', () => {
    expect(establishmentResult({ frameSqFt: 1, samples: [{ species: 'buckwheat', plants: 3 }], groundCoverPct: 75, weedPressure: 'low' }).status).toBe('established');
    expect(establishmentResult({ frameSqFt: 1, samples: [{ species: 'buckwheat', plants: 3 }], groundCoverPct: 20, weedPressure: 'low' }).status).toBe('failed');
  });

  it('refuses a zero frame, negative or fractional counts, naming the field', () => {
    expect(validationErrorOf(() => establishmentResult({ frameSqFt: 0, samples: [{ species: 'oats', plants: 1 }], groundCoverPct: 5, weedPressure: 'low' }))?.field).toBe('frameSqFt');
    expect(validationErrorOf(() => establishmentResult({ frameSqFt: 1, samples: [{ species: 'oats', plants: -1 }], groundCoverPct: 5, weedPressure: 'low' }))?.field).toBe('samples.0.plants');
    expect(validationErrorOf(() => establishmentResult({ frameSqFt: 1, samples: [{ species: 'oats', plants: 2.5 }], groundCoverPct: 5, weedPressure: 'low' }))?.field).toBe('samples.0.plants');
  });

  it('knows targets by common name, ignoring case and spacing', () => {
    expect(standTargetFor('  Cereal   Rye ')?.plantsPerSqFt).toBe(20); // by analogy to Penn State's wheat guide
    expect(standTargetFor('buckwheat')).toBeNull();
  });

  it('takes each target from the extension guide it cites, or says it is from memory', () => {
    // Penn State Extension, "Wheat Stand Assessment": 20–30 plants/ft² adequate for maximum yield
    expect(standTargetFor('wheat')).toMatchObject({ plantsPerSqFt: 20, source: expect.stringMatching(/Penn State Extension, "Wheat Stand Assessment"/) });
    // OMAFRA Field Crop News (2025): canola (Brassica napus, the species of forage rape) optimum 5–8 plants/ft²
    expect(standTargetFor('rape')).toMatchObject({ plantsPerSqFt: 5, source: expect.stringMatching(/OMAFRA.*canola/) });
    // Penn State (M. Hall) in Hay & Forage Grower: 15 alfalfa plants/ft² minimum in a new seeding
    expect(standTargetFor('alfalfa')).toMatchObject({ plantsPerSqFt: 15, source: expect.stringMatching(/Penn State.*15 plants/) });
    // A Penn State wheat stand at the guide's replant line (12 plants/ft²) is not called established
    expect(establishmentResult({ frameSqFt: 1, samples: [{ species: 'wheat', plants: 12 }], groundCoverPct: 50, weedPressure: 'low' }).status).not.toBe('established');
    // Every target names a source: a guide, an analogy to one, or "from memory"
    for (const species of ['white clover', 'oats', 'switchgrass', 'turnip', 'soybeans', 'crimson clover']) expect(standTargetFor(species)!.source).toMatch(/Extension|OMAFRA|USDA|Agricultural Council|analogy|from memory/);
    expect(standTargetFor('oats')!.source).toMatch(/analogy/);
    expect(standTargetFor('white clover')!.source).toMatch(/from memory/); // no published count found for white or red clover
  });

  it('converts published per-acre stands to plants per ft² (1 acre = 43,560 ft², NIST Handbook 44)', () => {
    // Iowa State ICM News (Pedersen, 2007): soybean final stand about 100,000 plants/acre → 100,000 ÷ 43,560 = 2.296 → 2.3 plants/ft²
    expect(standTargetFor('soybeans')).toMatchObject({ plantsPerSqFt: 2.3, source: expect.stringMatching(/Iowa State.*100,000/) });
    expect(100_000 / 43_560).toBeCloseTo(2.3, 1);
    // UT Crops News (Univ. of Tennessee, 2015): grain sorghum final stands 60–70 thousand/acre → 60,000 ÷ 43,560 = 1.377 → 1.4 plants/ft²
    expect(standTargetFor('grain sorghum')).toMatchObject({ plantsPerSqFt: 1.4, source: expect.stringMatching(/Tennessee.*60,000/) });
    expect(60_000 / 43_560).toBeCloseTo(1.4, 1);
    // USDA Farmers' Bulletin "Growing Crimson Clover" (Kephart): six plants per ft² is a satisfactory stand
    expect(standTargetFor('crimson clover')).toMatchObject({ plantsPerSqFt: 6, source: expect.stringMatching(/USDA Farmers' Bulletin/) });
    // Great Plains Agricultural Council (1966), cited second-hand: a grass seeding succeeds with 1 established plant per ft²
    expect(standTargetFor('switchgrass')).toMatchObject({ plantsPerSqFt: 1, source: expect.stringMatching(/Great Plains Agricultural Council.*second-hand/) });
    // A soybean plot counted at 3 plants in two 1 ft² tosses (1.5/ft²) is 65 % of 2.3: thin, not established (thresholds: common practice)
    expect(establishmentResult({ frameSqFt: 1, samples: [{ species: 'soybeans', plants: 2 }, { species: 'soybeans', plants: 1 }], groundCoverPct: 40, weedPressure: 'low' }).status).toBe('thin');
  });

  it('drafts a half-rate overseeding for thin and a full re-seeding for failed plots (common practice, no source)', () => {
    expect(reseedRateFactor('thin')).toBe(0.5);
    expect(reseedRateFactor('failed')).toBe(1);
    expect(reseedRateFactor('established')).toBeNull();
  });
});

describe('browse check', () => {
  it('computes use % = (caged − open) ÷ caged × 100', () => {
    expect(usePct(10, 4)).toBe(60); // 10 in caged, 4 in open → 60 % used (the formula, worked by hand)
    expect(usePct(8, 8)).toBe(0);
  });

  it('holds Jacobs’ D to the formula of Jacobs (1974, Oecologia 14:413–417)', () => {
    // r = 0.6, p = 0.3: (0.6 − 0.3) ÷ (0.6 + 0.3 − 2 × 0.18) = 0.3 ÷ 0.54 = 0.5556 (worked by hand from Jacobs 1974)
    expect(jacobsD(0.6, 0.3)).toBeCloseTo(0.5556, 4);
    // r = 0.2, p = 0.5: −0.3 ÷ (0.7 − 0.2) = −0.6 (worked by hand from Jacobs 1974)
    expect(jacobsD(0.2, 0.5)).toBeCloseTo(-0.6, 10);
    // The index spans −1 (never used) to +1 (only used) — Jacobs 1974
    expect(jacobsD(0, 0.4)).toBe(-1);
    expect(jacobsD(1, 0.4)).toBeCloseTo(1, 12);
    expect(jacobsD(0.3, 0.3)).toBe(0);
    expect(jacobsD(0, 0)).toBe(0);
  });

  it('shares use and availability over species and ranks preference', () => {
    // clover: caged 10+10, open 2+4 → use 14; chicory caged 20, open 18 → use 2. Total use 16, caged 40.
    const result = browseResult([
      { species: 'white clover', caged: 10, open: 2 },
      { species: 'white clover', caged: 10, open: 4 },
      { species: 'forage chicory', caged: 20, open: 18 },
    ]);
    const clover = result.species.find((s) => s.species === 'white clover')!;
    const chicory = result.species.find((s) => s.species === 'forage chicory')!;
    expect(clover.usePct).toBe(70); // 14 ÷ 20
    expect(chicory.usePct).toBeCloseTo(10, 10); // 2 ÷ 20
    expect(clover.useShare).toBe(0.875); // r = 14 ÷ 16
    expect(clover.availableShare).toBe(0.5); // p = 20 ÷ 40
    expect(clover.jacobsD).toBeCloseTo(0.375 / (1.375 - 0.875), 10); // (r − p) ÷ (r + p − 2rp), Jacobs 1974
    expect(chicory.jacobsD).toBeCloseTo(-0.75, 10); // r = 0.125, p = 0.5: −0.375 ÷ 0.5
    expect(result.overallUsePct).toBe(40); // 16 ÷ 40
    expect(preferredSpecies(result)).toEqual(['white clover']);
  });

  it('refuses an open sample larger than its cage, saying why', () => {
    const error = validationErrorOf(() => browseResult([{ species: 'oats', caged: 4, open: 5 }]));
    expect(error?.field).toBe('pairs.0.open');
    expect(error?.message).toMatch(/open cannot exceed caged/);
    expect(validationErrorOf(() => browseResult([{ species: 'oats', caged: 0, open: 0 }]))?.field).toBe('pairs.0.caged');
  });

  it('gives no preference when deer used nothing', () => {
    const result = browseResult([{ species: 'oats', caged: 4, open: 4 }]);
    expect(result.species[0]!.jacobsD).toBeNull();
    expect(result.overallUsePct).toBe(0);
  });

  it('orders the trend by visit', () => {
    const a = browseResult([{ species: 'oats', caged: 10, open: 5 }]);
    const b = browseResult([{ species: 'oats', caged: 10, open: 8 }]);
    const trend = browseTrend([{ checkedOn: '2026-11-01', season: 2026, result: a }, { checkedOn: '2026-10-01', season: 2026, result: b }]);
    expect(trend.map((t) => t.overallUsePct)).toEqual([20, 50]);
    expect(trend[0]!.usePctBySpecies.oats).toBe(20);
  });
});

describe('timber cruise', () => {
  it('gives a tree’s basal area as 0.005454 × DBH²', () => {
    expect(treeBasalAreaSqFt(12)).toBeCloseTo(0.785, 3); // Univ. of Missouri NR 3110: 12 in → 0.785 ft²
  });

  it('gives basal area per acre as BAF × mean in-trees per point', () => {
    // BAF 10, points of 6, 8 and 10 in-trees → mean 8 → 80 ft²/acre (prism cruise definition, standard forestry texts)
    const result = timberResult({ baf: 10, points: [{ inTrees: 6 }, { inTrees: 8 }, { inTrees: 10 }] });
    expect(result.basalAreaSqFtPerAcre).toBe(80);
    expect(result.treesPerAcre).toBeNull();
  });

  it('gives trees per acre from each in-tree’s DBH: BAF ÷ (0.005454 × DBH²)', () => {
    // One point, BAF 10, two 12-in trees: each stands for 10 ÷ 0.785376 = 12.733 trees/acre → 25.47 (Univ. of Missouri; standard forestry texts)
    const result = timberResult({ baf: 10, points: [{ inTrees: 2, dbhIn: [12, 12] }], targetResidualBaSqFtPerAcre: 65 });
    expect(result.treesPerAcre).toBeCloseTo(25.47, 2);
    expect(result.quadraticMeanDbhIn).toBeCloseTo(12, 10);
    expect(result.basalAreaSqFtPerAcre).toBe(20);
    expect(result.excessBaSqFtPerAcre).toBe(0);
    // A mean DBH stands for every in-tree of the point
    expect(timberResult({ baf: 10, points: [{ inTrees: 2, dbhIn: 12 }] }).treesPerAcre).toBeCloseTo(25.47, 2);
  });

  it('compares with the target residual basal area (Virginia Dept. of Forestry: ≤ 65 ft²/acre for wildlife thinning of pine)', () => {
    const result = timberResult({ baf: 10, points: [{ inTrees: 12 }, { inTrees: 10 }], targetResidualBaSqFtPerAcre: 65 });
    expect(result.basalAreaSqFtPerAcre).toBe(110);
    expect(result.excessBaSqFtPerAcre).toBe(45);
    expect(plotStatus({ kind: 'timber', excessBaSqFtPerAcre: 45 })).toBe('over-target');
  });

  it('refuses a DBH list that does not match the count, and a zero BAF', () => {
    expect(validationErrorOf(() => timberResult({ baf: 10, points: [{ inTrees: 3, dbhIn: [10, 11] }] }))?.field).toBe('points.0.dbhIn');
    expect(validationErrorOf(() => timberResult({ baf: 0, points: [{ inTrees: 3 }] }))?.field).toBe('baf');
    expect(validationErrorOf(() => timberResult({ baf: 10, points: [{ inTrees: -1 }] }))?.field).toBe('points.0.inTrees');
  });
});
