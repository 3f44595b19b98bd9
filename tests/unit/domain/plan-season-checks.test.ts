import { describe, expect, it } from 'vitest';
import { plantBackWarnings, rotationWarnings, type SeasonTaskInput } from '../../../shared/domain/plan-checks';
import { MaterialCreateSchema } from '../../../shared/schemas/library';
import { validateMaterialDefinition, type MaterialDefinition } from '../../../shared/domain/practice';

// Invented plant-back interval for the tests (a label gives the real one): 120 days.
const residual = { key: 'herb-residual', name: 'Residual product', plantBackDays: 120 };
const spray = (date: string, unitId = '1'): SeasonTaskInput => ({ unitId, unitName: 'North plot', kind: 'spray', name: 'Burn down', date, materialKeys: ['herb-residual', 'adj-nonionic-surfactant'] });
const seed = (date: string, unitId = '1', kind = 'seed'): SeasonTaskInput => ({ unitId, unitName: 'North plot', kind, name: 'Broadcast seed', date, materialKeys: [] });

describe('plant-back warnings', () => {
  it('warns when the spray date plus the interval falls after the planned seeding on the same unit', () => {
    // 2026-05-01 + 120 days = 2026-08-29 (calendar arithmetic, no source); seeding 2026-08-15 is 14 days early.
    const [w, ...rest] = plantBackWarnings([spray('2026-05-01'), seed('2026-08-15')], [residual]);
    expect(rest).toEqual([]);
    expect(w.code).toBe('plant-back');
    expect(w.unitIds).toEqual(['1']);
    expect(w.message).toContain('14 days too early');
    expect(w.message).toContain('2026-08-29');
    expect(w.message).toMatch(/label is the law/);
  });

  it('is quiet once the interval has passed, on another unit, before the spray, or with no interval on the label', () => {
    expect(plantBackWarnings([spray('2026-05-01'), seed('2026-08-29')], [residual])).toEqual([]); // exactly 120 days
    expect(plantBackWarnings([spray('2026-05-01'), seed('2026-06-01', '2')], [residual])).toEqual([]);
    expect(plantBackWarnings([spray('2026-05-01'), seed('2026-04-01')], [residual])).toEqual([]);
    expect(plantBackWarnings([spray('2026-05-01'), seed('2026-05-02')], [])).toEqual([]);
    expect(plantBackWarnings([spray('2026-05-01'), seed('2026-05-02')], [{ ...residual, plantBackDays: 0 }])).toEqual([]);
  });

  it('counts a planting (transplants, seedlings) as a seeding, across a year end', () => {
    // 2026-11-15 + 120 days = 2027-03-15 (calendar arithmetic, no source)
    const [w] = plantBackWarnings([spray('2026-11-15'), seed('2027-03-01', '1', 'plant')], [residual]);
    expect(w.message).toContain('2027-03-15');
  });
});

describe('rotation warnings', () => {
  it('warns on the same crop family two seasons running (common practice, no source)', () => {
    const warnings = rotationWarnings([
      { unitId: '1', unitName: 'North plot', seasons: [{ year: 2025, family: 'brassica' }, { year: 2026, family: 'brassica' }] },
      { unitId: '2', unitName: 'Ridge plot', seasons: [{ year: 2025, family: 'legume' }, { year: 2026, family: 'grain' }] },
      { unitId: '3', unitName: 'Creek plot', seasons: [{ year: 2024, family: 'legume' }, { year: 2026, family: 'legume' }] },
    ]);
    expect(warnings).toHaveLength(1);
    expect(warnings[0].code).toBe('rotation');
    expect(warnings[0].unitIds).toEqual(['1']);
    expect(warnings[0].message).toMatch(/brassica crops in 2025 and 2026.*common practice, no source/);
  });

  it('reads a season by its first prescription (a re-seeding later that year does not count twice)', () => {
    const warnings = rotationWarnings([{ unitId: '1', unitName: 'North plot', seasons: [{ year: 2026, family: 'brassica' }, { year: 2026, family: 'brassica' }, { year: 2027, family: 'legume' }] }]);
    expect(warnings).toEqual([]);
  });
});

describe('plant-back field on a herbicide', () => {
  const base = { kind: 'herbicide', name: 'Residual product', activeIngredient: 'x', pricing: { basis: 'per-gal', pricePerGalCents: 100 } };
  it('takes whole days ≥ 0', () => {
    const parsed = MaterialCreateSchema.parse({ ...base, plantBackDays: 120 });
    expect(parsed.kind === 'herbicide' && parsed.plantBackDays).toBe(120);
  });
  it.each([
    ['4 months', /plantBackDays.*number of days/],
    [4.5, /plantBackDays.*whole number of days/],
    [-1, /plantBackDays.*cannot be negative/],
  ])('refuses %s with a sentence naming the field', (value, message) => {
    const result = MaterialCreateSchema.safeParse({ ...base, plantBackDays: value });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0].path).toEqual(['plantBackDays']);
    expect(result.error!.issues[0].message).toMatch(message);
  });
  it('is checked in the domain too', () => {
    const m = { key: 'h', type: 'herbicide', name: 'H', activeIngredient: 'x', restrictedUse: false, plantBackDays: 1.5, pricing: { basis: 'per-gal', pricePerGalCents: 100 } } as MaterialDefinition;
    expect(() => validateMaterialDefinition(m)).toThrow(/plantBackDays.*whole number of days/);
  });
});
