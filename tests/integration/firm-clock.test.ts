import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { type Agent, propertyWithBrassicaPlot } from '../support/test-app';
import { pdfText, send, signedInFirm, type FirmContext } from '../support/firm-settings';
import { rectangle } from '../support/geodesy';
import { Firm, Practice } from '../../server/models';

// The firm's clock. US Central time is UTC−6 in winter (CST) and UTC−5 in summer (CDT); daylight
// time ends on the first Sunday of November (15 U.S.C. § 260a), so November 30 is on CST.
// 11:30 PM CST on Monday, November 30, 2026 is 05:30 UTC on December 1: the UTC date is a day ahead.
const LAST_DAY_2330_CST = new Date('2026-12-01T05:30:00Z');


afterEach(() => {
  vi.useRealTimers();
});

describe('the firm’s time zone', () => {
  let ctx: FirmContext;
  let owner: Agent;
  let consultant: Agent;
  beforeAll(async () => {
    ({ ctx, owner, consultant } = await signedInFirm('owner', 'consultant'));
  });

  it('starts on Central time and travels with the signed-in user', async () => {
    expect((await owner.get('/api/firm').expect(200)).body.data.timezone).toBe('America/Chicago');
    expect((await consultant.get('/api/auth/me').expect(200)).body.user.firmTimezone).toBe('America/Chicago');
  });

  it('lets the owner change it to a zone Intl knows, and refuses others with a sentence', async () => {
    const bad = await send(owner, 'patch', '/api/firm/settings', { timezone: 'America/Springfield' });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toMatch(/choose a time zone from the list/);
    expect((await Firm.findByPk(ctx.firm.id))!.timezone).toBe('America/Chicago');

    expect((await send(consultant, 'patch', '/api/firm/settings', { timezone: 'America/Denver' })).status).toBe(403);

    const ok = await send(owner, 'patch', '/api/firm/settings', { timezone: 'America/Denver' });
    expect(ok.status).toBe(200);
    expect(ok.body.data.timezone).toBe('America/Denver');
    // Other settings stay as they were; the zone is a column, not a settings key.
    expect(ok.body.data.settings).not.toHaveProperty('timezone');
    expect((await consultant.get('/api/auth/me').expect(200)).body.user.firmTimezone).toBe('America/Denver');
    await send(owner, 'patch', '/api/firm/settings', { timezone: 'America/Chicago' }).expect(200);
  });
});

describe('today at 11:30 PM on the last day of a month, in Chicago', () => {
  let ctx: FirmContext;
  let consultant: Agent;
  let client: Agent;
  let propertyId: number;
  beforeAll(async () => {
    ({ ctx, consultant, client } = await signedInFirm('consultant', 'client'));
    propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
  });

  it('a proposal valid until November 30 is still open and can be approved; the invoice is dated November 30', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(LAST_DAY_2330_CST);
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { depositPct: 30, expiresOn: '2026-11-30' });
    expect(draft.status).toBe(201);
    expect((await send(consultant, 'post', `/api/proposals/${draft.body.data.id}/send`)).status).toBe(200);

    const seen = await client.get(`/api/proposals/${draft.body.data.id}`).expect(200);
    expect(seen.body.data.status).toBe('sent'); // the UTC clock said December 1: "expired"
    const sentList = await consultant.get('/api/proposals?status=sent').expect(200);
    expect(sentList.body.data.map((p: { id: number }) => p.id)).toContain(draft.body.data.id);

    const approved = await send(client, 'post', `/api/proposals/${draft.body.data.id}/approve`, { signedName: 'Pat Landowner' });
    expect(approved.status).toBe(200);

    const invoices = await consultant.get(`/api/invoices?proposalId=${draft.body.data.id}`).expect(200);
    const deposit = invoices.body.data[0];
    const issued = await send(consultant, 'post', `/api/invoices/${deposit.id}/send`);
    expect(issued.status).toBe(200);
    expect(issued.body.data.issuedOn).toBe('2026-11-30');
  });

  it('a harvest dated December 1 is still in the future at 11:30 PM on November 30, and the message writes the date as people do', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(LAST_DAY_2330_CST);
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, { date: '2026-12-01', sex: 'male', ageClass: '2.5' });
    expect(res.status).toBe(422);
    expect(res.body.error).toContain('Dec 1, 2026 is in the future');
    expect((await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, { date: '2026-11-30', sex: 'male', ageClass: '2.5' })).status).toBe(201);
  });

  it('an overdue reminder goes for an invoice due November 29, not yet for one due November 30', async () => {
    const { Invoice } = await import('../../server/models');
    const { sendOverdueReminders } = await import('../../server/commands/reminder-sender');
    const open = (number: string, dueOn: string) =>
      Invoice.create({ firmId: ctx.firm.id, clientId: ctx.client.id, propertyId, proposalId: null, kind: 'final', number, status: 'open', totalCents: 10_000, billedCents: 10_000, subtotalCents: 10_000, issuedOn: '2026-10-30', dueOn, createdById: null });
    const due29 = await open(`INV-CLOCK-${ctx.firm.id}-1`, '2026-11-29');
    const due30 = await open(`INV-CLOCK-${ctx.firm.id}-2`, '2026-11-30');
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(LAST_DAY_2330_CST);
    await sendOverdueReminders();
    expect((await due29.reload()).lastReminderOn).toBe('2026-11-30');
    expect((await due30.reload()).lastReminderOn).toBeNull(); // the UTC clock (Dec 1) called it a day overdue
    const list = await consultant.get(`/api/invoices?propertyId=${propertyId}`).expect(200);
    const row = list.body.data.find((i: { id: number }) => i.id === due30.id);
    expect(row.daysOverdue ?? 0).toBe(0);
  });

  it('a new prescription made mid-window, without dates, targets today in the firm’s zone, not the window’s passed first day', async () => {
    // Midwest fall brassica window: Jul 20 – Aug 31 (from memory / common practice, per Missouri Extension G4652's direction).
    const seedBed = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'food-plot', name: 'Mid-window plot', geometry: rectangle(-90.9365, 43.2668, 90, 60) });
    const brassica = (await Practice.findOne({ where: { firmId: ctx.firm.id, key: 'fall-brassica-plot' } }))!.id;
    vi.useFakeTimers({ toFake: ['Date'] });
    // 11:30 PM CDT on Monday, August 31 — the window's last day — is 04:30 UTC on September 1.
    vi.setSystemTime(new Date('2026-09-01T04:30:00Z'));
    const res = await send(consultant, 'post', `/api/units/${seedBed.body.data.id}/prescriptions`, { practiceId: brassica });
    expect(res.status).toBe(201);
    expect(res.body.data.year).toBe(2026);
    expect(res.body.data.schedule.anchorWindow).toMatchObject({ earliest: '2026-07-20', latest: '2026-08-31' });
    expect(res.body.data.schedule.targetDate).toBe('2026-08-31');
  });

  it('the approval e-mail to the consultant gives the time in the firm’s zone with its abbreviation', async () => {
    const { OutboxMessage } = await import('../../server/models');
    const rows = await OutboxMessage.findAll({ where: { firmId: ctx.firm.id, kind: 'proposal-approved' } });
    expect(rows.length).toBeGreaterThan(0);
    expect(JSON.stringify(rows.map((r) => r.get({ plain: true })))).toContain('Nov 30, 2026, 11:30 PM CST');
  });
});

describe('documents that never change', () => {
  let ctx: FirmContext;
  let consultant: Agent;
  let owner: Agent;
  let client: Agent;
  let propertyId: number;
  beforeAll(async () => {
    ({ ctx, consultant, owner, client } = await signedInFirm('consultant', 'owner', 'client'));
    propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
  });

  it('a sent and then approved proposal’s PDF keeps its plan when units are drawn later; a new draft shows them', async () => {
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { depositPct: 30 });
    const id = draft.body.data.id;
    expect((await send(consultant, 'post', `/api/proposals/${id}/send`)).status).toBe(200);
    const sentText = await pdfText(consultant, `/api/proposals/${id}/pdf`);
    expect(sentText).not.toContain('Sanctuary');

    // A large sanctuary drawn after sending: its legend entry ("Sanctuary") would show on a live map.
    const late = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'sanctuary', name: 'Late hollow', geometry: rectangle(-90.9335, 43.2668, 300, 200) });
    expect(late.status).toBe(201);
    expect(await pdfText(consultant, `/api/proposals/${id}/pdf`)).toBe(sentText);
    expect(await pdfText(client, `/api/proposals/${id}/pdf`)).toBe(sentText);

    const approved = await send(client, 'post', `/api/proposals/${id}/approve`, { signedName: 'Pat Landowner' });
    expect(approved.status).toBe(200);
    const approvedText = await pdfText(consultant, `/api/proposals/${id}/pdf`);
    expect(approvedText).not.toContain('Sanctuary');
    // The approved plot is redrawn twice as large: the document keeps the size it was approved with.
    const units = (await consultant.get(`/api/properties/${propertyId}/units`).expect(200)).body.data as { id: number; name: string }[];
    const north = units.find((u) => u.name === 'North plot')!;
    expect((await send(consultant, 'patch', `/api/units/${north.id}`, { geometry: rectangle(-90.938, 43.2655, 240, 160) })).status).toBe(200);
    await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'sanctuary', name: 'Later still', geometry: rectangle(-90.9365, 43.2662, 150, 100) });
    expect(await pdfText(consultant, `/api/proposals/${id}/pdf`)).toBe(approvedText);

    // The fingerprint covers the geometry as sent: one unit, not three.
    const { ProposalApproval } = await import('../../server/models');
    const record = await ProposalApproval.findOne({ where: { proposalId: id } });
    const content = JSON.parse(record!.content);
    expect(content.version).toBe(2);
    expect(content.plan.units.map((u: { name: string }) => u.name)).toEqual(['North plot']);

    // The check above can see a sanctuary: a fresh draft's live map shows it.
    const fresh = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, {});
    expect(await pdfText(consultant, `/api/proposals/${fresh.body.data.id}/pdf`)).toContain('Sanctuary');
  });

  it('a version sent before plans were frozen is frozen the first time its PDF is made', async () => {
    const { Proposal } = await import('../../server/models');
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, {});
    expect((await send(consultant, 'post', `/api/proposals/${draft.body.data.id}/send`)).status).toBe(200);
    await Proposal.update({ planSnapshot: null }, { where: { id: draft.body.data.id } }); // as a row from before migration 0012
    const first = await pdfText(consultant, `/api/proposals/${draft.body.data.id}/pdf`);
    expect((await Proposal.findByPk(draft.body.data.id))!.planSnapshot).not.toBeNull();
    await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'water', name: 'New pond', geometry: rectangle(-90.9395, 43.2690, 120, 90) });
    expect(await pdfText(consultant, `/api/proposals/${draft.body.data.id}/pdf`)).toBe(first);
  });

  it('a sent invoice’s PDF keeps the names it was issued with', async () => {
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { depositPct: 25 });
    // Only one draft at a time per series is fine; this is a new series.
    expect((await send(consultant, 'post', `/api/proposals/${draft.body.data.id}/send`)).status).toBe(200);
    expect((await send(client, 'post', `/api/proposals/${draft.body.data.id}/approve`, { signedName: 'Pat Landowner' })).status).toBe(200);
    const [deposit] = (await consultant.get(`/api/invoices?proposalId=${draft.body.data.id}`).expect(200)).body.data;
    expect((await send(consultant, 'post', `/api/invoices/${deposit.id}/send`)).status).toBe(200);
    const issuedText = await pdfText(consultant, `/api/invoices/${deposit.id}/pdf`);
    const oldName = ctx.firm.name;
    expect(issuedText).toContain(oldName);

    await ctx.firm.reload();
    await ctx.firm.update({ name: 'Renamed Habitat Partners' });
    await ctx.client.update({ name: 'Renamed Family Trust' });
    const later = await pdfText(client, `/api/invoices/${deposit.id}/pdf`);
    expect(later).toBe(issuedText);
    expect(later).not.toContain('Renamed');
    await ctx.firm.update({ name: oldName });
  });

  it('a sent season report cannot be deleted, nor its PDF file', async () => {
    // A season with nothing in it makes no report; one harvest gives it something to say.
    expect((await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, { date: '2026-10-05', sex: 'male', ageClass: '1.5' })).status).toBe(201);
    const made = await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 2026 });
    expect(made.status).toBe(201);
    const id = made.body.data.id;
    expect((await send(consultant, 'post', `/api/season-reports/${id}/send`)).status).toBe(200);
    const del = await send(owner, 'delete', `/api/season-reports/${id}`);
    expect(del.status).toBe(409);
    expect(del.body.error).toMatch(/stays as sent/);
    const { SeasonReport } = await import('../../server/models');
    const report = await SeasonReport.findByPk(id);
    expect(report).not.toBeNull();
    const fileDel = await send(owner, 'delete', `/api/files/${report!.sharedFileId}`);
    expect(fileDel.status).toBe(409);
    expect((await consultant.get(`/api/season-reports/${id}/pdf`)).status).toBe(200);
  });
});
