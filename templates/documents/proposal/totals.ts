/**
 * The totals with discount, sales tax, deposit and balance, and the price section that holds them.
 */
import { DOC_COLORS, FONT_HEADING } from '../kit/layout';
import type { Content, TableCell } from 'pdfmake/interfaces';
import { formatPct, unitsOf } from './format';
import type { DocData } from './input';
import { categoryTable, groupLines, linesTable } from './lines-table';

function totalsBlock(data: DocData, money: (c: number) => string): Content {
  const t = data.totals;
  type Row = { label: string; value: string; kind?: 'muted' | 'total' | 'after' };
  const rows: Row[] = [{ label: 'Subtotal', value: money(t.subtotalCents) }];
  if (t.discountCents > 0) rows.push({ label: t.discountLabel?.trim() || 'Discount', value: `−${money(t.discountCents)}` });
  if (t.taxRatePct > 0 || t.taxCents > 0) {
    rows.push({ label: 'Taxable amount', value: money(t.taxableCents), kind: 'muted' });
    rows.push({ label: `Sales tax at ${formatPct(t.taxRatePct)}`, value: money(t.taxCents) });
  } else {
    rows.push({ label: 'No sales tax', value: money(t.taxCents), kind: 'muted' });
  }
  rows.push({ label: 'Total', value: money(t.totalCents), kind: 'total' });
  if (t.depositPct > 0 || t.depositCents > 0) {
    rows.push({ label: `Deposit due on approval (${formatPct(t.depositPct)})`, value: money(t.depositCents), kind: 'after' });
    rows.push({ label: 'Balance, invoiced as the work is done', value: money(t.balanceCents), kind: 'after' });
  }
  const totalIndex = rows.findIndex((r) => r.kind === 'total');
  const body: TableCell[][] = rows.map((r) => {
    if (r.kind === 'total') {
      return [
        { text: 'Total', font: FONT_HEADING, bold: true, fontSize: 13, margin: [0, 3, 0, 0] },
        { text: r.value, font: FONT_HEADING, bold: true, fontSize: 16, color: DOC_COLORS.mossDeep, alignment: 'right', fontFeatures: ['tnum'] },
      ];
    }
    const color = r.kind === 'muted' ? DOC_COLORS.slate : DOC_COLORS.ink;
    return [
      { text: r.label, style: 'tableCell', color },
      { text: r.value, style: 'tableCell', alignment: 'right', color },
    ];
  });
  return {
    unbreakable: true,
    table: { widths: ['*', 'auto'], body },
    layout: {
      hLineWidth: (i) => (i === totalIndex ? 1 : i === totalIndex + 1 && totalIndex + 1 < body.length ? 0.5 : 0),
      vLineWidth: () => 0,
      hLineColor: (i) => (i === totalIndex ? DOC_COLORS.ink : DOC_COLORS.rule),
      paddingLeft: () => 0,
      paddingRight: (i) => (i === 0 ? 10 : 0),
      paddingTop: (i) => (i === totalIndex ? 6 : i === totalIndex + 1 ? 6 : 2.5),
      paddingBottom: (i) => (i === totalIndex ? 6 : 2.5),
    },
  };
}

/** The price section: the lines table, the subtotal by category and the totals. */
export function priceSection(data: DocData, money: (c: number) => string): Content[] {
  const grouped = groupLines(data.lines, data.groups);
  const hasExcluded = data.lines.some((l) => l.optional && !l.included);
  const hasOptions = data.lines.some((l) => l.optional);
  const byCategory = categoryTable(data.lines, data.totals.subtotalCents, money);
  const out: Content[] = [{ text: 'Price', style: 'h2' }];
  if (grouped.length === 0) {
    out.push({ text: 'No priced lines yet.', style: 'muted' });
  } else {
    out.push(linesTable(grouped, money, unitsOf(data)));
  }
  // The note on options stays with the totals it explains, never alone at the top of a page.
  const note: Content[] = hasOptions
    ? [
        {
          text: hasExcluded
            ? 'Lines marked OPTION are extras. Options shown “not included” are priced for reference and are not counted in any total.'
            : 'Lines marked OPTION are extras you chose; they are counted in the totals.',
          style: 'small',
          margin: [0, 0, 0, 12],
        },
      ]
    : [];
  out.push({
    margin: [0, 5, 0, 0],
    unbreakable: true,
    stack: [
      ...note,
      {
        columns: [
          byCategory ? { width: 190, stack: [byCategory] } : { width: 190, text: '' },
          { width: '*', text: '' },
          { width: 250, stack: [totalsBlock(data, money)] },
        ],
        columnGap: 0,
        margin: [0, note.length > 0 ? 0 : 9, 0, 0],
      },
    ],
  });
  return out;
}
