/**
 * A lab file in the browser: parsed with csv-parse (loaded only when a file is chosen), each row read through
 * the shared column mapping and schema, matched to a unit and worked by the shared recommendation — the
 * problems per row are the ones the server would refuse the import for.
 */
import { soilCsvRowBody, unitNameKey, type SoilCsvColumns } from '../../../../shared/domain/soil-csv';
import { SoilTestCreateSchema, SOIL_CSV_MAX_ROWS, type SoilTestContextDto } from '../../../../shared/schemas/soil-tests';
import { recommendSoilTest } from '../../../../shared/domain/soil-tests';
import { DomainValidationError } from '../../../../shared/domain/errors';

export interface ParsedCsv {
  headers: string[];
  records: Record<string, string>[];
}

/** Reads CSV text (header row first) into its headers and rows; throws a sentence when it is not CSV. */
export async function parseSoilCsv(text: string): Promise<ParsedCsv> {
  const { parse } = await import('csv-parse/browser/esm/sync');
  let headers: string[] = [];
  const records = parse(text, { columns: (h: string[]) => (headers = h.map((x) => x.trim())), skip_empty_lines: true, trim: true, bom: true }) as Record<string, string>[];
  if (records.length > SOIL_CSV_MAX_ROWS) throw new Error(`The file has ${records.length} rows; import at most ${SOIL_CSV_MAX_ROWS} at a time.`);
  return { headers, records };
}

export interface CheckedRow {
  /** The file's row number (the header is row 1), as the server's problems name it. */
  row: number;
  unitName: string;
  unitId: number | null;
  ph: string;
  recommendation: string | null;
  problems: { field: string; message: string }[];
}

/** Every row of the file checked as the server will check it, with its lime and P and K when it passes. */
export function checkSoilCsvRows(parsed: ParsedCsv, columns: SoilCsvColumns, context: SoilTestContextDto): CheckedRow[] {
  const units = new Map(context.units.map((u) => [unitNameKey(u.name), u]));
  return parsed.records.map((record, i) => {
    const { unitName, body } = soilCsvRowBody(record, columns);
    const unit = units.get(unitNameKey(unitName));
    const out: CheckedRow = { row: i + 2, unitName, unitId: unit?.unitId ?? null, ph: columns.ph ? (record[columns.ph] ?? '') : '', recommendation: null, problems: [] };
    if (!unit) out.problems.push({ field: 'unit', message: unitName ? `“${unitName}” is not a unit of this property` : 'no unit name' });
    const parsedRow = SoilTestCreateSchema.safeParse(body);
    if (!parsedRow.success) {
      for (const issue of parsedRow.error.issues) out.problems.push({ field: issue.path.join('.') || 'row', message: issue.message });
      return out;
    }
    if (!unit) return out;
    try {
      const r = recommendSoilTest({ ...parsedRow.data, bufferMethod: parsedRow.data.bufferMethod ?? null }, { method: context.method, cropGroup: unit.cropGroup, limeEnmLbPerTon: unit.limeEnmLbPerTon });
      out.recommendation = `Lime ${r.lime.tonsPerAcre} t/acre to pH ${r.lime.targetPh}; P2O5 ${r.nutrients.p2o5LbPerAcre}, K2O ${r.nutrients.k2oLbPerAcre} lb/acre`;
    } catch (error) {
      if (error instanceof DomainValidationError) out.problems.push({ field: error.field, message: error.message });
      else throw error;
    }
    return out;
  });
}
