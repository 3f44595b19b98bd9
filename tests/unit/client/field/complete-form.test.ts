import { describe, expect, it } from 'vitest';
import { CompleteFormSchema, completeFormDefaults, completionFields, photoProblem } from '../../../../src/features/field/lib/complete-form';
import { fieldStatus, FIELD_STATUS_LABELS, localToday, plannedDates } from '../../../../src/features/field/lib/task-text';

const quantities = [
  { key: 'brassica-blend', label: 'Brassica blend', amount: 12.5, unit: 'lb', rateText: '5 lb/acre broadcast' },
  { key: 'labor:Drill', label: 'Drill seeding', amount: 2, unit: 'hour', rateText: '' },
];

describe('the "Mark done" form', () => {
  it('starts from today and the quantities the prescription says to apply', () => {
    const d = completeFormDefaults(quantities, '2026-06-14');
    expect(d.doneOn).toBe('2026-06-14');
    expect(d.quantitiesUsed).toEqual([
      { key: 'brassica-blend', label: 'Brassica blend', amount: 12.5, unit: 'lb' },
      { key: 'labor:Drill', label: 'Drill seeding', amount: 2, unit: 'hour' },
    ]);
  });

  it('turns valid values into the queued fields (hours as text, blank notes empty)', () => {
    const out = CompleteFormSchema.parse({ ...completeFormDefaults(quantities, '2026-06-14'), hours: '3.5', notes: '  ' });
    expect(completionFields(out)).toEqual({ doneOn: '2026-06-14', notes: '', hours: '3.5', quantitiesUsed: completeFormDefaults(quantities, '2026-06-14').quantitiesUsed });
  });

  it('refuses a negative amount, an empty amount and a made-up date, with sentences a person can act on', () => {
    const bad = CompleteFormSchema.safeParse({ doneOn: '2026-02-30', hours: '', notes: '', quantitiesUsed: [{ key: 'a', label: 'Seed', amount: -1, unit: 'lb' }, { key: 'b', label: 'Lime', amount: Number.NaN, unit: 'ton' }] });
    expect(bad.success).toBe(false);
    const messages = Object.fromEntries((bad.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));
    expect(messages.doneOn).toBe('is not a real calendar date');
    expect(messages['quantitiesUsed.0.amount']).toBe('must be zero or more');
    expect(messages['quantitiesUsed.1.amount']).toBe('enter a number (0 if none was used)');
  });

  it('checks photo count and size before anything is queued', () => {
    // The server's limits (shared/limits.ts PHOTO_LIMITS): 8 photos, 15 MB each.
    expect(photoProblem(Array.from({ length: 8 }, (_, i) => ({ name: `p${i}.jpg`, size: 1000 })))).toBeNull();
    expect(photoProblem(Array.from({ length: 9 }, (_, i) => ({ name: `p${i}.jpg`, size: 1000 })))).toBe('Attach at most 8 photos; remove 1.');
    expect(photoProblem([{ name: 'huge.jpg', size: 15 * 1024 * 1024 + 1 }])).toMatch(/“huge\.jpg” is larger than 15 MB/);
  });
});

describe('the field sheet’s words for a task', () => {
  it('shows a completion still on the phone as done, waiting to send', () => {
    expect(FIELD_STATUS_LABELS[fieldStatus({ status: 'scheduled' }, true)]).toBe('Done (waiting to send)');
    expect(FIELD_STATUS_LABELS[fieldStatus({ status: 'done' }, true)]).toBe('Done');
    expect(FIELD_STATUS_LABELS[fieldStatus({ status: 'planned' }, false)]).toBe('Not dated yet');
  });

  it('writes the planned dates and today on the phone', () => {
    expect(plannedDates({ startDate: '2026-06-14', endDate: '2026-06-16' })).toBe('Set for Jun 14 – Jun 16, 2026');
    expect(plannedDates({ startDate: null, endDate: null })).toBeNull();
    // The firm's calendar day (Central time until the firm says otherwise), not UTC nor the phone's zone:
    // 05:30 UTC on Feb 1, 2026 is 11:30 PM CST on Jan 31 (UTC−6, 15 U.S.C. § 260a).
    expect(localToday(new Date('2026-02-01T05:30:00Z'))).toBe('2026-01-31');
  });
});
