import { describe, expect, it } from 'vitest';
import { centsToDollarsText, LimeFormSchema, materialFormDefaults, numberOrUndefined, SeedFormSchema } from '../../../../src/features/library/lib/material-forms';
import { RateFormSchema } from '../../../../src/features/library/lib/rate-form';
import { matchField } from '../../../../src/lib/api-errors';
import type { MaterialDto } from '../../../../shared/schemas/library';

const seed = { kind: 'seed', name: 'Red clover', species: 'red clover', purityPct: 98, germinationPct: 85, packageSizeLb: 10, packagePriceCents: '32.50' };

describe('material forms take dollars and send cents', () => {
  it('turns the typed package price into integer cents', () => {
    const parsed = SeedFormSchema.parse(seed);
    expect(parsed.packagePriceCents).toBe(3250); // $32.50 = 3,250 cents
  });

  it('refuses a purity above 100 % with the shared schema’s message', () => {
    const result = SeedFormSchema.safeParse({ ...seed, purityPct: 120 });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['purityPct', 'Purity must be between 0 and 100']]);
  });

  it('refuses fractions of a cent and text in the price box', () => {
    expect(SeedFormSchema.safeParse({ ...seed, packagePriceCents: '12.345' }).error?.issues[0].message).toMatch(/more than two decimal places/);
    expect(SeedFormSchema.safeParse({ ...seed, packagePriceCents: 'ten' }).error?.issues[0].message).toMatch(/not a dollar amount/);
    expect(SeedFormSchema.safeParse({ ...seed, packagePriceCents: '' }).error?.issues[0].message).toBe('Enter the package price in dollars');
  });

  it('prices lime by the bag or by the ton', () => {
    const bag = LimeFormSchema.parse({ kind: 'lime', name: 'Pelletized lime', pricing: { basis: 'bag', bagSizeLb: 40, bagPriceCents: '8' } });
    expect(bag.pricing).toEqual({ basis: 'bag', bagSizeLb: 40, bagPriceCents: 800 });
    const ton = LimeFormSchema.parse({ kind: 'lime', name: 'Ag lime', pricing: { basis: 'per-ton', pricePerTonCents: '$1,048.00' } });
    expect(ton.pricing).toEqual({ basis: 'per-ton', pricePerTonCents: 104800 });
  });

  it('starts an edit from the material, money back in dollars', () => {
    const material = { id: 1, key: 'lime-x', kind: 'lime', type: 'lime', name: 'Pelletized lime', pricing: { basis: 'bag', bagSizeLb: 40, bagPriceCents: 805 }, archived: false, updatedAt: '' } as MaterialDto;
    expect(materialFormDefaults('lime', material)).toEqual({ kind: 'lime', name: 'Pelletized lime', enmLbPerTon: undefined, pricing: { basis: 'bag', bagSizeLb: 40, bagPriceCents: '8.05' } });
    expect(centsToDollarsText(4800)).toBe('48.00');
  });

  it('reads number boxes: empty is no value, text is refused by the schema', () => {
    expect(numberOrUndefined('')).toBeUndefined();
    expect(numberOrUndefined('1,000')).toBe(1000);
    expect(Number.isNaN(numberOrUndefined('abc'))).toBe(true);
  });
});

describe('rate rows', () => {
  it('send an emptied minimum as 0 cents so that a saved minimum can be removed', () => {
    const parsed = RateFormSchema.parse({ name: 'Field crew labor', category: 'labor', basis: 'per-hour', unitPriceCents: '48.00', minimumCents: '' });
    expect(parsed).toMatchObject({ unitPriceCents: 4800, minimumCents: 0 });
  });
});

describe('server error paths find their form field', () => {
  it('drops the domain prefix and falls back to the longest known prefix', () => {
    const fields = ['name', 'grade', 'pricing.bagSizeLb', 'dormantPct'];
    expect(matchField('material.dormantPct', fields)).toBe('dormantPct');
    expect(matchField('grade.nPct', fields)).toBe('grade');
    expect(matchField('pricing.bagSizeLb', fields)).toBe('pricing.bagSizeLb');
    expect(matchField('somewhere.else', fields)).toBeNull();
  });
});

describe('the herbicide form’s EPA Reg. No.', () => {
  const herbicide = { kind: 'herbicide', name: 'Burndown', activeIngredient: 'glyphosate 41%', restrictedUse: false, adjuvant: false, pricing: { basis: 'per-gal', pricePerGalCents: '25.00' } };
  it('takes the label’s forms (company-product, and a distributor’s third number) and leaves an empty box out', async () => {
    const { HerbicideFormSchema } = await import('../../../../src/features/library/lib/material-forms');
    expect(HerbicideFormSchema.parse({ ...herbicide, epaRegNo: '524-475' }).epaRegNo).toBe('524-475');
    expect(HerbicideFormSchema.parse({ ...herbicide, epaRegNo: '524-475-123' }).epaRegNo).toBe('524-475-123');
    expect(HerbicideFormSchema.parse({ ...herbicide, epaRegNo: undefined }).epaRegNo).toBeUndefined();
    const refused = HerbicideFormSchema.safeParse({ ...herbicide, epaRegNo: '524 475' });
    expect(refused.error?.issues[0]).toMatchObject({ path: ['epaRegNo'], message: expect.stringMatching(/EPA Reg\. No\. \(epaRegNo\)/) });
  });
  it('starts from the material’s number when editing', () => {
    const m = { id: 1, kind: 'herbicide', type: 'herbicide', key: 'h', name: 'Burndown', activeIngredient: 'glyphosate', restrictedUse: false, epaRegNo: '524-475', pricing: { basis: 'per-gal', pricePerGalCents: 2500 }, archived: false, updatedAt: '' } as unknown as MaterialDto;
    expect(materialFormDefaults('herbicide', m)).toMatchObject({ epaRegNo: '524-475' });
  });
});
