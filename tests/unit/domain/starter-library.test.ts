import { describe, expect, it } from 'vitest';
import { WINDOW_KEYS, schedulePrescription, REGIONS } from '../../../shared/domain/planting-windows';
import { validateMaterialDefinition, validatePracticeDefinition, type FertilizerMaterial, type PracticeDefinition, type SeedMaterial, type SprayMaterial, type UnitMeasures } from '../../../shared/domain/practice';
import { computePrescription } from '../../../shared/domain/prescription-quantities';
import { STARTER_MATERIALS, STARTER_PRACTICES, STARTER_RATES } from '../../../shared/domain/starter-library';
import { isUnitKind } from '../../../shared/domain/unit-kinds';
import { validationErrorOf } from './support';

interface PublishedRange {
  minLbPerAcre: number;
  maxLbPerAcre: number;
  basis: 'bulk' | 'pls';
  source: string;
}

/** Pure-stand seeding rates from REFERENCES.md; each entry names its source. */
const PUBLISHED_RATES: Record<string, PublishedRange[]> = {
  'white clover': [
    { minLbPerAcre: 4, maxLbPerAcre: 6, basis: 'bulk', source: 'Cook & Gray (2003), Alabama DCNR, App. 9: ladino/white clover 4–6' },
    { minLbPerAcre: 3, maxLbPerAcre: 4, basis: 'bulk', source: 'UF/IFAS Taylor County Extension: white clover 3–4' },
  ],
  'red clover': [{ minLbPerAcre: 12, maxLbPerAcre: 15, basis: 'bulk', source: 'Cook & Gray (2003), Alabama DCNR: red clover 12–15' }],
  'crimson clover': [{ minLbPerAcre: 20, maxLbPerAcre: 26, basis: 'bulk', source: 'UF/IFAS Taylor County Extension: crimson clover 20–26' }],
  rape: [{ minLbPerAcre: 10, maxLbPerAcre: 12, basis: 'bulk', source: 'Cook & Gray (2003), Alabama DCNR: rape 10–12' }],
  turnip: [{ minLbPerAcre: 5, maxLbPerAcre: 6, basis: 'bulk', source: 'UF/IFAS Taylor County Extension: turnips 5–6' }],
  oats: [
    { minLbPerAcre: 80, maxLbPerAcre: 100, basis: 'bulk', source: 'Cook & Gray (2003), Alabama DCNR: oats 80–100' },
    { minLbPerAcre: 96, maxLbPerAcre: 128, basis: 'bulk', source: 'UF/IFAS Taylor County Extension: oats 96–128 (3–4 bu)' },
  ],
  'cereal rye': [
    { minLbPerAcre: 80, maxLbPerAcre: 115, basis: 'bulk', source: 'Cook & Gray (2003), Alabama DCNR: cereal rye 80–115' },
    { minLbPerAcre: 84, maxLbPerAcre: 112, basis: 'bulk', source: 'UF/IFAS Taylor County Extension: rye 84–112 (1.5–2 bu)' },
  ],
  wheat: [
    { minLbPerAcre: 90, maxLbPerAcre: 120, basis: 'bulk', source: 'Cook & Gray (2003), Alabama DCNR: wheat 90–120' },
    { minLbPerAcre: 90, maxLbPerAcre: 120, basis: 'bulk', source: 'UF/IFAS Taylor County Extension: wheat 90–120 (1.5–2 bu)' },
  ],
  cowpeas: [{ minLbPerAcre: 40, maxLbPerAcre: 90, basis: 'bulk', source: 'Cook & Gray (2003), Alabama DCNR: cowpeas 40–90' }],
  'grain sorghum': [{ minLbPerAcre: 15, maxLbPerAcre: 20, basis: 'bulk', source: 'Cook & Gray (2003), Alabama DCNR: grain sorghum 15–20' }],
  'big bluestem': [{ minLbPerAcre: 6.0, maxLbPerAcre: 6.0, basis: 'pls', source: 'McGinty, Texas AgriLife, Seeding Rangeland: big bluestem 6.0 lb PLS' }],
  indiangrass: [{ minLbPerAcre: 4.5, maxLbPerAcre: 4.5, basis: 'pls', source: 'McGinty, Texas AgriLife: indiangrass 4.5 lb PLS' }],
  'little bluestem': [{ minLbPerAcre: 3.4, maxLbPerAcre: 3.4, basis: 'pls', source: 'McGinty, Texas AgriLife: little bluestem 3.4 lb PLS' }],
  switchgrass: [
    { minLbPerAcre: 3.5, maxLbPerAcre: 3.5, basis: 'pls', source: 'McGinty, Texas AgriLife: switchgrass 3.5 lb PLS' },
    { minLbPerAcre: 2, maxLbPerAcre: 10, basis: 'pls', source: 'Oklahoma State, switchgrass stand establishment: 2–10 lb PLS' },
  ],
};

/** Species with no published rate in REFERENCES.md (from memory, not for checks): chicory 4–6, forage radish 8–10. */
const UNCHECKED_SPECIES = ['forage chicory', 'forage radish'];

const seedMaterial = (key: string) => STARTER_MATERIALS.find((m) => m.key === key) as SeedMaterial;

function sampleUnit(practice: PracticeDefinition): UnitMeasures {
  if (practice.measure === 'acres') return { acres: 2.4, perimeterFt: 1400 };
  if (practice.measure === 'feet') return { lengthFt: 1250 };
  return { count: 2 };
}

describe('starter library contents', () => {
  it('has at least the twelve practices the brief names', () => {
    const keys = STARTER_PRACTICES.map((p) => p.key);
    expect(keys.length).toBeGreaterThanOrEqual(12);
    for (const key of [
      'fall-brassica-plot',
      'perennial-clover-chicory',
      'cereal-grain-plot',
      'summer-legume-plot',
      'native-grass-planting',
      'shrub-screen-planting',
      'tsi-hinge-cut',
      'invasive-shrub-control',
      'mock-scrape',
      'water-source',
      'access-route-clearing',
      'sanctuary-posting',
    ]) {
      expect(keys).toContain(key);
    }
  });

  it('has unique keys and only valid references, kinds and windows', () => {
    for (const list of [STARTER_MATERIALS, STARTER_RATES, STARTER_PRACTICES]) {
      const keys = list.map((x) => x.key);
      expect(new Set(keys).size).toBe(keys.length);
    }
    for (const practice of STARTER_PRACTICES) {
      expect(() => validatePracticeDefinition(practice, STARTER_MATERIALS, STARTER_RATES), practice.key).not.toThrow();
      expect(practice.unitKinds.every(isUnitKind), practice.key).toBe(true);
      expect(WINDOW_KEYS).toContain(practice.windowKey);
    }
  });

  it('has materials that pass validation, and validation catches a bad one', () => {
    for (const m of STARTER_MATERIALS) expect(() => validateMaterialDefinition(m), m.key).not.toThrow();
    const seed = STARTER_MATERIALS.find((m) => m.type === 'seed') as SeedMaterial;
    expect(validationErrorOf(() => validateMaterialDefinition({ ...seed, germinationPct: 101 })).field).toBe('material.germinationPct');
    const fert = STARTER_MATERIALS.find((m) => m.key === 'fert-13-13-13') as FertilizerMaterial;
    expect(validationErrorOf(() => validateMaterialDefinition({ ...fert, grade: { nPct: 50, p2o5Pct: 40, k2oPct: 20 } })).field).toBe('material.grade');
    const herb = STARTER_MATERIALS.find((m) => m.key === 'herb-glyphosate-41') as SprayMaterial;
    expect(validationErrorOf(() => validateMaterialDefinition({ ...herb, pricing: { basis: 'container', containerSizeGal: 0, containerPriceCents: 100 } })).field).toBe('material.pricing.containerSizeGal');
  });

  it('refuses a practice whose steps depend on each other in a circle', () => {
    const practice = STARTER_PRACTICES[0];
    const looped = { ...practice, steps: practice.steps.map((s) => (s.key === 'soil-test' ? { ...s, dependsOn: ['seed'] } : s)) };
    expect(validationErrorOf(() => validatePracticeDefinition(looped, STARTER_MATERIALS, STARTER_RATES)).message).toMatch(/in a circle: soil-test → seed → .*soil-test/);
  });

  it('keeps every price in whole cents', () => {
    const cents: number[] = [];
    for (const m of STARTER_MATERIALS) {
      if (m.type === 'seed') cents.push(m.packagePriceCents);
      if (m.type === 'fertilizer') cents.push(m.bagPriceCents);
      if (m.type === 'item') cents.push(m.packPriceCents);
      if (m.type === 'lime') cents.push(m.pricing.basis === 'per-ton' ? m.pricing.pricePerTonCents : m.pricing.bagPriceCents);
      if (m.type === 'herbicide' || m.type === 'adjuvant') cents.push(m.pricing.basis === 'per-gal' ? m.pricing.pricePerGalCents : m.pricing.containerPriceCents);
    }
    for (const r of STARTER_RATES) cents.push(r.unitPriceCents, r.minimumCents ?? 0);
    expect(cents.every((c) => Number.isInteger(c) && c >= 0)).toBe(true);
  });

  it('names herbicides by generic active ingredient only', () => {
    const generic = /^(glyphosate|triclopyr|imazapic|nonionic surfactant)\b/;
    for (const m of STARTER_MATERIALS) {
      if (m.type === 'herbicide' || m.type === 'adjuvant') {
        expect(m.activeIngredient, m.key).toMatch(generic);
        expect(m.name.toLowerCase(), m.key).toMatch(generic);
      }
    }
  });
});

describe('starter seeding rates against published ranges', () => {
  const components = STARTER_PRACTICES.flatMap((practice) =>
    practice.steps.flatMap((step) =>
      step.application?.type === 'seed'
        ? step.application.components.map((c) => ({ practice: practice.key, method: step.application?.type === 'seed' ? step.application.rateMethod ?? step.application.method : 'broadcast', ...c }))
        : [],
    ),
  );

  it('has seed in the library to check', () => {
    expect(components.length).toBeGreaterThan(10);
  });

  it('puts every species either in the published table or in the explicit from-memory list', () => {
    for (const c of components) {
      const species = seedMaterial(c.materialKey).species;
      expect(species in PUBLISHED_RATES || UNCHECKED_SPECIES.includes(species), `${c.practice}: ${species}`).toBe(true);
    }
  });

  it('keeps each pure-stand-equivalent rate (rate ÷ mix share) within every published range for the species', () => {
    for (const c of components) {
      const species = seedMaterial(c.materialKey).species;
      const share = (c.mixSharePct ?? 100) / 100;
      expect(share, `${c.practice}: ${species} share`).toBeGreaterThan(0);
      expect(share, `${c.practice}: ${species} share`).toBeLessThanOrEqual(1);
      const pureStand = c.rateLbPerAcre / share;
      for (const range of PUBLISHED_RATES[species] ?? []) {
        expect(c.rateBasis, `${c.practice}: ${species} basis (${range.source})`).toBe(range.basis);
        expect(pureStand, `${c.practice}: ${species} vs ${range.source}`).toBeGreaterThanOrEqual(range.minLbPerAcre - 1e-9);
        expect(pureStand, `${c.practice}: ${species} vs ${range.source}`).toBeLessThanOrEqual(range.maxLbPerAcre + 1e-9);
      }
    }
  });

  it('keeps the shares of each mix at no more than a full stand', () => {
    const byPractice = new Map<string, number>();
    for (const c of components) byPractice.set(c.practice, (byPractice.get(c.practice) ?? 0) + (c.mixSharePct ?? 100));
    for (const [practice, total] of byPractice) expect(total, practice).toBeLessThanOrEqual(100);
  });

  it('uses broadcast rates for food plots and drilled PLS rates for native grasses', () => {
    for (const c of components) {
      const range = PUBLISHED_RATES[seedMaterial(c.materialKey).species]?.[0];
      if (range?.basis === 'bulk') expect(c.method, c.practice).toBe('broadcast'); // Cook & Gray and UF/IFAS give broadcast rates
      if (range?.basis === 'pls') expect(c.method, c.practice).toBe('drilled'); // McGinty's rangeland rates are drilled PLS rates (from memory)
    }
  });
});

describe('every starter practice computes and schedules', () => {
  it('prices a sample unit with integer cents and lines that add up', () => {
    for (const practice of STARTER_PRACTICES) {
      const result = computePrescription({ unit: sampleUnit(practice), practice, materials: STARTER_MATERIALS, rates: STARTER_RATES });
      expect(result.totalCents, practice.key).toBeGreaterThan(0);
      expect(Number.isInteger(result.totalCents), practice.key).toBe(true);
      expect(result.lines.reduce((sum, l) => sum + l.amountCents, 0), practice.key).toBe(result.totalCents);
    }
  });

  it('schedules in every region without errors', () => {
    for (const practice of STARTER_PRACTICES) {
      for (const region of REGIONS) {
        const schedule = schedulePrescription({ practice, region, year: 2026, today: '2026-01-01' });
        expect(schedule.steps).toHaveLength(practice.steps.length);
        for (const step of schedule.steps) expect(step.earliest <= step.latest, `${practice.key} ${step.stepKey}`).toBe(true);
      }
    }
  });
});
