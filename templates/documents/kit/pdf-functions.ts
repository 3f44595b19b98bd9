/**
 * Document definitions cross into the PDF worker thread by structured clone, which carries data but
 * no functions. Two kinds of functions appear in our definitions, and each gets across its own way:
 *
 * - named functions (page header and footer, page-break rules): made with `pdfFunction(name, args)`
 *   from a factory registered under that name in every thread; they travel as `{ name, args }`;
 * - table layouts (line widths, colours, paddings per row or column): evaluated here for every row
 *   and column of their table and sent as tables of values, looked up again in the worker.
 *
 * Any other function in a definition is refused with a sentence that says what to do.
 */
import type { TDocumentDefinitions } from 'pdfmake/interfaces';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyFn = (...args: any[]) => unknown;
type Factory = (args: never) => AnyFn;

const factories = new Map<string, Factory>();
const TAG = Symbol('pdf-function');
type Tagged = AnyFn & { [TAG]?: { name: string; args: unknown } };

/** Registers a factory of a function that document definitions may use by name (same in every thread). */
export function registerPdfFunction<A>(name: string, factory: (args: A) => AnyFn): void {
  factories.set(name, factory as unknown as Factory);
}

/** A registered function made with its (structured-clonable) arguments, able to cross into a worker. */
export function pdfFunction<F extends AnyFn, A = undefined>(name: string, args?: A): F {
  const factory = factories.get(name);
  if (!factory) throw new Error(`No document function is registered under "${name}".`);
  const fn = factory(args as never) as Tagged;
  fn[TAG] = { name, args };
  return fn as unknown as F;
}

interface PackedFunction {
  __pdfFunction: string;
  args: unknown;
}
interface PackedLayout {
  __pdfLayout: Record<string, { matrix: boolean; values: unknown[] }>;
  rest: Record<string, unknown>;
}

/** Layout members pdfmake calls with a third index (column of a row line, row of a column line). */
const MATRIX_KEYS = new Set(['hLineColor', 'vLineColor', 'fillColor', 'fillOpacity']);
/** Members indexed by column (vertical lines and left/right paddings); the others by row. */
const COLUMN_KEYS = new Set(['vLineWidth', 'vLineColor', 'vLineStyle', 'paddingLeft', 'paddingRight']);

/** A layout member's value at an index; an index the function cannot answer for is left undefined. */
function valueAt(fn: AnyFn, node: unknown, i: number, j?: number): unknown {
  try {
    return j === undefined ? fn(i, node) : fn(i, node, j);
  } catch {
    return undefined;
  }
}

function tabulateLayout(layout: Record<string, unknown>, node: { table: { body: unknown[][]; widths?: unknown[] } }): PackedLayout {
  const rows = node.table.body.length;
  const cols = node.table.widths?.length ?? node.table.body[0]?.length ?? 0;
  const packed: PackedLayout = { __pdfLayout: {}, rest: {} };
  for (const [key, value] of Object.entries(layout)) {
    if (typeof value !== 'function') {
      packed.rest[key] = value;
      continue;
    }
    // One more index than rows or columns (lines lie between and around them).
    const first = COLUMN_KEYS.has(key) ? cols + 1 : rows + 1;
    const second = key === 'fillColor' || key === 'fillOpacity' || key === 'hLineColor' ? cols + 1 : rows + 1;
    const values: unknown[] = [];
    let matrix = false;
    for (let i = 0; i < first; i++) {
      if (!MATRIX_KEYS.has(key)) {
        values.push(valueAt(value as AnyFn, node, i));
        continue;
      }
      const row: unknown[] = [];
      for (let j = 0; j < second; j++) row.push(valueAt(value as AnyFn, node, i, j));
      if (row.some((v) => v !== row[0])) matrix = true;
      values.push(row);
    }
    packed.__pdfLayout[key] = { matrix, values: matrix || !MATRIX_KEYS.has(key) ? values : values.map((r) => (r as unknown[])[0]) };
  }
  return packed;
}

function pack(value: unknown, path: string): unknown {
  if (typeof value === 'function') {
    const tag = (value as Tagged)[TAG];
    if (!tag) {
      throw new Error(`The document definition holds a function at ${path}; make it with pdfFunction(name, args) so that it can be rendered in the PDF worker.`);
    }
    return { __pdfFunction: tag.name, args: tag.args } satisfies PackedFunction;
  }
  if (value === null || typeof value !== 'object' || ArrayBuffer.isView(value) || value instanceof ArrayBuffer) return value;
  if (Array.isArray(value)) return value.map((v, i) => pack(v, `${path}[${i}]`));
  const out: Record<string, unknown> = {};
  const record = value as Record<string, unknown>;
  for (const [key, v] of Object.entries(record)) {
    if (key === 'layout' && v && typeof v === 'object' && record.table && typeof record.table === 'object') {
      out.layout = tabulateLayout(v as Record<string, unknown>, record as unknown as { table: { body: unknown[][]; widths?: unknown[] } });
    } else {
      out[key] = pack(v, `${path}.${key}`);
    }
  }
  return out;
}

/** A definition made fit for structured clone: named functions as names, layouts as value tables. */
export function packDefinition(definition: TDocumentDefinitions): unknown {
  return pack(definition, 'definition');
}

function lookup(table: { matrix: boolean; values: unknown[] }): AnyFn {
  const { matrix, values } = table;
  return (i: number, _node: unknown, j?: number) => {
    const v = values[Math.min(Math.max(i, 0), values.length - 1)];
    return matrix ? (v as unknown[])[Math.min(Math.max(j ?? 0, 0), (v as unknown[]).length - 1)] : v;
  };
}

function unpack(value: unknown): unknown {
  if (value === null || typeof value !== 'object' || ArrayBuffer.isView(value) || value instanceof ArrayBuffer) return value;
  if (Array.isArray(value)) return value.map(unpack);
  const record = value as Record<string, unknown>;
  if (typeof record.__pdfFunction === 'string') return pdfFunction(record.__pdfFunction, record.args);
  if (record.__pdfLayout && typeof record.__pdfLayout === 'object') {
    const packed = record as unknown as PackedLayout;
    const layout: Record<string, unknown> = { ...packed.rest };
    for (const [key, table] of Object.entries(packed.__pdfLayout)) layout[key] = lookup(table);
    return layout;
  }
  const out: Record<string, unknown> = {};
  for (const [key, v] of Object.entries(record)) out[key] = unpack(v);
  return out;
}

/** The definition again, in the worker: names made into their functions, value tables into layouts. */
export function unpackDefinition(packed: unknown): TDocumentDefinitions {
  return unpack(packed) as TDocumentDefinitions;
}
