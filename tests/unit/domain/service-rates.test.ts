import { describe, expect, it } from 'vitest';
import { computeServiceLine, type ServiceRate } from '../../../shared/domain/service-rates';
import { validationErrorOf } from './support';

// Rates and prices below are invented test values.
const perAcre: ServiceRate = { key: 'disc', name: 'Tractor and disc', category: 'equipment', basis: 'per-acre', unitPriceCents: 6000, minimumCents: 12000 };
const perHour: ServiceRate = { key: 'labor', name: 'Field crew labor', category: 'labor', basis: 'per-hour', unitPriceCents: 4800 };
const per100Ft: ServiceRate = { key: 'trail', name: 'Trail clearing crew', category: 'labor', basis: 'per-100-ft', unitPriceCents: 3000 };
const perEach: ServiceRate = { key: 'mob', name: 'Mobilization', category: 'fees', basis: 'per-each', unitPriceCents: 12500 };

describe('labor, equipment and fee lines', () => {
  it('charges per acre, per hour from productivity, per 100 ft and per each', () => {
    expect(computeServiceLine({ rate: perAcre, measures: { acres: 2.4 } })).toMatchObject({ quantity: 2.4, unit: 'acre', amountCents: 14400, minimumApplied: false });
    const labor = computeServiceLine({ rate: perHour, measures: { acres: 2.4 }, productivity: { hoursPerAcre: 0.75 } });
    expect(labor).toMatchObject({ quantity: 1.8, unit: 'hour', amountCents: 8640 }); // 2.4 acres × 0.75 h/acre × $48 (worked example)
    expect(labor.hours).toBeCloseTo(1.8, 12);
    expect(computeServiceLine({ rate: per100Ft, measures: { lengthFt: 1250 } })).toMatchObject({ quantity: 12.5, unit: '100 ft', amountCents: 37500 });
    expect(computeServiceLine({ rate: perEach, measures: { count: 3 } })).toMatchObject({ quantity: 3, amountCents: 37500 });
    expect(computeServiceLine({ rate: perEach, measures: {}, quantity: 1 }).amountCents).toBe(12500);
  });

  it('reports hours for rates not charged by the hour when a productivity is given', () => {
    const line = computeServiceLine({ rate: per100Ft, measures: { lengthFt: 1250 }, productivity: { hoursPer100Ft: 0.6 } });
    expect(line.hours).toBeCloseTo(7.5, 12);
    expect(computeServiceLine({ rate: perAcre, measures: { acres: 1 } }).hours).toBeNull();
    expect(computeServiceLine({ rate: perHour, measures: { count: 2 }, productivity: { hoursPerEach: 0.75 } }).hours).toBe(1.5);
    expect(computeServiceLine({ rate: perHour, measures: {}, productivity: { fixedHours: 4 } }).quantity).toBe(4);
  });

  it('applies the minimum charge when the calculated amount falls short', () => {
    const line = computeServiceLine({ rate: perAcre, measures: { acres: 0.5 } });
    expect(line.calculatedCents).toBe(3000); // 0.5 acre × $60 (worked example)
    expect(line.minimumApplied).toBe(true);
    expect(line.amountCents).toBe(12000);
    const none = computeServiceLine({ rate: perAcre, measures: { acres: 0 } });
    expect(none.amountCents).toBe(0); // no work, no minimum
  });

  it('rounds the quantity to 2 decimals and the amount once, half up', () => {
    const rate: ServiceRate = { ...perHour, unitPriceCents: 33 };
    // 1.5 h × 33 ¢ = 49.5 ¢ → 50 ¢ (half up, documented rule)
    expect(computeServiceLine({ rate, measures: {}, productivity: { fixedHours: 1.5 } }).amountCents).toBe(50);
    // 1.234 h → 1.23 h on the line × $48.50 = $59.655 → $59.66
    expect(computeServiceLine({ rate: { ...perHour, unitPriceCents: 4850 }, measures: {}, productivity: { fixedHours: 1.234 } })).toMatchObject({ quantity: 1.23, amountCents: 5966 });
  });

  it('asks for what a rate needs', () => {
    expect(validationErrorOf(() => computeServiceLine({ rate: perHour, measures: { acres: 1 } })).field).toBe('service.productivity');
    expect(validationErrorOf(() => computeServiceLine({ rate: perAcre, measures: {} })).field).toBe('unit.acres');
    expect(validationErrorOf(() => computeServiceLine({ rate: per100Ft, measures: {} })).field).toBe('unit.lengthFt');
    expect(validationErrorOf(() => computeServiceLine({ rate: { ...perAcre, unitPriceCents: -5 }, measures: { acres: 1 } })).field).toBe('service.rate.unitPriceCents');
    expect(validationErrorOf(() => computeServiceLine({ rate: perEach, measures: { count: 1.5 } })).field).toBe('unit.count');
  });
});
