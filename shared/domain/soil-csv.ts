/**
 * A lab's soil-test results file, column by column: which of our fields each of the lab's columns holds
 * (guessed from the header, changed by the person), and one row as the body `POST /api/units/:id/soil-tests`
 * takes. Pure: the browser previews with it and the server imports with it, so both read a row alike.
 */
import type { SoilLabMethod } from './soil-tests';

/** The fields a row can carry, in the order the screen lists them. */
export const SOIL_CSV_FIELDS = ['unit', 'sampledOn', 'lab', 'ph', 'bufferPh', 'bufferMethod', 'labMethod', 'pPpm', 'kPpm', 'organicMatterPct', 'cec', 'enmLbPerAcre'] as const;
export type SoilCsvField = (typeof SOIL_CSV_FIELDS)[number];

/** Fields every row needs; the rest may be left unmapped. */
export const SOIL_CSV_REQUIRED: readonly SoilCsvField[] = ['unit', 'sampledOn', 'lab', 'ph'];

export const SOIL_CSV_FIELD_LABELS: Record<SoilCsvField, string> = {
  unit: 'Unit name',
  sampledOn: 'Date sampled',
  lab: 'Laboratory',
  ph: 'Soil pH',
  bufferPh: 'Buffer pH',
  bufferMethod: 'Buffer method',
  labMethod: 'P and K method',
  pPpm: 'P, ppm',
  kPpm: 'K, ppm',
  organicMatterPct: 'Organic matter, %',
  cec: 'CEC, meq/100 g',
  enmLbPerAcre: 'ENM, lb/acre',
};

/** Which lab column holds each field (a header exactly as the file writes it). */
export type SoilCsvColumns = Partial<Record<SoilCsvField, string>>;

const NUMERIC: readonly SoilCsvField[] = ['ph', 'bufferPh', 'pPpm', 'kPpm', 'organicMatterPct', 'cec', 'enmLbPerAcre'];

/** Header words labs commonly use for each field (common practice, no source), compared without case, spaces or punctuation. */
const ALIASES: Record<SoilCsvField, string[]> = {
  unit: ['unit', 'unitname', 'field', 'fieldname', 'fieldid', 'plot', 'plotname', 'sampleid', 'sample', 'samplename'],
  sampledOn: ['sampledon', 'datesampled', 'sampledate', 'sampled', 'date'],
  lab: ['lab', 'laboratory', 'labname'],
  ph: ['ph', 'soilph', 'phwater', 'waterph', 'saltph', 'phs'],
  bufferPh: ['bufferph', 'bph', 'buffer'],
  bufferMethod: ['buffermethod', 'bufferused'],
  labMethod: ['labmethod', 'extractant', 'pkmethod', 'extractionmethod'],
  pPpm: ['pppm', 'p', 'phosphorus', 'phosphorusppm', 'mehlichp', 'm3p', 'bray1p', 'brayp'],
  kPpm: ['kppm', 'k', 'potassium', 'potassiumppm', 'mehlichk', 'm3k'],
  organicMatterPct: ['organicmatterpct', 'organicmatter', 'om', 'ompct', 'omp'],
  cec: ['cec', 'cecmeq100g', 'cationexchangecapacity'],
  enmLbPerAcre: ['enmlbperacre', 'enm', 'enmlbacre', 'enmrecommendation'],
};

const squash = (header: string) => header.toLowerCase().replace(/[^a-z0-9]/g, '');

/** Our best guess of the column for each field from the file's header row; each column used at most once. */
export function guessSoilCsvColumns(headers: readonly string[]): SoilCsvColumns {
  const columns: SoilCsvColumns = {};
  const taken = new Set<string>();
  for (const field of SOIL_CSV_FIELDS) {
    const hit = headers.find((h) => !taken.has(h) && ALIASES[field].includes(squash(h)));
    if (hit !== undefined) {
      columns[field] = hit;
      taken.add(hit);
    }
  }
  return columns;
}

/** The required fields no column is mapped to. */
export function unmappedRequired(columns: SoilCsvColumns): SoilCsvField[] {
  return SOIL_CSV_REQUIRED.filter((f) => !columns[f]);
}

/** A number as a lab file writes it ("1,600", " 5.8 "); empty → null; anything else stays text for the schema to refuse. */
function numberCell(text: string | undefined): number | string | null {
  const t = (text ?? '').trim().replace(/,/g, '');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : t;
}

/** How labs write their extractant (common practice, no source), compared without case, spaces or punctuation. */
const LAB_METHOD_WORDS: Record<string, SoilLabMethod> = {
  mehlich3: 'mehlich-3', m3: 'mehlich-3', mehlichiii: 'mehlich-3', mehlich3icp: 'mehlich-3',
  bray: 'bray-nh4oac', bray1: 'bray-nh4oac', brayp1: 'bray-nh4oac', braynh4oac: 'bray-nh4oac', brayaa: 'bray-nh4oac', nh4oac: 'bray-nh4oac', ammoniumacetate: 'bray-nh4oac', aa: 'bray-nh4oac',
};

/** A lab's extractant cell as our method; empty → null (Bray/ammonium acetate); anything else stays text for the schema to refuse. */
function labMethodCell(text: string): string | null {
  if (text === '') return null;
  return LAB_METHOD_WORDS[squash(text)] ?? text;
}

/** One file row as the unit's name and the soil-test body (before the shared schema checks it). */
export function soilCsvRowBody(record: Record<string, string>, columns: SoilCsvColumns): { unitName: string; body: Record<string, unknown> } {
  const cell = (field: SoilCsvField) => (columns[field] ? (record[columns[field]] ?? '').trim() : '');
  const body: Record<string, unknown> = { sampledOn: cell('sampledOn'), lab: cell('lab'), bufferMethod: cell('bufferMethod').toLowerCase() || null, labMethod: labMethodCell(cell('labMethod')) };
  for (const field of NUMERIC) {
    const value = numberCell(cell(field));
    if (value !== null || field !== 'ph') body[field] = value;
  }
  return { unitName: cell('unit'), body };
}

/** The key a unit name is matched by (case and surrounding spaces ignored). */
export const unitNameKey = (name: string) => name.trim().toLowerCase();
