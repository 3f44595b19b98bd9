import { describe, expect, it } from 'vitest';
import { keepUntil, SPRAY_CSV_COLUMNS, sprayRecordsCsv, isHerbicideTask } from '../../../shared/domain/spray-records';

const row = { appliedOn: '2026-07-20', propertyName: 'Kettle "Hollow", Farm', unitName: '=North plot', latitude: 43.2659, longitude: -90.9373, cropOrSite: 'food plot', areaTreated: 0.22, areaUnit: 'acres', productName: 'Glyphosate', epaRegNo: null, restrictedUse: false, amount: 1.4, amountUnit: 'qt', applicatorName: 'Sam', applicatorCertNo: null, windMph: 4, windDirection: 'SW', airTempF: 78 };

describe('spray records', () => {
  it('are kept two years from the application (7 CFR 110.5), Feb 29 to Mar 1', () => {
    expect(keepUntil('2026-07-20')).toBe('2028-07-20');
    expect(keepUntil('2028-02-29')).toBe('2030-03-01');
  });

  it('write CSV per RFC 4180: quotes doubled, commas quoted, formulas defused, CRLF', () => {
    const csv = sprayRecordsCsv([row]);
    const [head, line] = csv.split('\r\n');
    expect(head.split(',')).toHaveLength(SPRAY_CSV_COLUMNS.length);
    expect(line).toBe(`2026-07-20,"Kettle ""Hollow"", Farm",'=North plot,43.2659,-90.9373,food plot,0.22,acres,Glyphosate,,no,1.4,qt,Sam,,4,SW,78`);
    expect(csv.endsWith('\r\n')).toBe(true);
  });

  it('know a herbicide step by its kind or its caution', () => {
    expect(isHerbicideTask({ kind: 'spray' })).toBe(true);
    expect(isHerbicideTask({ kind: 'other', cautions: [{ id: 'herbicide' }] })).toBe(true);
    expect(isHerbicideTask({ kind: 'seed', cautions: [{ id: 'tree-stand' }] })).toBe(false);
  });
});
