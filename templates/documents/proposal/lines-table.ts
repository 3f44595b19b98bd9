/**
 * The priced lines grouped by unit (options marked, options not chosen greyed) and the subtotal by category.
 */
import type { DisplayUnits } from '../../../shared/units';
import { DOC_COLORS, FONT_HEADING, ruledTableLayout } from '../kit/layout';
import type { Content, CustomTableLayout, TableCell } from 'pdfmake/interfaces';
import { quantityWithUnit, sizeOf, swatch } from './format';
import type { DocGroup, DocLine } from './input';
import { GREYED, GROUP_ROW_ID } from './look';

interface LineGroup {
  label: string;
  group: DocGroup | null;
  lines: DocLine[];
}

/** Lines grouped by unit: groups in the order given, then any other labels in order of first use. */
export function groupLines(lines: readonly DocLine[], groups: readonly DocGroup[]): LineGroup[] {
  const byLabel = new Map<string, LineGroup>();
  for (const g of groups) if (!byLabel.has(g.label)) byLabel.set(g.label, { label: g.label, group: g, lines: [] });
  for (const line of lines) {
    const label = line.groupLabel.trim() || 'General';
    let entry = byLabel.get(label);
    if (!entry) {
      entry = { label, group: null, lines: [] };
      byLabel.set(label, entry);
    }
    entry.lines.push(line);
  }
  return [...byLabel.values()].filter((g) => g.lines.length > 0);
}

function lineRow(line: DocLine, money: (c: number) => string): TableCell[] {
  const notIncluded = line.optional && !line.included;
  const color = notIncluded ? GREYED : DOC_COLORS.ink;
  const tag = line.optional ? [{ text: 'OPTION  ', fontSize: 7.5, bold: true, color: notIncluded ? GREYED : DOC_COLORS.moss, characterSpacing: 0.6 }] : [];
  return [
    { text: [...tag, { text: line.description }], style: 'tableCell', color },
    { text: quantityWithUnit(line.quantity, line.unit), style: 'tableCell', alignment: 'right', color },
    { text: money(line.unitPriceCents), style: 'tableCell', alignment: 'right', color },
    notIncluded
      ? { text: 'not included', style: 'tableCell', alignment: 'right', italics: true, color: GREYED }
      : { text: money(line.amountCents), style: 'tableCell', alignment: 'right' },
  ];
}

/** The priced lines grouped by unit, options marked and options not chosen greyed. */
export function linesTable(groups: readonly LineGroup[], money: (c: number) => string, units: DisplayUnits): Content {
  const header: TableCell[] = [
    { text: 'Description', style: 'tableHeader' },
    { text: 'Quantity', style: 'tableHeader', alignment: 'right' },
    { text: 'Unit price', style: 'tableHeader', alignment: 'right' },
    { text: 'Amount', style: 'tableHeader', alignment: 'right' },
  ];
  const body: TableCell[][] = [header];
  const groupRows = new Set<number>();
  groups.forEach((g, index) => {
    groupRows.add(body.length);
    const size = g.group ? sizeOf(g.group, units) : '';
    body.push([
      {
        // pdfmake passes a node's id to the page-break rule; its typings know ids on ToC nodes only.
        id: `${GROUP_ROW_ID}${index}`,
        colSpan: 4,
        fillColor: DOC_COLORS.paper,
        columns: [
          ...(g.group?.kind ? [swatch(g.group.kind, 2)] : []),
          { width: '*', text: g.label, font: FONT_HEADING, bold: true, fontSize: 9.5, color: DOC_COLORS.ink },
          { width: 'auto', text: size, fontSize: 8.5, color: DOC_COLORS.slate, alignment: 'right', margin: [0, 1, 0, 0] },
        ],
        columnGap: 8,
      } as TableCell,
      {},
      {},
      {},
    ]);
    for (const line of g.lines) body.push(lineRow(line, money));
  });
  const layout: CustomTableLayout = {
    ...ruledTableLayout,
    hLineWidth: (i, node) => (i === 0 || i === node.table.body.length ? 0 : i === 1 ? 1 : 0.5),
    hLineColor: (i) => (i === 1 ? DOC_COLORS.slate : DOC_COLORS.rule),
    paddingLeft: (i) => (i === 0 ? 4 : 6),
    paddingRight: (i, node) => (i === (node.table.widths?.length ?? 1) - 1 ? 4 : 6),
    paddingTop: (row) => (groupRows.has(row) ? 4 : 3),
    paddingBottom: (row) => (groupRows.has(row) ? 3 : 3),
  };
  return {
    table: { headerRows: 1, dontBreakRows: true, widths: ['*', 84, 64, 70], body },
    layout,
  };
}

const CATEGORY_LABELS: Record<DocLine['category'], string> = {
  materials: 'Materials',
  labor: 'Labor',
  equipment: 'Equipment',
  fees: 'Fees',
};

/**
 * Included amounts by category, when the lines span more than one. A plain sum of the given line
 * amounts (whole cents, no rounding), so the rows add up to the subtotal exactly.
 */
export function categoryTable(lines: readonly DocLine[], subtotalCents: number, money: (c: number) => string): Content | null {
  const sums = new Map<DocLine['category'], number>();
  for (const line of lines) if (line.included) sums.set(line.category, (sums.get(line.category) ?? 0) + line.amountCents);
  if (sums.size < 2) return null;
  const order = Object.keys(CATEGORY_LABELS) as Array<DocLine['category']>;
  const rows: TableCell[][] = order
    .filter((c) => sums.has(c))
    .map((c) => [
      { text: CATEGORY_LABELS[c], style: 'tableCell' },
      { text: money(sums.get(c)!), style: 'tableCell', alignment: 'right' },
    ]);
  return {
    unbreakable: true,
    stack: [
      { text: 'By category', font: FONT_HEADING, bold: true, fontSize: 9.5, margin: [0, 0, 0, 3] },
      {
        table: {
          widths: ['*', 'auto'],
          body: [...rows, [{ text: 'Subtotal', style: 'tableTotal' }, { text: money(subtotalCents), style: 'tableTotal', alignment: 'right' }]],
        },
        layout: { ...ruledTableLayout, hLineWidth: (i, node) => (i === node.table.body.length - 1 ? 0.75 : 0), hLineColor: () => DOC_COLORS.rule },
      },
      { text: 'Before discount and sales tax.', style: 'small', margin: [0, 3, 0, 0] },
    ],
  };
}
