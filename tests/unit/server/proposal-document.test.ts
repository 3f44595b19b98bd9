import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';
import { formatCents } from '../../../shared/domain/money';
import { formatAcres } from '../../../shared/domain/plan-checks';
import { proposalTotals } from '../../../shared/domain/proposal-totals';
import { formatQuantity, proposalDocument, quantityWithUnit } from '../../../templates/documents/proposal';
import { renderProposalPdf } from '../../../server/services/documents/render-documents';
import type { ProposalDocumentInput } from '../../../templates/documents/proposal-input';
import { offset } from '../../support/document-fixtures';
import {
  CHOSEN_OPTION,
  couleeBendProposal,
  ESCAPED_DESCRIPTION,
  FIXTURE_CAUTIONS,
  FIXTURE_LINES,
  pricingOf,
  SKIPPED_OPTION,
  type FixtureLine,
} from '../../support/proposal-fixtures';

const PDFTOTEXT = '/usr/bin/pdftotext'; // Debian poppler-utils
const PDFFONTS = '/usr/bin/pdffonts'; // Debian poppler-utils

let workDir: string;

beforeAll(() => {
  workDir = mkdtempSync(join(tmpdir(), 'browseline-proposal-'));
});
afterAll(() => {
  rmSync(workDir, { recursive: true, force: true });
});

function pdfText(pdf: Buffer, name: string, pages?: { first: number; last: number }): string {
  const file = join(workDir, `${name}.pdf`);
  writeFileSync(file, pdf);
  const range = pages ? ['-f', String(pages.first), '-l', String(pages.last)] : [];
  return execFileSync(PDFTOTEXT, [...range, '-layout', file, '-'], { encoding: 'utf8' });
}

function pageCountOf(text: string): number {
  return Number(/Page 1 of (\d+)/.exec(text)?.[1]);
}

const escapeRegExp = (s: string): string => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** The text row (one line of `pdftotext -layout`) that holds a price-table line's description. */
function rowOf(text: string, description: string): string {
  const rows = text.split('\n').filter((l) => l.includes(description) && /\d/.test(l.replace(description, '')));
  expect(rows, `one price row for "${description}"`).toHaveLength(1);
  return rows[0];
}

/** The last dollar amount on a row (the Amount column), or null. */
function amountOnRow(row: string): string | null {
  const amounts = row.match(/\$[\d,]+\.\d{2}/g);
  return amounts ? amounts[amounts.length - 1] : null;
}

function centsOf(dollars: string): number {
  return Number(dollars.replace(/[$,]/g, '').replace('.', ''));
}

/*
 * The fixture worked by hand with Browseline's rule (shared/domain/money.ts: round half up to whole
 * cents, once per step):
 *   included lines  $35.00 + 95 × $7.49 + 19 × $6.85 + 2.37 × $87.35 (= 207.0195 → $207.02)
 *                   + 3.5 × $65.00 + 600 × $1.15 (chosen option) + 4.5 × $420.00 + 3 × $12.40
 *                   + 1,240 × $0.95 + 14.25 × $38.50 (= 548.625 → $548.63) + $425.00 = $6,080.05
 *   10 % discount   608.005 → $608.01
 *   taxable base    $1,905.77 (taxable lines less their share of the discount; largest-remainder
 *                   allocation, from proposalTotals)
 *   5.5 % tax       104.81735 → $104.82
 *   total           6,080.05 − 608.01 + 104.82 = $5,576.86
 *   30 % deposit    1,673.058 → $1,673.06; balance $3,903.80
 * The option not chosen, 16 h × $58.25 = $932.00, counts nowhere.
 */
const HAND = {
  subtotalCents: 608005,
  discountCents: 60801,
  taxableCents: 190577,
  taxCents: 10482,
  totalCents: 557686,
  depositCents: 167306,
  balanceCents: 390380,
  skippedOptionCents: 93200,
};

describe('proposal PDF for Coulee Bend (invented), sent to the client', () => {
  const input = couleeBendProposal();
  let pdf: Buffer;
  let text: string;
  let page1: string;

  beforeAll(async () => {
    pdf = await renderProposalPdf(couleeBendProposal());
    text = pdfText(pdf, 'sent');
    page1 = pdfText(pdf, 'sent-p1', { first: 1, last: 1 });
  }, 60_000);

  it('is a PDF', () => {
    // PDF header "%PDF-" (ISO 32000-1:2008, 7.5.2 File Header) and end-of-file marker (7.5.5).
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.subarray(-6).toString('latin1')).toMatch(/%%EOF\s*$/);
  });

  it('is fed the totals of proposalTotals, which match the fixture worked by hand', () => {
    const totals = proposalTotals(pricingOf(FIXTURE_LINES));
    expect(input.totals).toMatchObject({
      subtotalCents: HAND.subtotalCents,
      discountCents: HAND.discountCents,
      taxableCents: HAND.taxableCents,
      taxCents: HAND.taxCents,
      totalCents: HAND.totalCents,
      depositCents: HAND.depositCents,
      balanceCents: HAND.balanceCents,
    });
    expect(totals.lines.find((l) => l.description === SKIPPED_OPTION)).toMatchObject({ amountCents: HAND.skippedOptionCents, included: false });
  });

  it('opens with the firm, the proposal number and version, title, dates, client and property', () => {
    // Expected strings come from the input itself: the document must print what it was given.
    expect(page1).toContain('Driftless Habitat Works');
    expect(page1).toContain('(608) 555-0142');
    expect(page1).toContain('Proposal P-2027-004 · version 2');
    expect(page1).toContain('Clover, cover and a quiet way in');
    expect(page1).toContain('Prepared April 20, 2027');
    expect(page1).toContain('Valid until May 20, 2027');
    expect(page1).toContain('Marta and Jon Lindqvist');
    expect(page1).toContain('Coulee Bend');
    expect(page1).toContain('Crawford County, Wisconsin');
    expect(page1).toContain(formatAcres(input.property.acres));
    expect(page1).toContain('here is the work we walked through in April');
    // The plan map with its legend and scale bar is on page 1, below the introduction.
    expect(page1).toContain('Property boundary');
    expect(page1).toMatch(/\d (ft|mi)\b/);
  });

  it('describes the work unit by unit with acres or length', () => {
    expect(text).toContain('The work, unit by unit');
    for (const group of input.groups) {
      expect(text).toContain(group.label);
      if (group.acres != null) expect(text).toContain(formatAcres(group.acres));
      // Summaries are short enough to sit on one line each.
      for (const summary of group.summaries) expect(text).toContain(summary);
    }
  });

  it('prints every line with its quantity, unit price and amount exactly as given', () => {
    for (const line of input.lines) {
      const row = rowOf(text, line.description);
      expect(row).toContain(quantityWithUnit(line.quantity, line.unit));
      expect(row).toContain(formatCents(line.unitPriceCents));
      if (line.included) expect(amountOnRow(row)).toBe(formatCents(line.amountCents));
    }
    // Worked by hand: 2.37 acres × $87.35 = $207.0195 → $207.02 (round half up).
    expect(rowOf(text, 'Disk, seed and cultipack the seedbed')).toMatch(/2\.37 acres\s+\$87\.35\s+\$207\.02\s*$/);
    expect(rowOf(text, CHOSEN_OPTION)).toMatch(/OPTION\s+Temporary exclusion fence/);
  });

  it('prints the totals exactly: subtotal, discount, taxable amount, tax at the rate, total, deposit and balance', () => {
    expect(text).toMatch(new RegExp(`Subtotal\\s+${escapeRegExp(formatCents(HAND.subtotalCents))}`)); // $6,080.05
    expect(text).toMatch(/10% discount\s+−\$608\.01/);
    expect(text).toMatch(new RegExp(`Taxable amount\\s+${escapeRegExp(formatCents(HAND.taxableCents))}`));
    expect(text).toMatch(new RegExp(`Sales tax at 5\\.5%\\s+${escapeRegExp(formatCents(input.totals.taxCents))}`));
    expect(text).toMatch(new RegExp(`Total\\s+${escapeRegExp(formatCents(input.totals.totalCents))}`));
    expect(text).toMatch(new RegExp(`Deposit due on approval \\(30%\\)\\s+${escapeRegExp(formatCents(input.totals.depositCents))}`));
    expect(text).toMatch(new RegExp(`Balance, invoiced as the work is done\\s+${escapeRegExp(formatCents(HAND.balanceCents))}`));
    expect(text).toContain(formatCents(input.totals.subtotalCents));
    expect(text).toContain(formatCents(input.totals.taxCents));
    expect(text).toContain(formatCents(input.totals.totalCents));
    expect(text).toContain(formatCents(input.totals.depositCents));
  });

  it('shows the option not chosen greyed as "not included" and adds its amount nowhere', () => {
    const row = rowOf(text, SKIPPED_OPTION);
    expect(row).toMatch(/OPTION\s+Second chainsaw crew/);
    expect(row).toMatch(/16 hours\s+\$58\.25\s+not included\s*$/);
    // $932.00 (16 × $58.25, by hand) is printed nowhere, nor is any total that counts it.
    expect(text).not.toContain(formatCents(HAND.skippedOptionCents));
    expect(text).not.toContain(formatCents(HAND.subtotalCents + HAND.skippedOptionCents));
    // The amounts printed in the Amount column of the included lines add up to the printed subtotal.
    const counted = input.lines.filter((l) => l.included).map((l) => centsOf(amountOnRow(rowOf(text, l.description)) ?? '$0.00'));
    expect(counted.reduce((sum, c) => sum + c, 0)).toBe(HAND.subtotalCents);
  });

  it('breaks the included amounts down by category, adding up to the subtotal', () => {
    // Sums by hand of the included lines: fees $35.00; materials $711.55 + $130.15 + $690.00 +
    // $37.20 + $548.63 = $2,117.53; labor $207.02 + $1,890.00 + $1,178.00 = $3,275.02; equipment
    // $227.50 + $425.00 = $652.50; together $6,080.05.
    expect(text).toMatch(/Materials\s+\$2,117\.53/);
    expect(text).toMatch(/Labor\s+\$3,275\.02/);
    expect(text).toMatch(/Equipment\s+\$652\.50/);
    expect(text).toMatch(/Fees\s+\$35\.00/);
  });

  it('keeps the terms’ line breaks, boxes every caution and says how to approve online', () => {
    expect(text).toMatch(/Terms/);
    expect(text).toMatch(/as each unit is finished,\s*\n\s*and the final invoice when the last unit is done/);
    expect(text).toContain('Before the work begins');
    for (const caution of FIXTURE_CAUTIONS) {
      expect(text).toContain(caution.title);
      expect(text).toContain(caution.text.split(' ').slice(0, 6).join(' '));
    }
    // PRODUCT.md "Cautions the product shows": the product defers to local codes where work is planned.
    expect(text).toMatch(/defers to local codes, state wildlife rules and licensed practice/);
    expect(text).toMatch(/Approve online in your portal: open proposal P-2027-004, read it through, and type your name/);
    expect(text).not.toMatch(/DRAFT|Approved by/);
  });

  it('numbers every page "Page N of M" and repeats the firm and proposal number in the header', () => {
    const pages = pageCountOf(text);
    expect(pages).toBeGreaterThanOrEqual(2);
    for (let n = 1; n <= pages; n++) expect(text).toContain(`Page ${n} of ${pages}`);
    const page2 = pdfText(pdf, 'sent-p2', { first: 2, last: 2 });
    expect(page2).toMatch(/Driftless Habitat Works\s+Proposal P-2027-004 · version 2/);
  });

  it('keeps the Price heading with the table header, and every page of the table starts with its header', () => {
    const pages = pageCountOf(text);
    let pagesWithLines = 0;
    for (let n = 1; n <= pages; n++) {
      const page = pdfText(pdf, `sent-page-${n}`, { first: n, last: n });
      const header = /Description\s+Quantity\s+Unit price\s+Amount/;
      if (/^\s*Price\s*$/m.test(page)) expect(page).toMatch(header);
      if (input.lines.some((l) => rowOfOrNull(page, l.description))) {
        pagesWithLines += 1;
        expect(page).toMatch(header);
      }
    }
    expect(pagesWithLines).toBeGreaterThanOrEqual(1);
  });

  it('embeds only our fonts (Merriweather and Source Sans 3), subset', () => {
    const file = join(workDir, 'fonts.pdf');
    writeFileSync(file, pdf);
    const fonts = execFileSync(PDFFONTS, [file], { encoding: 'utf8' }).split('\n').slice(2).filter(Boolean);
    expect(fonts.length).toBeGreaterThan(0);
    for (const line of fonts) expect(line).toMatch(/^[A-Z]{6}\+(Merriweather|SourceSans3)-/);
  });
});

function rowOfOrNull(page: string, description: string): string | null {
  return page.split('\n').find((l) => l.includes(description) && /\$[\d,]+\.\d\d/.test(l)) ?? null;
}

describe('proposal PDF by status', () => {
  it('prints the approval record: signed name, time and the SHA-256 content hash', async () => {
    // The firm works on Central time: in April that is CDT, UTC−5 (15 U.S.C. § 260a), so 15:42 UTC is 10:42 AM CDT.
    const input = { ...couleeBendProposal({ approved: { signedName: 'Marta Lindqvist', signedAt: '2027-04-27T15:42:00Z' } }), timeZone: 'America/Chicago' };
    const hash = input.approval!.contentHash;
    // SHA-256 is 256 bits, 64 hexadecimal digits (FIPS 180-4); the fixture hashes canonicalProposalContent.
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
    const pdf = await renderProposalPdf(input);
    const text = pdfText(pdf, 'approved');
    expect(text).toContain('Approved by Marta Lindqvist on April 27, 2027, 10:42 AM CDT');
    expect(text).toContain(hash);
    // Labelled plainly for the landowner, not as a hash algorithm.
    expect(text).toMatch(/Approval fingerprint/);
    expect(text).not.toMatch(/SHA-256/);
    expect(pdfText(pdf, 'approved-p1', { first: 1, last: 1 })).toContain('APPROVED — by Marta Lindqvist');
    expect(text).not.toMatch(/type your name to approve/);
  }, 30_000);

  it('marks a draft with a banner, a watermark and the header, and does not invite approval', async () => {
    const pdf = await renderProposalPdf(couleeBendProposal({ status: 'draft' }));
    const page1 = pdfText(pdf, 'draft-p1', { first: 1, last: 1 });
    expect(page1).toContain('DRAFT — not yet sent');
    expect(page1).toContain('Property boundary'); // the map still fits on page 1 below the banner
    const text = pdfText(pdf, 'draft');
    expect(text).toContain('Proposal P-2027-004 · version 2 · DRAFT');
    expect(text).not.toMatch(/Approve online in your portal/);
    expect(text).toMatch(/Once this proposal is sent, the client approves it online in the portal by typing their name/);
    // The watermark is drawn on every page (pdftotext -raw gives its rotated letters one a line,
    // after the page's other text), in our heading font.
    const pages = pageCountOf(text);
    expect(pages).toBeGreaterThanOrEqual(2);
    for (let n = 1; n <= pages; n++) {
      const raw = execFileSync(PDFTOTEXT, ['-f', String(n), '-l', String(n), '-raw', join(workDir, 'draft.pdf'), '-'], { encoding: 'utf8' });
      expect(raw, `page ${n}`).toMatch(/\nD\nR\nA\nF\nT\s*$/);
    }
    const file = join(workDir, 'draft-fonts.pdf');
    writeFileSync(file, pdf);
    const fonts = execFileSync(PDFFONTS, [file], { encoding: 'utf8' }).split('\n').slice(2).filter(Boolean);
    for (const line of fonts) expect(line).toMatch(/^[A-Z]{6}\+(Merriweather|SourceSans3)-/);
  }, 30_000);

  it.each([
    ['declined', 'DECLINED — this proposal was declined'],
    ['withdrawn', 'WITHDRAWN — Driftless Habitat Works withdrew this proposal'],
    ['expired', 'EXPIRED — this proposal was valid until May 20, 2027'],
  ] as const)('marks a %s proposal with its banner and says it can no longer be approved', async (status, bannerText) => {
    const pdf = await renderProposalPdf(couleeBendProposal({ status }));
    expect(pdfText(pdf, `${status}-p1`, { first: 1, last: 1 })).toContain(bannerText);
    const text = pdfText(pdf, status);
    expect(text).toContain('This version can no longer be approved online');
    expect(text).not.toMatch(/Approve online in your portal/);
  }, 30_000);
});

describe('proposal PDF layout and escaping', () => {
  it('prints & and < in descriptions and unit names verbatim (map SVG escaped, table text as is)', async () => {
    const name = `Tom & Jerry's <plot>`;
    const square = [offset(-320, 220), offset(-250, 220), offset(-250, 290), offset(-320, 290), offset(-320, 220)];
    const lines: FixtureLine[] = [
      ...FIXTURE_LINES,
      { id: 401, groupLabel: name, category: 'labor', description: 'Mow & disk <north> half', quantity: '0.7500', unit: 'acre', unitPriceCents: 9000, taxable: false, optional: false },
    ];
    const base = couleeBendProposal();
    const pdf = await renderProposalPdf(
      couleeBendProposal({
        lines,
        extraUnits: [{ name, kind: 'food-plot', geometry: { type: 'Polygon', coordinates: [square] }, acres: 1.2, lengthFt: null }],
        groups: [...base.groups, { label: name, kind: 'food-plot', acres: 1.2, summaries: ['Mow & disk the <north> half in August.'] }],
      }),
    );
    const text = pdfText(pdf, 'escaping');
    expect(text).toContain(ESCAPED_DESCRIPTION); // 'Ladino & red clover mix <inoculated>, 8 lb/acre'
    expect(text).toContain('Mow & disk <north> half');
    expect(text).toContain('Mow & disk the <north> half in August.');
    expect(text).toContain(name);
    expect(text).not.toMatch(/&amp;|&lt;/);
    // By hand: 0.75 acre × $90.00 = $67.50.
    expect(rowOf(text, 'Mow & disk <north> half')).toMatch(/0\.75 acres\s+\$90\.00\s+\$67\.50\s*$/);
  }, 30_000);

  it('puts the map on page 1 when it fits, and after the work when a long introduction leaves no room', async () => {
    const sentence = 'We walked the ridge and the creek bottom with you in April and looked at where deer bed, feed and travel today.';
    const pdf = await renderProposalPdf(couleeBendProposal({ introduction: `${Array(6).fill(sentence).join(' ')}\n\nSecond paragraph.` }));
    const page1 = pdfText(pdf, 'long-intro-p1', { first: 1, last: 1 });
    const page2 = pdfText(pdf, 'long-intro-p2', { first: 2, last: 2 });
    expect(page1).toContain('The work, unit by unit');
    expect(page1).not.toContain('Property boundary');
    expect(page2).toContain('Property boundary');
    // Without an introduction the map (its legend) is on page 1, above the work.
    const short = pdfText(await renderProposalPdf(couleeBendProposal({ introduction: null })), 'no-intro-p1', { first: 1, last: 1 });
    expect(short).toContain('Property boundary');
    expect(short).not.toContain('The work, unit by unit');
  }, 30_000);

  it('moves a unit’s header row to the next page rather than leave it last on a page', async () => {
    // 16 lines put the North Ridge Timber header row at the foot of page 2 without the rule
    // (found by rendering 6 to 44 lines); the rule carries it over to page 3 under the table header.
    const lines: FixtureLine[] = Array.from({ length: 16 }, (_, i) => ({ ...FIXTURE_LINES[i % FIXTURE_LINES.length], id: 5000 + i }));
    const pdf = await renderProposalPdf(couleeBendProposal({ lines }));
    const text = pdfText(pdf, 'sixteen');
    const groupRow = /^\s+(Clover Plot|North Ridge Timber|Ridge access)\s+[\d.,]+ (acres|ft)\s*$/;
    const pages = text.split('\f').filter((p) => p.trim());
    expect(pages.length).toBe(pageCountOf(text));
    let groupRowsSeen = 0;
    for (const page of pages) {
      const rows = page.split('\n').filter((l) => l.trim());
      const body = rows.slice(0, -1); // the footer is the last row
      groupRowsSeen += body.filter((r) => groupRow.test(r)).length;
      expect(groupRow.test(body[body.length - 1])).toBe(false);
      body.forEach((r, i) => {
        if (groupRow.test(r) && i > 0 && !groupRow.test(body[i - 1])) {
          // A group row is never directly under the page's running header: the table header comes first.
          expect(body[i - 1]).not.toMatch(/Proposal P-2027-004 · version 2\s*$/);
        }
      });
    }
    expect(groupRowsSeen).toBe(3);
  }, 30_000);
});

describe('proposal document input', () => {
  const input = couleeBendProposal();
  const withTotals = (patch: Partial<ProposalDocumentInput['totals']>): ProposalDocumentInput => ({ ...input, totals: { ...input.totals, ...patch } });

  it('formats quantities from their decimal strings and counts units in plain words', () => {
    // Common practice, no source: trailing zeros dropped, thousands grouped, plural nouns with "s".
    expect(formatQuantity('2.3700')).toBe('2.37');
    expect(formatQuantity('1240.0000')).toBe('1,240');
    expect(formatQuantity('0.5000')).toBe('0.5');
    expect(formatQuantity('1234567.0100')).toBe('1,234,567.01');
    expect(quantityWithUnit('1.0000', 'acre')).toBe('1 acre');
    expect(quantityWithUnit('2.3700', 'acre')).toBe('2.37 acres');
    expect(quantityWithUnit('3', '50-lb bag')).toBe('3 50-lb bags');
    expect(quantityWithUnit('12.5', 'lb')).toBe('12.5 lb');
    expect(quantityWithUnit('3', 'each')).toBe('3 each');
  });

  it('refuses totals that do not agree with the lines or with one another, saying what to do', () => {
    // Sums by hand from the fixture: the included lines add up to $6,080.05.
    expect(() => proposalDocument(withTotals({ subtotalCents: HAND.subtotalCents + HAND.skippedOptionCents }))).toThrow(
      /totals\.subtotalCents is \$7,012\.05 but the included lines add up to \$6,080\.05; compute the totals with proposalTotals/,
    );
    expect(() => proposalDocument(withTotals({ totalCents: HAND.totalCents + 1 }))).toThrow(/totals\.totalCents is not subtotal − discount \+ tax/);
    expect(() => proposalDocument(withTotals({ balanceCents: 0 }))).toThrow(/totals\.balanceCents is not total − deposit/);
    expect(() => proposalDocument(withTotals({ taxCents: 104.82 }))).toThrow(/totals\.taxCents must be a whole number of cents/);
  });

  it('reports other bad input by field', () => {
    const bad = (patch: Partial<ProposalDocumentInput>) => () => proposalDocument({ ...input, ...patch });
    expect(bad({ proposal: { ...input.proposal, preparedOn: 'April 20' } })).toThrow(/proposal\.preparedOn must be a date written YYYY-MM-DD/);
    expect(bad({ proposal: { ...input.proposal, expiresOn: '2027-02-30' } })).toThrow(/proposal\.expiresOn 2027-02-30 is not a calendar date/);
    expect(bad({ proposal: { ...input.proposal, status: 'approved' } })).toThrow(/approval is missing/);
    expect(bad({ approval: { signedName: 'M. Lindqvist', signedAt: '2027-04-27', contentHash: 'abc' } })).toThrow(DomainValidationError);
    expect(bad({ approval: { signedName: 'M. Lindqvist', signedAt: '2027-04-27', contentHash: 'abc' } })).toThrow(
      /approval\.contentHash must be a SHA-256 hash written as 64 hexadecimal digits/,
    );
    expect(bad({ approval: { signedName: 'M. Lindqvist', signedAt: '2027-04-27', contentHash: 'a'.repeat(64) } })).toThrow(
      /only an approved proposal has an approval record/,
    );
    expect(bad({ lines: input.lines.map((l, i) => (i === 0 ? { ...l, included: false } : l)) })).toThrow(
      /lines\.0\.included is a required line, so it must be included/,
    );
    expect(bad({ lines: input.lines.map((l, i) => (i === 0 ? { ...l, quantity: '1.23456' } : l)) })).toThrow(/lines\.0\.quantity/);
    expect(bad({ property: { ...input.property, boundary: { type: 'Point', coordinates: [0, 0] } as never } })).toThrow(/property\.boundary/);
  });
});
