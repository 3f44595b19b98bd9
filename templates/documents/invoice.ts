/**
 * The invoice PDF, in the proposal's look: a letterhead with the firm and the invoice's number and
 * dates, who is billed for which property, the lines, the totals (tax on manual lines), payments
 * received and the balance due, and how to pay. Amounts are printed as given (the server computes
 * them with shared/domain/invoicing.ts); this file never rounds money, and refuses input whose
 * totals contradict its lines.
 */
import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces';
import { DomainValidationError } from '../../shared/domain/errors';
import { formatCents } from '../../shared/domain/money';
import { letterhead, type LetterheadFirm } from './firm-block';
import { DOC_COLORS, FONT_HEADING, keyValueTable, neverBreakBefore, pageFrame, ruledTableLayout } from './kit/layout';

const OCHRE = '#C99A2E';
const MOSS_TINT = '#EEF3EA';

export interface InvoiceDocumentInput {
  firm: LetterheadFirm;
  /** The client billed, with their postal address as written on their record (lines kept). */
  client: { name: string; address?: string | null };
  property: { name: string } | null;
  invoice: {
    number: string;
    kind: 'deposit' | 'progress' | 'final';
    status: 'draft' | 'open' | 'paid' | 'void';
    proposalNumber: string | null;
    issuedOn: string | null;
    dueOn: string | null;
    termsDays: number;
    notes: string | null;
    currency: string;
    taxRatePct: number;
    portalUrl: string;
  };
  lines: { description: string; quantity: string; unit: string; unitPriceCents: number; amountCents: number; taxable: boolean }[];
  totals: { subtotalCents: number; taxCents: number; totalCents: number; amountPaidCents: number; balanceCents: number };
  payments: { receivedOn: string; amountCents: number; refundedCents: number }[];
}

const KIND_TITLE = { deposit: 'Deposit invoice', progress: 'Progress invoice', final: 'Final invoice' } as const;

function fail(field: string, message: string): never {
  throw new DomainValidationError(field, `Invoice document: ${field} ${message}.`);
}

function check(input: InvoiceDocumentInput): void {
  const t = input.totals;
  const lineSum = input.lines.reduce((s, l) => s + l.amountCents, 0);
  if (lineSum !== t.subtotalCents) fail('totals.subtotalCents', `is ${t.subtotalCents} but the lines add up to ${lineSum}; pass the totals of invoiceAmounts unchanged`);
  if (t.totalCents !== t.subtotalCents + t.taxCents) fail('totals.totalCents', 'is not subtotal + tax');
  if (t.balanceCents !== Math.max(0, t.totalCents - t.amountPaidCents)) fail('totals.balanceCents', 'is not total − paid');
}

/** "May 4, 2026" from "2026-05-04" (a calendar date, no time zone shift). */
function longDate(iso: string): string {
  const [y, m, d] = iso.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d)).toLocaleDateString('en-US', { timeZone: 'UTC', month: 'long', day: 'numeric', year: 'numeric' });
}

/** The pdfmake document definition of an invoice (build a fresh one for every render). */
export function invoiceDocument(input: InvoiceDocumentInput): TDocumentDefinitions {
  check(input);
  const { firm, invoice, totals } = input;
  const money = (c: number) => formatCents(c, invoice.currency);
  const issued = invoice.issuedOn ? longDate(invoice.issuedOn) : null;
  const due = invoice.dueOn ? longDate(invoice.dueOn) : null;

  const head = letterhead(firm, 'Invoice', [
    { text: `Invoice ${invoice.number}`, bold: true },
    ...(issued ? [{ text: `Issued ${issued}` }] : []),
    ...(due ? [{ text: `Due ${due}` }] : []),
  ]);


  const bannerText =
    invoice.status === 'draft' ? { head: 'DRAFT — not issued yet', color: OCHRE, tint: '#FBF5E6' } : invoice.status === 'void' ? { head: 'VOID — nothing is due on this invoice', color: DOC_COLORS.clay, tint: DOC_COLORS.clayTint } : invoice.status === 'paid' ? { head: 'PAID — thank you', color: DOC_COLORS.moss, tint: MOSS_TINT } : null;
  const banner: Content[] = bannerText
    ? [{ margin: [0, 0, 0, 12], table: { widths: ['*'], body: [[{ text: bannerText.head, bold: true, fillColor: bannerText.tint, color: DOC_COLORS.ink, margin: [8, 5, 8, 5] }]] }, layout: { hLineWidth: () => 1, vLineWidth: () => 1, hLineColor: () => bannerText.color, vLineColor: () => bannerText.color } }]
    : [];

  const facts = keyValueTable(
    [
      { label: 'Billed to', value: input.client.address?.trim() ? `${input.client.name}\n${input.client.address.trim()}` : input.client.name },
      ...(input.property ? [{ label: 'Property', value: input.property.name }] : []),
      ...(invoice.proposalNumber ? [{ label: 'For proposal', value: invoice.proposalNumber }] : []),
      { label: 'Terms', value: invoice.termsDays === 0 ? 'Due on receipt' : `Net ${invoice.termsDays} days` },
    ],
    80,
  );
  const figure: Content = {
    stack: [
      { text: money(totals.balanceCents), font: FONT_HEADING, bold: true, fontSize: 18, color: DOC_COLORS.mossDeep, alignment: 'right' },
      { text: due && invoice.status === 'open' ? `balance due ${due}` : 'balance due', style: 'small', alignment: 'right' },
    ],
  };

  const header: TableCell[] = [
    { text: 'Description', style: 'tableHeader' },
    { text: 'Quantity', style: 'tableHeader', alignment: 'right' },
    { text: 'Price', style: 'tableHeader', alignment: 'right' },
    { text: 'Amount', style: 'tableHeader', alignment: 'right' },
  ];
  const body: TableCell[][] = [header, ...input.lines.map((l): TableCell[] => [
    { text: `${l.description}${l.taxable ? ' (taxable)' : ''}`, style: 'tableCell' },
    { text: `${Number(l.quantity).toLocaleString('en-US', { maximumFractionDigits: 4 })} ${l.unit}`, style: 'tableCell', alignment: 'right' },
    { text: l.amountCents < 0 ? '' : money(l.unitPriceCents), style: 'tableCell', alignment: 'right' },
    { text: l.amountCents < 0 ? `−${money(-l.amountCents)}` : money(l.amountCents), style: 'tableCell', alignment: 'right' },
  ])];

  const totalRows: [string, string, boolean][] = [['Subtotal', money(totals.subtotalCents), false]];
  if (totals.taxCents > 0) totalRows.push([`Sales tax at ${invoice.taxRatePct} % on taxable lines`, money(totals.taxCents), false]);
  totalRows.push(['Total', money(totals.totalCents), true]);
  if (totals.amountPaidCents > 0) totalRows.push(['Paid', `−${money(totals.amountPaidCents)}`, false]);
  totalRows.push(['Balance due', money(totals.balanceCents), true]);

  const totalsBlock: Content = {
    columns: [
      { width: '*', text: '' },
      {
        width: 250,
        table: { widths: ['*', 'auto'], body: totalRows.map(([label, value, strong]) => [{ text: label, bold: strong, style: 'tableCell' }, { text: value, bold: strong, style: 'tableCell', alignment: 'right', font: strong ? FONT_HEADING : undefined, color: strong ? DOC_COLORS.mossDeep : DOC_COLORS.ink }]) },
        layout: { hLineWidth: (i: number) => (totalRows[i]?.[2] ? 0.75 : 0), vLineWidth: () => 0, hLineColor: () => DOC_COLORS.rule, paddingLeft: () => 0, paddingRight: () => 0, paddingTop: () => 3, paddingBottom: () => 3 },
      },
    ],
    margin: [0, 8, 0, 0],
    unbreakable: true,
  };

  const payments: Content[] = input.payments.length
    ? [
        { text: 'Payments received', style: 'h2' },
        {
          table: {
            headerRows: 1,
            widths: ['*', 'auto', 'auto'],
            body: [
              [{ text: 'Received', style: 'tableHeader' }, { text: 'Amount', style: 'tableHeader', alignment: 'right' }, { text: 'Refunded', style: 'tableHeader', alignment: 'right' }],
              ...input.payments.map((p): TableCell[] => [{ text: longDate(p.receivedOn), style: 'tableCell' }, { text: money(p.amountCents), style: 'tableCell', alignment: 'right' }, { text: p.refundedCents ? money(p.refundedCents) : '—', style: 'tableCell', alignment: 'right' }]),
            ],
          },
          layout: ruledTableLayout,
        },
      ]
    : [];

  const howToPay: Content[] =
    invoice.status === 'open'
      ? [{ unbreakable: true, stack: [{ text: 'How to pay', style: 'h2' }, { text: `Pay by card in your portal, all at once or in parts: ${invoice.portalUrl}`, fontSize: 9.5 }, { text: 'Please write the invoice number on any check.', style: 'small', margin: [0, 3, 0, 0] }] }]
      : [];

  const frame = pageFrame({ title: `Invoice ${invoice.number}`, firmName: firm.name, firmContact: [firm.phone, firm.email].filter(Boolean).join(' · ') || undefined, preparedOn: issued ?? undefined, headerFromPage: 2 });
  return {
    ...frame,
    // Page 1 carries its own letterhead; the running header starts on page 2 (pageFrame's headerFromPage).
    // Short sections are unbreakable stacks, so a heading never sits alone at a page's foot.
    pageBreakBefore: neverBreakBefore(),
    watermark: invoice.status === 'draft' || invoice.status === 'void' ? { text: invoice.status.toUpperCase(), color: invoice.status === 'void' ? DOC_COLORS.clay : OCHRE, opacity: 0.09, bold: true, font: FONT_HEADING, fontSize: 110 } : undefined,
    info: { title: `Invoice ${invoice.number}`, author: firm.name, subject: `${KIND_TITLE[invoice.kind]} for ${input.client.name}` },
    content: [
      head,
      ...banner,
      { text: KIND_TITLE[invoice.kind], style: 'title' },
      { text: `For ${input.client.name}${input.property ? `, ${input.property.name}` : ''}`, style: 'subtitle' },
      { columns: [{ width: '*', stack: [facts] }, { width: 170, stack: [figure] }], columnGap: 16, margin: [0, 0, 0, 12] },
      { text: 'Lines', style: 'h2' },
      { table: { headerRows: 1, widths: ['*', 'auto', 'auto', 'auto'], body, dontBreakRows: true }, layout: ruledTableLayout },
      totalsBlock,
      ...howToPay,
      ...payments,
      ...(invoice.notes?.trim() ? [{ unbreakable: true, stack: [{ text: 'Notes', style: 'h2' }, { text: invoice.notes, fontSize: 9.5 }] } as Content] : []),
    ],
  };
}
