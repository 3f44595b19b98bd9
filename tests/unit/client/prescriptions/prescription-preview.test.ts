import { describe, expect, it } from 'vitest';
import { buildParameters, fieldForPath, initialParameterTexts, parameterSteps } from '../../../../src/features/prescriptions/lib/parameter-fields';
import { asRegion, defaultYear, previewPrescription, unitMeasures } from '../../../../src/features/prescriptions/lib/preview';
import type { PanelUnit } from '../../../../src/features/prescriptions/lib/types';
import { STARTER_MATERIALS, STARTER_RATES, starterPractice } from '../../../../shared/domain/starter-library';

const brassica = starterPractice('fall-brassica-plot');
// The demo's "Ridge clover plot" measures 6.9407 acres (server-computed from its drawn polygon).
const plot: PanelUnit = { id: 1, kind: 'food-plot', name: 'Ridge clover plot', acres: 6.9407, lengthFt: null, perimeterFt: 2279.8 };

describe('the prescription form’s fields', () => {
  const steps = parameterSteps(brassica, STARTER_MATERIALS);

  it('asks for lime tons, sprayer volume and tank, N-P-K and a rate per seed component, prefilled from the practice', () => {
    expect(steps.map((s) => s.stepKey)).toEqual(['lime', 'burn-down', 'fertilize', 'seed', 'topdress']);
    const { texts, skipped } = initialParameterTexts(steps, undefined);
    // Starter fall brassica plot values.
    expect(texts).toMatchObject({ 'lime.limeTonsPerAcre': '2', 'burn-down.gpa': '15', 'burn-down.tankGal': '25', 'fertilize.nLbPerAcre': '40', 'seed.seedRatesLbPerAcre.seed-rape': '4' });
    expect(skipped).toEqual([]);
  });

  it('prefers the prescription’s own values when changing it', () => {
    const { texts, skipped } = initialParameterTexts(steps, { steps: { lime: { limeTonsPerAcre: 1.5 }, topdress: { skip: true } } });
    expect(texts['lime.limeTonsPerAcre']).toBe('1.5');
    expect(skipped).toEqual(['topdress']);
  });

  it('writes every value, marks skipped steps, and refuses emptied or unreadable boxes', () => {
    const { texts } = initialParameterTexts(steps, undefined);
    const built = buildParameters(steps, { ...texts, 'lime.limeTonsPerAcre': '3' }, ['topdress']);
    expect(built.ok && built.parameters.steps?.lime).toEqual({ limeTonsPerAcre: 3 });
    expect(built.ok && built.parameters.steps?.topdress).toEqual({ skip: true });
    expect(built.ok && built.parameters.steps?.seed?.seedRatesLbPerAcre).toEqual({ 'seed-forage-radish': 2.7, 'seed-turnip': 1.65, 'seed-rape': 4 });
    const bad = buildParameters(steps, { ...texts, 'lime.limeTonsPerAcre': '', 'burn-down.gpa': 'lots' }, []);
    expect(bad.ok).toBe(false);
    expect(!bad.ok && bad.errors).toEqual({ 'lime.limeTonsPerAcre': 'Enter a number (the practice uses 2), or skip the step.', 'burn-down.gpa': '“lots” is not a number.' });
  });

  it('finds the box a server or domain path names', () => {
    expect(fieldForPath('parameters.steps.lime.limeTonsPerAcre', steps)).toBe('lime.limeTonsPerAcre');
    expect(fieldForPath('parameters.steps.seed.seedRatesLbPerAcre.seed-rape', steps)).toBe('seed.seedRatesLbPerAcre.seed-rape');
    expect(fieldForPath('unit.acres', steps)).toBeNull();
  });
});

describe('the live preview', () => {
  it('computes the quantities the server would for the demo plot', () => {
    const preview = previewPrescription({ unit: plot, practice: brassica, materials: STARTER_MATERIALS, rates: STARTER_RATES, region: 'midwest', year: 2027, today: '2026-12-02' });
    expect(preview.ok).toBe(true);
    if (!preview.ok) return;
    const v = preview.view;
    expect(v.bulkSeedLb).toBeCloseTo((2.7 + 1.65 + 4) * 6.9407, 9); // starter seed rates × acres
    expect(v.limeTons).toBeCloseTo(2 * 6.9407, 9); // 2 t/acre
    expect(v.herbicideProductGal).toBeCloseTo(0.5 * 6.9407, 9); // 2 qt = 0.5 gal per acre
    expect(v.tankLoads).toBe(5); // 6.9407 acres × 15 GPA = 104.1 gal in a 25-gal tank → 5 loads
    expect(v.fertilizerProductLb).toBeCloseTo((40 / 0.13 + 40 / 0.46) * 6.9407, 6); // standard product = nutrient ÷ grade fraction
    expect(v.totalCents).toBe(v.materialCents + v.laborCents + v.equipmentCents + v.feesCents);
    expect(v.schedule.anchorWindow).toMatchObject({ earliest: '2027-07-20', latest: '2027-08-31' }); // Midwest brassica window, planting-windows.ts
    expect(v.cautions.map((c) => c.id)).toEqual(['herbicide']);
    expect(v.summary).toMatch(/^Plant 6\.9 acres of fall brassicas/);
  });

  it('comes back with the domain’s message and field instead of throwing', () => {
    const noLime = { ...brassica, steps: brassica.steps.map((s) => (s.key === 'lime' ? { ...s, application: { type: 'lime' as const, materialKey: 'lime-ag-spread' } } : s)) };
    const preview = previewPrescription({ unit: plot, practice: noLime, materials: STARTER_MATERIALS, rates: STARTER_RATES, region: 'midwest', year: 2027, today: '2026-12-02' });
    expect(preview).toMatchObject({ ok: false, field: 'parameters.steps.lime.limeTonsPerAcre' });
    expect(!preview.ok && preview.message).toMatch(/lime recommendation from the soil test/);
    const line = previewPrescription({ unit: { ...plot, acres: null, lengthFt: 1200 }, practice: brassica, materials: STARTER_MATERIALS, rates: STARTER_RATES, region: 'midwest', year: 2027, today: '2026-12-02' });
    expect(line).toMatchObject({ ok: false, field: 'unit.acres' });
  });

  it('plans for next season once this year’s window has closed, like the server', () => {
    // Midwest brassica window Jul 20 – Aug 31 (planting-windows.ts).
    expect(defaultYear(brassica, 'midwest', '2026-12-02')).toBe(2027);
    expect(defaultYear(brassica, 'midwest', '2026-06-01')).toBe(2026);
    expect(asRegion('north')).toBe('north');
    expect(asRegion(null)).toBe('midwest');
    expect(unitMeasures(plot, 3)).toEqual({ acres: 6.9407, perimeterFt: 2279.8, count: 3 });
  });
});
