import { describe, expect, it } from 'vitest';
import { CompleteFormSchema, completeFormDefaults, completionFields } from '../../../../src/features/field/lib/complete-form';
import { completionForm } from '../../../../src/features/field/lib/completion-queue';

const quantities = [
  { key: 'herb-glyphosate-41', label: 'Glyphosate 41%', amount: 0.34, unit: 'gal', rateText: '1.5 qt/acre' },
  { key: 'labor:Spray', label: 'Spraying', amount: 1, unit: 'hour', rateText: '' },
];
const sprayStep = { kind: 'spray', cautions: [{ id: 'herbicide' }], unitName: 'North plot' };

describe('the spray record in "Mark done" for a herbicide step', () => {
  it('starts from the planned products only; other steps carry no spray record', () => {
    const d = completeFormDefaults(quantities, '2026-07-20', sprayStep);
    expect(d.spray?.products).toEqual([{ materialKey: 'herb-glyphosate-41', amount: 0.34, unit: 'gal' }]);
    expect(d.spray?.cropOrSite).toBe('North plot');
    expect(completeFormDefaults(quantities, '2026-07-20', { kind: 'seed', cautions: [] }).spray).toBeUndefined();
  });

  it('asks for the wind, the temperature, the area and the applicator before it saves', () => {
    const bad = CompleteFormSchema.safeParse(completeFormDefaults(quantities, '2026-07-20', sprayStep));
    expect(bad.success).toBe(false);
    const paths = (bad.error?.issues ?? []).map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['spray.areaTreatedAcres', 'spray.windMph', 'spray.airTempF', 'spray.applicatorName']));
  });

  it('sends the record as JSON text beside the other fields', () => {
    const d = completeFormDefaults(quantities, '2026-07-20', sprayStep);
    const out = CompleteFormSchema.parse({ ...d, spray: { ...d.spray, areaTreatedAcres: 0.22, windMph: 4, windDirection: 'SW', airTempF: 78, applicatorName: 'Sam Crew', applicatorCertNo: '' } });
    const fields = completionFields(out);
    expect(fields.spray).toMatchObject({ windDirection: 'SW', applicatorCertNo: null });
    const form = completionForm({ key: 'k-12345678', taskId: 1, taskName: 'Burn down', unitName: 'North plot', fields, photos: [], savedAt: '2026-07-20T10:00:00Z' } as never);
    expect(JSON.parse(String(form.get('spray')))).toMatchObject({ areaTreatedAcres: 0.22, products: [{ materialKey: 'herb-glyphosate-41' }] });
  });
});
