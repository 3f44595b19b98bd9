import { beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { encode } from 'fast-png';
import { type Agent, propertyWithBrassicaPlot } from '../support/test-app';
import { binary, patchFirm, send, signedInFirm, textOfPdf, type FirmContext } from '../support/firm-settings';

import { Firm, OutboxMessage } from '../../server/models';

const upload = (agent: Agent, bytes: Buffer, name: string) => agent.post('/api/firm/logo').set('X-CSRF-Token', agent.csrf).attach('file', bytes, name);

/** A plain PNG of the given size (fast-png, RGB). */
function png(width: number, height: number): Buffer {
  return Buffer.from(encode({ width, height, data: new Uint8Array(width * height * 3).fill(120), channels: 3, depth: 8 }));
}

/** A JPEG made by ImageMagick. */
function jpeg(width: number, height: number): Buffer {
  return execFileSync('convert', ['-size', `${width}x${height}`, 'xc:#3F6B3A', 'jpg:-']);
}

/** Images in a PDF, one line each (poppler's pdfimages -list, two header lines). */
const pdfImageCount = (pdf: Buffer) => execFileSync('pdfimages', ['-list', '-'], { input: pdf }).toString().trim().split('\n').length - 2;

const PROFILE = {
  name: 'Driftless Habitat Works',
  address: 'PO Box 214\nGays Mills, WI 54631',
  phone: '608-555-0142',
  email: 'office@driftless-habitat.example',
  website: 'https://driftless-habitat.example',
  licenceNumbers: 'WI DATCP pesticide applicator #84-1123\nCertified prescribed burn manager WI-2291',
  defaultDepositPct: 25,
  paymentTermsDays: 15,
  proposalValidDays: 45,
  taxRatePct: 5.5,
  timezone: 'America/Chicago',
  areaUnit: 'hectares',
  lengthUnit: 'metres',
};

describe('the firm profile', () => {
  let ctx: FirmContext;
  let owner: Agent;
  let consultant: Agent;
  beforeAll(async () => {
    ({ ctx, owner, consultant } = await signedInFirm('owner', 'consultant'));
  });

  it('starts with a new firm’s defaults', async () => {
    const data = (await consultant.get('/api/firm').expect(200)).body.data;
    expect(data).toMatchObject({ website: null, licenceNumbers: null, logoUrl: null, defaultDepositPct: 30, paymentTermsDays: 30, proposalValidDays: 30, taxRatePct: 0, areaUnit: 'acres', lengthUnit: 'feet' });
  });

  it('lets the owner set every field, and reads them back', async () => {
    const res = await patchFirm(owner, PROFILE);
    expect(res.status).toBe(200);
    const { timezone: _zone, ...rest } = PROFILE;
    expect(res.body.data).toMatchObject(rest);
    expect((await consultant.get('/api/firm').expect(200)).body.data).toMatchObject(rest);
    // The older settings route and its shape keep working.
    expect(res.body.data.settings.taxRatePct).toBe(5.5);
    expect((await send(owner, 'patch', '/api/firm/settings', { timezone: 'America/Denver' })).body.data.timezone).toBe('America/Denver');
    expect((await consultant.get('/api/firm').expect(200)).body.data.name).toBe(PROFILE.name);
  });

  it('clears a text field sent empty and leaves the others', async () => {
    const res = await patchFirm(owner, { website: '' });
    expect(res.status).toBe(200);
    expect(res.body.data.website).toBeNull();
    expect(res.body.data.phone).toBe(PROFILE.phone);
    await patchFirm(owner, { website: PROFILE.website }).expect(200);
  });

  it('refuses bad fields with a sentence and changes nothing', async () => {
    const before = (await Firm.findByPk(ctx.firm.id))!.get({ plain: true });
    const cases: [Record<string, unknown>, RegExp][] = [
      [{ name: '' }, /the firm needs a name/],
      [{ email: 'not-an-address' }, /e-mail address such as/],
      [{ website: 'driftless.example' }, /start the website with https/],
      [{ defaultDepositPct: 120 }, /at most 100/],
      [{ paymentTermsDays: 2.5 }, /whole days/],
      [{ areaUnit: 'square miles' }, /acres or hectares/],
      [{ lengthUnit: 'yards' }, /feet or metres/],
      [{ timezone: 'Mars/Olympus' }, /choose a time zone/],
      [{ logoKey: 'logos/../../etc/passwd' }, /logoKey/],
      [{ name: 'x'.repeat(121) }, /name/],
    ];
    for (const [body, message] of cases) {
      const res = await patchFirm(owner, { phone: '000', ...body });
      expect(res.status, JSON.stringify(body)).toBe(422);
      expect(JSON.stringify(res.body), JSON.stringify(body)).toMatch(message);
    }
    expect((await Firm.findByPk(ctx.firm.id))!.get({ plain: true })).toEqual(before);
  });

  it('is the owner’s to change: a consultant is refused', async () => {
    expect((await send(consultant, 'patch', '/api/firm', { name: 'Taken over' })).status).toBe(403);
    expect((await upload(consultant, png(200, 80), 'logo.png')).status).toBe(403);
  });
});

describe('the firm’s logo', () => {
  let ctx: FirmContext;
  let owner: Agent;
  beforeAll(async () => {
    ({ ctx, owner } = await signedInFirm('owner'));
  });

  it('has none at first', async () => {
    expect((await owner.get('/api/firm/logo')).status).toBe(404);
  });

  it('takes a PNG and serves it back byte for byte', async () => {
    const bytes = png(240, 90);
    const res = await upload(owner, bytes, 'logo.png');
    expect(res.status).toBe(201);
    expect(res.body.data.logoUrl).toMatch(/^\/api\/firm\/logo\?v=[a-f0-9]{12}$/);
    const served = await binary(owner, res.body.data.logoUrl);
    expect(served.status).toBe(200);
    expect(served.type).toBe('image/png');
    expect(served.body.equals(bytes)).toBe(true);
  });

  it('takes a JPEG, named whatever, by its bytes', async () => {
    const bytes = jpeg(300, 120);
    const res = await upload(owner, bytes, 'logo.png');
    expect(res.status).toBe(201);
    const served = await binary(owner, '/api/firm/logo');
    expect(served.type).toBe('image/jpeg');
    expect(served.body.equals(bytes)).toBe(true);
  });

  it('refuses other formats, too many or too few pixels, and more than 1 MB, keeping the logo it had', async () => {
    const kept = (await Firm.findByPk(ctx.firm.id))!.logoKey;
    const gif = execFileSync('convert', ['-size', '100x40', 'xc:white', 'gif:-']);
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="100" height="40"/>');
    const checks: [Buffer, string, number, RegExp][] = [
      [gif, 'logo.gif', 415, /PNG or JPEG/],
      [svg, 'logo.png', 415, /PNG or JPEG/],
      [png(2400, 40), 'wide.png', 422, /2400 × 40 pixels; the limit is 2000/],
      [png(20, 20), 'tiny.png', 422, /at least 32/],
      [Buffer.concat([png(100, 40), Buffer.alloc(1024 * 1024)]), 'padded.png', 413, /larger than 1 MB/],
      [Buffer.alloc(3 * 1024 * 1024, 1), 'huge.png', 413, /larger than 1 MB/],
    ];
    for (const [bytes, name, status, message] of checks) {
      const res = await upload(owner, bytes, name);
      expect(res.status, name).toBe(status);
      expect(res.body.error, name).toMatch(message);
    }
    expect((await owner.post('/api/firm/logo').set('X-CSRF-Token', owner.csrf).send({})).status).toBe(400);
    expect((await Firm.findByPk(ctx.firm.id))!.logoKey).toBe(kept);
  });
});

describe('documents and e-mails print the profile; a sent one keeps it', () => {
  let ctx: FirmContext;
  let owner: Agent;
  let consultant: Agent;
  let client: Agent;
  let propertyId: number;
  beforeAll(async () => {
    ({ ctx, owner, consultant, client } = await signedInFirm('owner', 'consultant', 'client'));
    propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
    await patchFirm(owner, PROFILE).expect(200);
    await upload(owner, png(240, 90), 'logo.png').expect(201);
  });

  it('a new proposal starts from the profile’s deposit, tax and validity; its invoice from the payment terms', async () => {
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, {});
    expect(draft.status).toBe(201);
    expect(draft.body.data.depositPct).toBe(25);
    expect(draft.body.data.taxRatePct).toBe(5.5);
    expect(draft.body.data.terms).toContain('Payment is due within 15 days of an invoice.');
    const created = Date.parse(`${draft.body.data.expiresOn}T00:00:00Z`) - 45 * 86_400_000;
    expect(Math.abs(created - Date.now())).toBeLessThan(2 * 86_400_000); // 45 days from today, whichever zone's today
    expect((await send(consultant, 'post', `/api/proposals/${draft.body.data.id}/send`)).status).toBe(200);
    expect((await send(client, 'post', `/api/proposals/${draft.body.data.id}/approve`, { signedName: 'Pat Landowner' })).status).toBe(200);
    const invoices = (await consultant.get(`/api/invoices?proposalId=${draft.body.data.id}`).expect(200)).body.data;
    expect((await consultant.get(`/api/invoices/${invoices[0].id}`).expect(200)).body.data.termsDays).toBe(15);
  });

  it('the proposal and invoice PDFs print name, address, phone, e-mail, website, licences and logo, and keep them once sent', async () => {
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, {});
    const id = draft.body.data.id;
    const draftPdf = (await binary(consultant, `/api/proposals/${id}/pdf`)).body;
    const text = textOfPdf(draftPdf);
    for (const s of ['Driftless Habitat Works', 'PO Box 214, Gays Mills, WI 54631', '608-555-0142', 'office@driftless-habitat.example', 'driftless-habitat.example', 'WI DATCP pesticide applicator #84-1123', 'Certified prescribed burn manager WI-2291']) expect(text).toContain(s);
    expect(text).not.toContain('https://');

    // The logo is one more image in the PDF than without it.
    const logoKey = (await Firm.findByPk(ctx.firm.id))!.logoKey;
    await Firm.update({ logoKey: null }, { where: { id: ctx.firm.id } });
    const withoutLogo = pdfImageCount((await binary(consultant, `/api/proposals/${id}/pdf`)).body);
    await Firm.update({ logoKey }, { where: { id: ctx.firm.id } });
    expect(pdfImageCount(draftPdf)).toBe(withoutLogo + 1);

    expect((await send(consultant, 'post', `/api/proposals/${id}/send`)).status).toBe(200);
    expect((await send(client, 'post', `/api/proposals/${id}/approve`, { signedName: 'Pat Landowner' })).status).toBe(200);
    const sentText = textOfPdf((await binary(consultant, `/api/proposals/${id}/pdf`)).body);
    const invoiceId = (await consultant.get(`/api/invoices?proposalId=${id}`).expect(200)).body.data[0].id;
    expect((await send(consultant, 'post', `/api/invoices/${invoiceId}/send`)).status).toBe(200);
    const invoicePdf = (await binary(consultant, `/api/invoices/${invoiceId}/pdf`)).body;
    const invoiceText = textOfPdf(invoicePdf);
    for (const s of ['Driftless Habitat Works', 'PO Box 214, Gays Mills, WI 54631', 'WI DATCP pesticide applicator #84-1123']) expect(invoiceText).toContain(s);
    const invoiceImages = pdfImageCount(invoicePdf);
    expect(invoiceImages).toBeGreaterThanOrEqual(1);

    // The firm moves, renames itself and changes its logo: what was sent still reads as sent.
    await patchFirm(owner, { name: 'Kickapoo Land Care', address: '1 Main St\nViola, WI 54664', licenceNumbers: null }).expect(200);
    await upload(owner, png(400, 100), 'new-logo.png').expect(201);
    expect(textOfPdf((await binary(client, `/api/proposals/${id}/pdf`)).body)).toBe(sentText);
    const laterInvoice = (await binary(consultant, `/api/invoices/${invoiceId}/pdf`)).body;
    expect(textOfPdf(laterInvoice)).toBe(invoiceText);
    const oldLogo = execFileSync('pdfimages', ['-list', '-'], { input: invoicePdf }).toString();
    expect(execFileSync('pdfimages', ['-list', '-'], { input: laterInvoice }).toString()).toBe(oldLogo);
    // A new draft prints the firm as it is now.
    const fresh = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, {});
    const freshText = textOfPdf((await binary(consultant, `/api/proposals/${fresh.body.data.id}/pdf`)).body);
    expect(freshText).toContain('Kickapoo Land Care');
    expect(freshText).toContain('1 Main St, Viola, WI 54664');
    expect(freshText).not.toContain('DATCP');
    await patchFirm(owner, PROFILE).expect(200);
  });

  it('client e-mails sign off with the firm’s address, phone, e-mail, website and licences', async () => {
    const rows = await OutboxMessage.findAll({ where: { firmId: ctx.firm.id, kind: 'proposal-sent' } });
    expect(rows.length).toBeGreaterThan(0);
    const plain = JSON.stringify(rows[0]!.get({ plain: true }));
    expect(plain).toContain('PO Box 214, Gays Mills, WI 54631');
    expect(plain).toContain('608-555-0142  ·  office@driftless-habitat.example  ·  driftless-habitat.example');
    expect(plain).toContain('WI DATCP pesticide applicator #84-1123');
  });
  it('the plan summary prints the letterhead too, and plan and proposal PDFs show areas in the firm’s unit', async () => {
    // PROFILE chose hectares and metres: 1 acre = 0.40468564224 ha (NIST Handbook 44, Appendix C).
    const plan = textOfPdf((await binary(consultant, `/api/properties/${propertyId}/plan.pdf`)).body);
    expect(plan).toContain('Driftless Habitat Works');
    expect(plan).toContain('PO Box 214');
    expect(plan).toContain('WI DATCP pesticide applicator #84-1123');
    expect(plan).toMatch(/\d+\.\d+ ha\b/);
    expect(plan).not.toMatch(/\d+\.\d+ acres?\b/);
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, {});
    const proposal = textOfPdf((await binary(consultant, `/api/proposals/${draft.body.data.id}/pdf`)).body);
    // The property's area and the work's sizes in hectares; priced quantities stay in the unit their price is per (acre).
    expect(proposal).toMatch(/\d+\.\d+ ha\b/);
    expect(proposal).toMatch(/\d+\.\d+ acres\s+\$\d+\.\d{2}/);
    // Back to acres: the same figures print in acres.
    await patchFirm(owner, { areaUnit: 'acres' }).expect(200);
    const again = textOfPdf((await binary(consultant, `/api/properties/${propertyId}/plan.pdf`)).body);
    expect(again).toMatch(/\d+\.\d+ acres\b/);
    await patchFirm(owner, PROFILE).expect(200);
  });
});
