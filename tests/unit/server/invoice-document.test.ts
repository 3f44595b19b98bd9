import { execFileSync } from 'node:child_process';
import { beforeAll, describe, expect, it } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';
import { type InvoiceDocumentInput } from '../../../templates/documents/invoice';
import { renderInvoicePdf } from '../../../server/services/documents/render-documents';
import { pdfWorkersReady } from '../../../server/services/documents/pdf-pool';

// PDFs render in a worker thread; its first start (fonts, modules) is not part of a test.
beforeAll(pdfWorkersReady, 60_000);

/** Invented demo figures; each total is arithmetic on the lines (no source). */
const input = (): InvoiceDocumentInput => ({
  firm: { name: 'Fernhill Habitat Consulting', phone: '(608) 555-0100', email: null, address: null },
  client: { name: 'Okonkwo-Larsen Family' },
  property: { name: 'Kettle Hollow Farm' },
  invoice: { number: 'INV-2026-0002', kind: 'progress', status: 'open', proposalNumber: 'P-2026-001', issuedOn: '2026-09-10', dueOn: '2026-10-10', termsDays: 30, notes: null, currency: 'USD', taxRatePct: 5.5, portalUrl: 'http://127.0.0.1:3000/portal/invoices/2' },
  lines: [
    { description: 'Disk the seedbed', quantity: '1', unit: 'each', unitPriceCents: 12_000, amountCents: 12_000, taxable: false },
    { description: 'Less the deposit already billed', quantity: '1', unit: 'each', unitPriceCents: -3_600, amountCents: -3_600, taxable: false },
    { description: 'Extra soil test', quantity: '2', unit: 'sample', unitPriceCents: 2_500, amountCents: 5_000, taxable: true },
  ],
  totals: { subtotalCents: 13_400, taxCents: 275, totalCents: 13_675, amountPaidCents: 5_000, balanceCents: 8_675 },
  payments: [{ receivedOn: '2026-09-15', amountCents: 5_000, refundedCents: 0 }],
});

describe('the invoice PDF', () => {
  it('writes the client’s postal address under "Billed to" and US spelling for how to pay', async () => {
    const doc = input();
    doc.client.address = '4410 Kettle Hollow Road\nRidgeway, WI 53582'; // invented demo address
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: await renderInvoicePdf(doc) }).toString();
    expect(text).toMatch(/Billed to\s+Okonkwo-Larsen Family/);
    expect(text).toContain('4410 Kettle Hollow Road');
    expect(text).toContain('Ridgeway, WI 53582');
    expect(text).toContain('on any check');
    expect(text).not.toMatch(/cheque/i);
  });

  it('prints the lines, the credit, the totals and the balance exactly as given', async () => {
    const pdf = await renderInvoicePdf(input());
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf }).toString();
    expect(text).toContain('INV-2026-0002');
    expect(text).toContain('Progress invoice');
    expect(text).toMatch(/−\$36\.00/);
    expect(text).toMatch(/Total\s+\$136\.75/);
    expect(text).toMatch(/Balance due\s+\$86\.75/);
    expect(text).toContain('Net 30 days');
  });

  it('refuses totals that contradict the lines, naming the field', async () => {
    const bad = input();
    bad.totals.subtotalCents = 13_401;
    await expect(renderInvoicePdf(bad)).rejects.toThrow(DomainValidationError);
    await expect(renderInvoicePdf(bad)).rejects.toThrow(/totals\.subtotalCents/);
    const wrongBalance = input();
    wrongBalance.totals.balanceCents = 1;
    await expect(renderInvoicePdf(wrongBalance)).rejects.toThrow(/balanceCents/);
  });
});
