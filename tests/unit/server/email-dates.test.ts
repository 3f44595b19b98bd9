import { describe, expect, it } from 'vitest';
import { invoiceSentEmail, overdueReminderEmail, paymentReceiptEmail } from '../../../templates/email/invoice';
import { proposalDecidedEmail, proposalSentEmail } from '../../../templates/email/proposal-sent';
import { unitDoneEmail } from '../../../templates/email/unit-done';
import { IsoDateSchema } from '../../../shared/schemas/common';

const ISO = /\b\d{4}-\d{2}-\d{2}\b/;
const base = { firmName: 'Fernhill Habitat Consulting', propertyName: 'Kettle Hollow Farm', number: 'INV-2026-0007', url: 'http://127.0.0.1/portal/invoices/7' };

describe('e-mails write dates as people write them', () => {
  it('the invoice, the receipt and the reminder', () => {
    const sent = invoiceSentEmail({ ...base, kind: 'deposit', totalCents: 120_000, balanceCents: 120_000, dueOn: '2026-12-05' });
    expect(sent.text).toContain('due Dec 5, 2026');
    const receipt = paymentReceiptEmail({ ...base, amountCents: 50_000, balanceCents: 70_000, receivedOn: '2026-11-30' });
    expect(receipt.text).toContain('on Nov 30, 2026 for invoice');
    const reminder = overdueReminderEmail({ ...base, balanceCents: 70_000, dueOn: '2026-11-29', daysOverdue: 1 });
    expect(reminder.subject).toBe('Reminder: invoice INV-2026-0007 was due Nov 29, 2026');
    for (const mail of [sent, receipt, reminder]) {
      expect(mail.text).not.toMatch(ISO);
      expect(mail.html).not.toMatch(ISO);
    }
  });

  it('the proposal, its decision (with the time in the firm’s zone) and a finished unit', () => {
    const proposal = proposalSentEmail({ firmName: base.firmName, consultantName: 'Eli Marchetti', propertyName: base.propertyName, number: 'P-2026-004', version: 1, totalCents: 350_000, expiresOn: '2027-01-04', url: base.url });
    expect(proposal.text).toContain('before the end of Jan 4, 2027');
    // 05:30 UTC on Dec 1 is 11:30 PM CST on Nov 30 (UTC−6 in winter, 15 U.S.C. § 260a).
    const decided = proposalDecidedEmail({ firmName: base.firmName, clientName: 'Okonkwo family', propertyName: base.propertyName, number: 'P-2026-004', version: 1, decision: 'approved', signedName: 'Priya Okonkwo', totalCents: 350_000, url: base.url, decidedAt: new Date('2026-12-01T05:30:00Z'), timeZone: 'America/Chicago' });
    expect(decided.text).toContain('on Nov 30, 2026, 11:30 PM CST');
    const unit = unitDoneEmail({ firmName: base.firmName, propertyName: base.propertyName, unitName: 'Ridge clover plot', taskNames: ['Seed clover'], doneOn: '2026-09-02', url: base.url });
    expect(unit.text).toContain('on Sep 2, 2026:');
    for (const mail of [proposal, decided, unit]) expect(mail.text).not.toMatch(ISO);
  });
});

describe('a date field’s error speaks of the control it sits under', () => {
  it('asks for the whole date (month, day and year), never for YYYY-MM-DD', () => {
    const partial = IsoDateSchema.safeParse('');
    expect(partial.success).toBe(false);
    expect(partial.error!.issues[0].message).toBe('enter the whole date: month, day and year');
    expect(partial.error!.issues[0].message).not.toMatch(/YYYY/);
  });
});
