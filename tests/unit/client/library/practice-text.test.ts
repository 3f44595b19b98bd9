import { describe, expect, it } from 'vitest';
import { anchorNoun, applicationLines, serviceText, stepTimingText, timingWords } from '../../../../src/features/library/lib/practice-text';
import { STARTER_MATERIALS, STARTER_RATES, starterPractice } from '../../../../shared/domain/starter-library';

describe('timingWords puts a step’s offsets to the anchor step into words', () => {
  it('reads a lead time before the anchor as a range of days before it', () => {
    // Starter burn-down: offsets −14 to −7, source "7–14 days before seeding: common practice, no source".
    expect(timingWords(-14, -7, 'seeding')).toBe('7–14 days before seeding');
  });
  it('reads offsets after the anchor as days after it', () => {
    expect(timingWords(30, 45, 'seeding')).toBe('30–45 days after seeding'); // starter nitrogen topdress offsets
  });
  it('names the day itself when a window touches the anchor day', () => {
    expect(timingWords(-3, 0, 'seeding')).toBe('on the day of seeding or up to 3 days before'); // starter "Fertilize at planting"
    expect(timingWords(0, 2, 'seeding')).toBe('on the day of seeding or up to 2 days after'); // starter cultipacking
    expect(timingWords(0, 0, 'planting')).toBe('on the day of planting');
    expect(timingWords(-2, 3, 'the burn')).toBe('from 2 days before to 3 days after the burn');
  });
  it('adds months beside long lead times', () => {
    // 120 ÷ 30.44 ≈ 3.9 → 4 and 365 ÷ 30.44 ≈ 12.0 → 12 (average Gregorian month 30.44 days)
    expect(timingWords(-365, -120, 'seeding')).toBe('120–365 days (about 4–12 months) before seeding');
    expect(timingWords(-7, -7, 'seeding')).toBe('7 days before seeding');
    expect(timingWords(-1, -1, 'seeding')).toBe('1 day before seeding');
  });
});

describe('practice steps in words', () => {
  const practice = starterPractice('fall-brassica-plot');
  const step = (key: string) => practice.steps.find((s) => s.key === key)!;

  it('calls a seeding anchor "seeding" and shows the window on the anchor step', () => {
    expect(anchorNoun(practice)).toBe('seeding');
    expect(stepTimingText(step('burn-down'), practice)).toBe('7–14 days before seeding');
    expect(stepTimingText(step('seed'), practice)).toBe('In the fall brassicas (rape, turnip, radish) window'); // planting-windows.ts label
  });

  it('lists the seed mix with rates per acre, the spray products and the sprayer set-up', () => {
    // Starter library values: radish 2.7, turnip 1.65, rape 4 lb/acre broadcast; glyphosate 2 qt/acre, surfactant 0.25 %, 15 GPA, 25-gal tank.
    expect(applicationLines(step('seed').application, STARTER_MATERIALS)).toEqual([
      'Forage radish seed: 2.7 lb/acre broadcast, 30 % of the mix',
      'Purple-top turnip seed: 1.65 lb/acre broadcast, 30 % of the mix',
      'Dwarf Essex rape seed: 4 lb/acre broadcast, 40 % of the mix',
    ]);
    expect(applicationLines(step('burn-down').application, STARTER_MATERIALS)).toEqual([
      'Glyphosate 41% (3 lb a.e./gal): 2 qt/acre',
      'Nonionic surfactant (80%): 0.25 % of the spray',
      '15 gal/acre spray volume, 25-gal tank',
    ]);
    expect(applicationLines(step('lime').application, STARTER_MATERIALS)).toEqual(['Agricultural lime, delivered and spread: 2 t/acre']);
    expect(applicationLines(step('fertilize').application, STARTER_MATERIALS)).toEqual(['13-13-13 fertilizer: N 40 · P₂O₅ 40 · K₂O 40 lb/acre']);
  });

  it('names each service’s rate with its productivity or fixed quantity', () => {
    const [mobilization, disc] = step('disc').services!;
    expect(serviceText(mobilization, STARTER_RATES)).toBe('Crew and equipment mobilization — × 1');
    expect(serviceText(disc, STARTER_RATES)).toBe('Tractor and disc — 0.75 h/acre');
    expect(serviceText({ rateKey: 'rate-gone' }, STARTER_RATES)).toBe('rate-gone (not in the library)');
  });
});
