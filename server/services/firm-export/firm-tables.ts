/**
 * The firm's rows, table by table, as CSV pages: every table that has a firm_id (or points by a
 * foreign key to one that has), read in pages by id so memory stays bounded whatever the firm's size.
 * Secrets (password and token hashes) and the machinery's own tables are left out.
 */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { csvField, guardFormula } from '../geo-files/write-csv';

/** Tables that are the app's machinery or hold secrets, not the firm's records. */
const LEFT_OUT_TABLES = new Set(['background_jobs', 'outbox_messages', 'calendar_feeds', 'auth_tokens', 'rate_limit_hits', 'firm_counters', 'firm_exports', 'sessions']);
/** Columns never exported: secrets. */
const LEFT_OUT_COLUMNS = new Set(['password_hash', 'token_hash']);
/** Rows read per query. */
export const EXPORT_PAGE_ROWS = 500;

export interface FirmTable {
  table: string;
  columns: { name: string; geometry: boolean }[];
  /** SQL condition selecting the firm's rows (uses :firmId). */
  where: string;
  keyset: boolean;
}

/** The firm's tables and how to find its rows in each, from the database's own catalogue. */
export async function firmTables(): Promise<FirmTable[]> {
  const columns = await sequelize.query<{ table_name: string; column_name: string; udt_name: string }>(
    `SELECT c.table_name, c.column_name, c.udt_name FROM information_schema.columns c
       JOIN information_schema.tables t ON t.table_schema = c.table_schema AND t.table_name = c.table_name
      WHERE c.table_schema = 'public' AND t.table_type = 'BASE TABLE' ORDER BY c.table_name, c.ordinal_position`,
    { type: QueryTypes.SELECT },
  );
  const foreignKeys = await sequelize.query<{ child: string; col: string; parent: string }>(
    `SELECT conrelid::regclass::text AS child, a.attname AS col, confrelid::regclass::text AS parent
       FROM pg_constraint k JOIN pg_attribute a ON a.attrelid = k.conrelid AND a.attnum = k.conkey[1]
      WHERE k.contype = 'f' AND array_length(k.conkey, 1) = 1 AND k.connamespace = 'public'::regnamespace
      ORDER BY 1, 2`,
    { type: QueryTypes.SELECT },
  );
  const byTable = new Map<string, { name: string; udt: string }[]>();
  for (const c of columns) byTable.set(c.table_name, [...(byTable.get(c.table_name) ?? []), { name: c.column_name, udt: c.udt_name }]);
  const hasFirmId = (t: string) => byTable.get(t)?.some((c) => c.name === 'firm_id') ?? false;
  const out: FirmTable[] = [];
  for (const [table, cols] of byTable) {
    if (LEFT_OUT_TABLES.has(table)) continue;
    let where: string | null = null;
    if (table === 'firms') where = 'id = :firmId';
    else if (hasFirmId(table)) where = 'firm_id = :firmId';
    else {
      const fk = foreignKeys.find((f) => f.child === table && hasFirmId(f.parent) && !LEFT_OUT_TABLES.has(f.parent));
      if (fk) where = `"${fk.col}" IN (SELECT id FROM "${fk.parent}" WHERE firm_id = :firmId)`;
    }
    if (!where) continue;
    out.push({
      table,
      columns: cols.filter((c) => !LEFT_OUT_COLUMNS.has(c.name)).map((c) => ({ name: c.name, geometry: c.udt === 'geometry' })),
      where,
      keyset: cols.some((c) => c.name === 'id' && (c.udt === 'int4' || c.udt === 'int8')),
    });
  }
  return out;
}

/** One value as CSV text: JSON for objects, ISO 8601 for times, formulas defused. */
export function csvValue(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (value instanceof Date) return value.toISOString();
  if (typeof value === 'object') return csvField(guardFormula(JSON.stringify(value)));
  return csvField(guardFormula(String(value)));
}

/** The table's CSV (header line, then the firm's rows), page by page. */
export async function* tableCsv(spec: FirmTable, firmId: number): AsyncGenerator<string> {
  yield `${spec.columns.map((c) => csvField(c.name)).join(',')}\r\n`;
  const select = spec.columns.map((c) => (c.geometry ? `ST_AsGeoJSON("${c.name}") AS "${c.name}"` : `"${c.name}"`)).join(', ');
  let lastId = 0;
  for (let offset = 0; ; offset += EXPORT_PAGE_ROWS) {
    const rows = await sequelize.query<Record<string, unknown>>(
      spec.keyset
        ? `SELECT ${select} FROM "${spec.table}" WHERE (${spec.where}) AND id > :lastId ORDER BY id LIMIT :limit`
        : `SELECT ${select} FROM "${spec.table}" WHERE ${spec.where} ORDER BY 1 LIMIT :limit OFFSET :offset`,
      { replacements: { firmId, lastId, limit: EXPORT_PAGE_ROWS, offset }, type: QueryTypes.SELECT },
    );
    if (rows.length === 0) return;
    yield rows.map((row) => `${spec.columns.map((c) => csvValue(row[c.name])).join(',')}\r\n`).join('');
    if (rows.length < EXPORT_PAGE_ROWS) return;
    lastId = Number(rows[rows.length - 1]!.id);
  }
}
