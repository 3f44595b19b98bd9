import { describe, expect, it } from 'vitest';
import { applyEdits, checkNumber, editableNumbers } from '../../../../src/features/library/lib/practice-edits';
import { STARTER_MATERIALS, starterPractice } from '../../../../shared/domain/starter-library';

const practice = starterPractice('fall-brassica-plot');
const fields = practice.steps.flatMap((s, i) => editableNumbers(s, i, STARTER_MATERIALS));
const byLabel = (label: string) => fields.find((f) => f.label === label)!;

describe('editable numbers of a practice', () => {
  it('offers seed rates, lime tons, N-P-K, spray rates, spray volume and tank size with the practice’s values', () => {
    // Starter fall brassica plot: 2 t/acre lime, 40-40-40 at planting, 15 GPA and a 25-gal tank, rape at 4 lb/acre.
    expect(byLabel('Agricultural lime, delivered and spread, t/acre').value).toBe(2);
    expect(byLabel('Spray volume, gal/acre').value).toBe(15);
    expect(byLabel('Tank, gal').value).toBe(25);
    expect(byLabel('Dwarf Essex rape seed, lb/acre').value).toBe(4);
    expect(byLabel('Glyphosate 41% (3 lb a.e./gal), qt/acre').value).toBe(2);
    expect(fields.filter((f) => f.label === 'N, lb/acre').map((f) => f.value)).toEqual([40, 40]); // at planting and the topdress
  });

  it('writes typed values into a copy of the steps and leaves the practice untouched', () => {
    const result = applyEdits(practice.steps, fields, { [byLabel('Spray volume, gal/acre').id]: '20', [byLabel('Dwarf Essex rape seed, lb/acre').id]: '5.5' });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const spray = result.steps.find((s) => s.key === 'burn-down')!.application;
    expect(spray?.type === 'spray' && spray.gpa).toBe(20);
    const seed = result.steps.find((s) => s.key === 'seed')!.application;
    expect(seed?.type === 'seed' && seed.components[2].rateLbPerAcre).toBe(5.5);
    const original = practice.steps.find((s) => s.key === 'burn-down')!.application;
    expect(original?.type === 'spray' && original.gpa).toBe(15);
  });

  it('removes an optional value left empty and refuses text, zero rates and implausible values', () => {
    const lime = byLabel('Agricultural lime, delivered and spread, t/acre');
    const emptied = applyEdits(practice.steps, fields, { [lime.id]: '' });
    expect(emptied.ok && emptied.steps.find((s) => s.key === 'lime')!.application).toEqual({ type: 'lime', materialKey: 'lime-ag-spread' });
    const bad = applyEdits(practice.steps, fields, { [byLabel('Tank, gal').id]: 'big', [byLabel('Dwarf Essex rape seed, lb/acre').id]: '0', [lime.id]: '12' });
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.errors[byLabel('Tank, gal').id]).toBe('“big” is not a number.');
    expect(bad.errors[byLabel('Dwarf Essex rape seed, lb/acre').id]).toBe('Enter more than 0.');
    expect(bad.errors[lime.id]).toBe('More than 10 is not plausible here.'); // same ceiling as the prescription schema's limeTonsPerAcre
  });

  it('checks a required box that is left empty', () => {
    expect(checkNumber(' ', { min: 0, minExclusive: false, max: 400, optional: false }).error).toBe('Enter a number.');
    expect(checkNumber('1,200', { min: 0, minExclusive: false, max: 2000, optional: false })).toEqual({ value: 1200 });
  });
});
