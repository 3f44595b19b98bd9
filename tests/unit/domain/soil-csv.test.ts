import { describe, expect, it } from 'vitest';
import { guessSoilCsvColumns, soilCsvRowBody, unmappedRequired } from '../../../shared/domain/soil-csv';
import { recommendSoilTest } from '../../../shared/domain/soil-tests';
import { SoilTestCreateSchema } from '../../../shared/schemas/soil-tests';

describe('reading a lab’s soil-test file column by column', () => {
  it('guesses our fields from a lab’s header words (common practice, no source)', () => {
    const columns = guessSoilCsvColumns(['Field ID', 'Date Sampled', 'Lab', 'Soil pH', 'Buffer pH', 'P (ppm)', 'K (ppm)', 'OM %', 'Notes']);
    expect(columns).toEqual({ unit: 'Field ID', sampledOn: 'Date Sampled', lab: 'Lab', ph: 'Soil pH', bufferPh: 'Buffer pH', pPpm: 'P (ppm)', kPpm: 'K (ppm)', organicMatterPct: 'OM %' });
    expect(unmappedRequired(columns)).toEqual([]);
    expect(unmappedRequired({ unit: 'Field ID' })).toEqual(['sampledOn', 'lab', 'ph']);
  });

  it('takes our own header names as they are', () => {
    const columns = guessSoilCsvColumns(['unit', 'sampledOn', 'lab', 'ph', 'bufferMethod', 'bufferPh', 'enmLbPerAcre', 'kPpm', 'pPpm', 'cec']);
    expect(columns).toMatchObject({ unit: 'unit', bufferMethod: 'bufferMethod', bufferPh: 'bufferPh', enmLbPerAcre: 'enmLbPerAcre', pPpm: 'pPpm', kPpm: 'kPpm', cec: 'cec' });
  });

  it('reads numbers with thousands separators, leaves empty cells out and text for the schema to refuse', () => {
    const columns = { unit: 'F', sampledOn: 'D', lab: 'L', ph: 'pH', enmLbPerAcre: 'ENM', bufferMethod: 'B' };
    const { unitName, body } = soilCsvRowBody({ F: ' North plot ', D: '2026-03-01', L: 'Lab', pH: '5.8', ENM: '1,600', B: 'Woodruff' }, columns);
    expect(unitName).toBe('North plot');
    expect(body).toMatchObject({ ph: 5.8, enmLbPerAcre: 1600, bufferMethod: 'woodruff' });
    expect(SoilTestCreateSchema.safeParse(soilCsvRowBody({ F: 'x', D: '2026-03-01', L: 'Lab', pH: 'acid' }, columns).body).error?.issues[0]?.path).toEqual(['ph']);
    expect(SoilTestCreateSchema.safeParse(soilCsvRowBody({ F: 'x', D: '2026-03-01', L: 'Lab', pH: '' }, columns).body).error?.issues[0]?.path).toEqual(['ph']);
  });
});

describe('the lab’s P and K method column', () => {
  it('finds the extractant column and reads the usual ways labs write it (common practice, no source)', () => {
    const columns = guessSoilCsvColumns(['Field ID', 'Date', 'Lab', 'Soil pH', 'Extractant', 'P (ppm)', 'K (ppm)']);
    expect(columns.labMethod).toBe('Extractant');
    const row = (method: string) => soilCsvRowBody({ 'Field ID': 'North plot', Date: '2026-03-01', Lab: 'Lab', 'Soil pH': '6.6', Extractant: method, 'P (ppm)': '27', 'K (ppm)': '114' }, columns).body;
    expect(row('Mehlich-3').labMethod).toBe('mehlich-3');
    expect(row('M3').labMethod).toBe('mehlich-3');
    expect(row('Mehlich III').labMethod).toBe('mehlich-3');
    expect(row('Bray P1').labMethod).toBe('bray-nh4oac');
    expect(row('').labMethod).toBeNull();
    // Anything else stays text and the shared schema refuses it, naming the field
    expect(SoilTestCreateSchema.safeParse(row('Olsen')).error?.issues[0]?.path).toEqual(['labMethod']);
    // A Mehlich-3 row is worked on the converted values (Ohio State ANR-75): M3 P 27 → Bray 20; brassica (25 − 20) × 20 ÷ 4 + 40 = 65
    const parsed = SoilTestCreateSchema.parse(row('Mehlich-3'));
    expect(recommendSoilTest({ ...parsed, bufferMethod: null }, { method: 'missouri', cropGroup: 'brassica', limeEnmLbPerTon: 400 }).nutrients.p2o5LbPerAcre).toBe(65);
  });
});

describe('the one recommendation the server stores and the browser previews', () => {
  it('works the NCDA&CS example to the crop group’s target pH and names the target’s source', () => {
    // NCDA&CS formula (ncagr.gov buffer acidity table): (6.6 − 6.3) × 4 = 1.2 × (6.3 − 5.0) ÷ (6.6 − 5.0) = 0.975 → 0.98; brassica target 6.3 from memory
    const r = recommendSoilTest({ ph: 5.0, bufferPh: 6.3, bufferMethod: 'mehlich' }, { method: 'ncdacs', cropGroup: 'brassica', limeEnmLbPerTon: 400 });
    expect(r.lime.tonsPerAcre).toBe(0.98);
    expect(r.lime.source).toMatch(/target pH 6.3 \(from memory/);
    // University of Missouri: 1,600 lb ENM ÷ 400 lb ENM/ton = 4 t/acre (MU Extension)
    expect(recommendSoilTest({ ph: 5.4, enmLbPerAcre: 1600 }, { method: 'missouri', cropGroup: 'legume', limeEnmLbPerTon: 400 }).lime.tonsPerAcre).toBe(4);
  });
});
