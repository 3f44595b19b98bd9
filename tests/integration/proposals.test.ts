import { beforeAll, describe, expect, it } from 'vitest';
import { ProposalDtoSchema } from '../../shared/schemas/proposal-dto';
import crypto from 'node:crypto';
import { execFileSync } from 'node:child_process';
import { capturedMailTo, capturedMessage, signedInAgent, type Agent } from '../support/test-app';
import { deliverAllMail } from '../support/test-app';
import { makeFirm, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { Practice, Proposal } from '../../server/models';
import { canonicalProposalContent, proposalTotals } from '../../shared/domain/proposal-totals';
import { formatCents } from '../../shared/domain/money';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let client: Agent;
let propertyId: number;

const send = (agent: Agent, method: 'post' | 'patch', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

async function pdfText(agent: Agent, url: string): Promise<string> {
  const res = await agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  expect(res.status).toBe(200);
  return execFileSync('pdftotext', ['-layout', '-', '-'], { input: res.body as Buffer }).toString();
}

/** Recomputes the totals from the answer's lines with the shared rule. */
function recompute(p: { lines: { id: number; quantity: string; unitPriceCents: number; taxable: boolean; optional: boolean; selected: boolean; category: string; description: string; unit: string }[]; discount: never; taxRatePct: number; depositPct: number }) {
  return proposalTotals({
    lines: p.lines.map((l) => ({ ...l, id: `line-${String(l.id).padStart(9, '0')}` })),
    discount: p.discount,
    taxRatePct: p.taxRatePct.toFixed(4),
    depositPct: p.depositPct.toFixed(4),
  });
}

async function draft(): Promise<{ id: number } & Record<string, never>> {
  const res = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { taxRatePct: 5.5, depositPct: 30 });
  expect(res.status).toBe(201);
  return ProposalDtoSchema.parse(res.body.data) as unknown as { id: number } & Record<string, never>;
}

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  const plot = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'food-plot', name: 'North plot', geometry: rectangle(-90.938, 43.2655, 120, 80) });
  const timber = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'timber', name: 'Oak slope', geometry: rectangle(-90.936, 43.2655, 200, 150) });
  const brassica = (await Practice.findOne({ where: { firmId: ctx.firm.id, key: 'fall-brassica-plot' } }))!.id;
  const tsi = (await Practice.findOne({ where: { firmId: ctx.firm.id, key: 'tsi-hinge-cut' } }))!.id;
  expect((await send(consultant, 'post', `/api/units/${plot.body.data.id}/prescriptions`, { practiceId: brassica })).status).toBe(201);
  expect((await send(consultant, 'post', `/api/units/${timber.body.data.id}/prescriptions`, { practiceId: tsi })).status).toBe(201);
});

describe('drafting and editing', () => {
  it('drafts a proposal from the plan’s prescriptions, with totals by the shared rule', async () => {
    const p = await draft();
    const data = p as unknown as Parameters<typeof recompute>[0] & { number: string; status: string; totalCents: number; subtotalCents: number; groups: { label: string }[] };
    expect(data.status).toBe('draft');
    expect(data.number).toMatch(/^P-\d{4}-\d{3}$/);
    expect(data.lines.length).toBeGreaterThan(5);
    expect(data.groups.map((g) => g.label)).toEqual(expect.arrayContaining(['North plot', 'Oak slope']));
    const totals = recompute(data);
    expect(data.totalCents).toBe(totals.totalCents);
    expect(data.subtotalCents).toBe(data.lines.reduce((s, l) => s + (l as unknown as { amountCents: number }).amountCents, 0));
  });

  it('edits a draft: manual and optional lines, discount and tax, re-priced exactly', async () => {
    const p = (await draft()) as unknown as { id: number; lines: Record<string, unknown>[] };
    const lines = p.lines.map((l) => ({ groupLabel: l.groupLabel, unitId: l.unitId, prescriptionId: l.prescriptionId, category: l.category, description: l.description, quantity: l.quantity, unit: l.unit, unitPriceCents: l.unitPriceCents, taxable: l.taxable, optional: false }));
    lines.push({ groupLabel: 'Extras', unitId: null, prescriptionId: null, category: 'fees', description: 'Plan walk-through with the family', quantity: '1', unit: 'visit', unitPriceCents: 25000, taxable: false, optional: false });
    lines.push({ groupLabel: 'Extras', unitId: null, prescriptionId: null, category: 'materials', description: 'Two trail cameras', quantity: '2', unit: 'each', unitPriceCents: 18999, taxable: true, optional: true });
    const res = await send(consultant, 'patch', `/api/proposals/${p.id}`, { lines, discount: { kind: 'percent', percent: 5 }, taxRatePct: 7.25 });
    expect(res.status).toBe(200);
    ProposalDtoSchema.parse(res.body.data);
    const data = res.body.data;
    const option = data.lines.find((l: { description: string }) => l.description === 'Two trail cameras');
    expect(option).toMatchObject({ optional: true, included: false, amountCents: 37998 });
    const totals = recompute(data);
    expect(data.totalCents).toBe(totals.totalCents);
    expect(data.discountCents).toBe(totals.discountCents);
    expect(data.depositCents + data.balanceCents).toBe(data.totalCents);
  });

  it('refuses bad lines with 422 naming the field and keeps the draft as it was', async () => {
    const p = (await draft()) as unknown as { id: number; totalCents: number };
    const res = await send(consultant, 'patch', `/api/proposals/${p.id}`, { lines: [{ groupLabel: 'X', category: 'fees', description: 'Bad', quantity: '-2', unit: 'each', unitPriceCents: 100 }] });
    expect(res.status).toBe(422);
    expect(res.body.details[0].path).toBe('lines.0.quantity');
    const after = await consultant.get(`/api/proposals/${p.id}`).expect(200);
    expect(after.body.data.totalCents).toBe(p.totalCents);
  });

  it('hides drafts from the client and all proposals from crew', async () => {
    const p = await draft();
    await client.get(`/api/proposals/${p.id}`).expect(404);
    const crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
    await crew.get(`/api/proposals/${p.id}`).expect(403);
    await crew.get('/api/proposals').expect(403);
  });
});

describe('sending, approval and versions', () => {
  it('sends with the PDF and a portal link; the client approves with a typed name; the record is fixed', async () => {
    const p = await draft();
    const sent = await send(consultant, 'post', `/api/proposals/${p.id}/send`);
    expect(sent.status).toBe(200);
    expect(sent.body.data.status).toBe('sent');
    await deliverAllMail();
    const [mail] = await capturedMailTo(ctx.users.client.email);
    const full = await capturedMessage(mail.id);
    expect(full.text).toContain(`/portal/proposals/${p.id}`);
    expect(full.attachments[0].filename).toMatch(/\.pdf$/);

    const viewed = await client.get(`/api/proposals/${p.id}`).expect(200);
    expect(viewed.body.data.firstViewedAt).not.toBeNull();
    expect((await send(consultant, 'patch', `/api/proposals/${p.id}`, { title: 'Changed after sending' })).status).toBe(409);

    expect((await send(client, 'post', `/api/proposals/${p.id}/approve`, { signedName: '' })).status).toBe(422);
    expect((await send(consultant, 'post', `/api/proposals/${p.id}/approve`, { signedName: 'Consultant Person' })).status).toBe(403);
    const other = await makeFirm();
    const stranger = await signedInAgent(other.users.client.email, PASSWORD);
    expect((await send(stranger, 'post', `/api/proposals/${p.id}/approve`, { signedName: 'Not The Owner' })).status).toBe(404);

    const approved = await client.post(`/api/proposals/${p.id}/approve`).set('X-CSRF-Token', client.csrf).set('User-Agent', 'Browseline test browser').send({ signedName: 'Pat Landowner' });
    expect(approved.status).toBe(200);
    ProposalDtoSchema.parse(approved.body.data);
    const data = approved.body.data;
    expect(data.status).toBe('approved');
    expect(data.approval.signedName).toBe('Pat Landowner');
    expect(data.approval.userAgent).toBe('Browseline test browser');
    expect(data.approval.ip).toMatch(/127\.0\.0\.1/);
    const content = canonicalProposalContent({
      lines: data.lines.map((l: { id: number }) => ({ ...l, id: `line-${String(l.id).padStart(9, '0')}` })),
      discount: data.discount,
      taxRatePct: data.taxRatePct.toFixed(4),
      depositPct: data.depositPct.toFixed(4),
      terms: data.terms,
      currency: data.currency,
      // The plan's geometry as sent is part of what the client approves.
      plan: (await Proposal.findByPk(p.id))!.planSnapshot,
    });
    expect(JSON.parse(content).plan.units).toHaveLength(2);
    expect(data.approval.contentHash).toBe(crypto.createHash('sha256').update(content).digest('hex'));

    expect((await send(client, 'post', `/api/proposals/${p.id}/approve`, { signedName: 'Pat Landowner' })).status).toBe(409);
    expect((await send(consultant, 'patch', `/api/proposals/${p.id}`, { terms: 'New terms' })).status).toBe(409);
    await deliverAllMail();
    const notices = await capturedMailTo(ctx.users.consultant.email);
    expect(notices.some((m) => /approved proposal/.test(m.subject))).toBe(true);

    const revised = await send(consultant, 'post', `/api/proposals/${p.id}/revise`);
    expect(revised.status).toBe(201);
    expect(revised.body.data).toMatchObject({ version: 2, status: 'draft', number: data.number });
    const first = await consultant.get(`/api/proposals/${p.id}`).expect(200);
    expect(first.body.data.status).toBe('approved');
    const versions = await consultant.get(`/api/proposals/${p.id}/versions`).expect(200);
    expect(versions.body.data.map((v: { version: number }) => v.version).sort()).toEqual([1, 2]);
  });

  it('takes the client’s options into the approved totals', async () => {
    const p = (await draft()) as unknown as { id: number; lines: Record<string, unknown>[] };
    const lines = p.lines.slice(0, 3).map((l) => ({ groupLabel: l.groupLabel, category: l.category, description: l.description, quantity: l.quantity, unit: l.unit, unitPriceCents: l.unitPriceCents, taxable: l.taxable, optional: false }));
    lines.push({ groupLabel: 'Extras', category: 'materials', description: 'Trail camera', quantity: '1', unit: 'each', unitPriceCents: 15000, taxable: true, optional: true });
    const edited = await send(consultant, 'patch', `/api/proposals/${p.id}`, { lines });
    const option = edited.body.data.lines.find((l: { optional: boolean }) => l.optional);
    await send(consultant, 'post', `/api/proposals/${p.id}/send`).expect(200);
    const approved = await send(client, 'post', `/api/proposals/${p.id}/approve`, { signedName: 'Pat Landowner', optionIds: [option.id] });
    expect(approved.status).toBe(200);
    expect(approved.body.data.totalCents).toBeGreaterThan(edited.body.data.totalCents);
    expect(approved.body.data.totalCents).toBe(recompute(approved.body.data).totalCents);
    const bogus = (await draft()) as unknown as { id: number };
    await send(consultant, 'post', `/api/proposals/${bogus.id}/send`).expect(200);
    expect((await send(client, 'post', `/api/proposals/${bogus.id}/approve`, { signedName: 'Pat Landowner', optionIds: [999999] })).status).toBe(422);
  });

  it('refuses to approve an expired or withdrawn proposal, and takes a decline with its reason', async () => {
    const expired = await draft();
    await send(consultant, 'post', `/api/proposals/${expired.id}/send`).expect(200);
    await Proposal.update({ expiresOn: '2020-01-01' }, { where: { id: expired.id } });
    const e = await send(client, 'post', `/api/proposals/${expired.id}/approve`, { signedName: 'Pat Landowner' });
    expect(e.status).toBe(409);
    expect(e.body.error).toMatch(/expired/);
    expect((await client.get(`/api/proposals/${expired.id}`)).body.data.status).toBe('expired');

    const withdrawn = await draft();
    await send(consultant, 'post', `/api/proposals/${withdrawn.id}/send`).expect(200);
    await send(consultant, 'post', `/api/proposals/${withdrawn.id}/withdraw`).expect(200);
    expect((await send(client, 'post', `/api/proposals/${withdrawn.id}/approve`, { signedName: 'Pat Landowner' })).status).toBe(409);

    const declined = await draft();
    await send(consultant, 'post', `/api/proposals/${declined.id}/send`).expect(200);
    expect((await send(client, 'post', `/api/proposals/${declined.id}/decline`, {})).status).toBe(422);
    const d = await send(client, 'post', `/api/proposals/${declined.id}/decline`, { reason: 'We want to wait a year.' });
    expect(d.status).toBe(200);
    expect(d.body.data).toMatchObject({ status: 'declined', declineReason: 'We want to wait a year.' });
  });

  it('prints the same totals in the PDF as the API answers', async () => {
    const p = await draft();
    const data = ProposalDtoSchema.parse((await consultant.get(`/api/proposals/${p.id}`)).body.data);
    const text = await pdfText(consultant, `/api/proposals/${p.id}/pdf`);
    for (const cents of [data.subtotalCents, data.taxCents, data.totalCents, data.depositCents]) expect(text).toContain(formatCents(cents));
    expect(text).toMatch(/Page 1 of \d/);
  });

  it('lets a second contact of the same client read the sent proposal', async () => {
    const contact = await makeUser(ctx.firm.id, 'client', ctx.client.id);
    const agent = await signedInAgent(contact.email, PASSWORD);
    const p = await draft();
    await send(consultant, 'post', `/api/proposals/${p.id}/send`).expect(200);
    const list = await agent.get('/api/proposals').expect(200);
    expect(list.body.data.map((x: { id: number }) => x.id)).toContain(p.id);
    expect(list.body.data.every((x: { status: string }) => x.status !== 'draft')).toBe(true);
  });
});

describe('records that must stay', () => {
  it('refuses to delete a property with an approved proposal', async () => {
    const p = await draft();
    await send(consultant, 'post', `/api/proposals/${p.id}/send`).expect(200);
    await send(client, 'post', `/api/proposals/${p.id}/approve`, { signedName: 'Pat Landowner' }).expect(200);
    const res = await consultant.delete(`/api/properties/${propertyId}`).set('X-CSRF-Token', consultant.csrf);
    expect(res.status).toBe(409);
    await consultant.get(`/api/properties/${propertyId}`).expect(200);
  });
});
