/** Invoice PDF render time: median of 15 renders of a three-line invoice with a payment (npx tsx tests/bench/invoice-pdf.ts). */
import { type InvoiceDocumentInput } from '../../templates/documents/invoice';
import { renderInvoicePdf } from '../../server/services/documents/render-documents';

const input: InvoiceDocumentInput = {
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
};

const times: number[] = [];
let bytes = 0;
await renderInvoicePdf(input); // warm-up (fonts)
for (let i = 0; i < 15; i++) {
  const t0 = performance.now();
  bytes = (await renderInvoicePdf(input)).length;
  times.push(performance.now() - t0);
}
times.sort((a, b) => a - b);
console.log(JSON.stringify({ bench: 'invoice-pdf', medianMs: Number(times[7].toFixed(1)), minMs: Number(times[0].toFixed(1)), maxMs: Number(times[14].toFixed(1)), bytes }));
