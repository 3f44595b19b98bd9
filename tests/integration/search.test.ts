/**
 * `GET /api/search?q=`: the header search over the firm's clients, properties, proposals (by number),
 * invoices (by number) and client contacts — typo-tolerant, ranked, firm-scoped, and never a 500.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';
import { makeClient, makeFirm, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { sequelize } from '../../server/db/sequelize';
import { Client, Invoice, Property } from '../../server/models';
import { SearchAnswerSchema } from '../../shared/schemas/search';

const tag = crypto.randomBytes(3).toString('hex');
let consultant: Agent;
let otherFirmClientName: string;
const ids: Record<string, number> = {};

/** A proposal row with only what the search reads (raw insert: the builder's flow is not under test). */
async function insertProposal(firmId: number, propertyId: number, clientId: number, number: string, version: number): Promise<number> {
  const [row] = await sequelize.query<{ id: number }>(
    `INSERT INTO proposals (firm_id, property_id, client_id, number, version, title) VALUES (:firmId, :propertyId, :clientId, :number, :version, 'Food plots and timber stand work') RETURNING id`,
    { replacements: { firmId, propertyId, clientId, number, version }, type: QueryTypes.SELECT },
  );
  return row!.id;
}

beforeAll(async () => {
  const { firm, users } = await makeFirm();
  consultant = await signedInAgent(users.consultant.email, PASSWORD);
  const client = await makeClient(firm.id, `Halvorsen Family Trust ${tag}`);
  ids.client = client.id;
  const property = await makeProperty(firm.id, client.id);
  await property.update({ name: `Bluestem Ridge ${tag}` });
  ids.property = property.id;
  ids.proposalV1 = await insertProposal(firm.id, property.id, client.id, `P-${tag}-0417`, 1);
  ids.proposalV2 = await insertProposal(firm.id, property.id, client.id, `P-${tag}-0417`, 2);
  const invoice = await Invoice.create({ firmId: firm.id, clientId: client.id, propertyId: property.id, kind: 'progress', number: `INV-${tag}-0093`, status: 'open', issuedOn: '2026-03-01', dueOn: '2026-03-31', subtotalCents: 10_000, totalCents: 10_000, billedCents: 10_000 });
  ids.invoice = invoice.id;
  const contact = await makeUser(firm.id, 'client', client.id, { email: `marguerite.${tag}@example.test` });
  await contact.update({ name: `Marguerite Okonkwo ${tag}` });
  ids.contact = contact.id;
  // Another firm with look-alike names: never found.
  const other = await makeFirm();
  otherFirmClientName = `Halvorsen Family Trust ${tag} (other firm)`;
  const otherClient = await Client.create({ firmId: other.firm.id, name: otherFirmClientName, email: null, phone: null, address: null, notes: null });
  await Property.create({ firmId: other.firm.id, clientId: otherClient.id, name: `Bluestem Ridge ${tag} elsewhere`, county: null, state: null, region: 'midwest', objectives: null, notes: null });
});

const search = async (q: string) => {
  const res = await consultant.get('/api/search').query({ q });
  expect(res.status, `q=${JSON.stringify(q).slice(0, 60)}`).toBe(200);
  return SearchAnswerSchema.parse(res.body).data;
};

describe('GET /api/search', () => {
  it('finds a client by a misspelt name, ranked first, with a link to its page', async () => {
    const hits = await search(`halvorson famly ${tag}`);
    expect(hits[0]).toEqual({ kind: 'client', id: ids.client, label: `Halvorsen Family Trust ${tag}`, href: `/clients/${ids.client}` });
  });

  it('finds a property by part of its name, with its client as the second line', async () => {
    const hits = await search(`bluestem ${tag}`);
    const hit = hits.find((h) => h.kind === 'property');
    expect(hit).toMatchObject({ id: ids.property, label: `Bluestem Ridge ${tag}`, href: `/properties/${ids.property}` });
    expect(hit!.sublabel).toContain(`Halvorsen Family Trust ${tag}`);
  });

  it('finds a proposal by number (its latest version only) and an invoice by number', async () => {
    const proposals = (await search(`${tag}-0417`)).filter((h) => h.kind === 'proposal');
    expect(proposals).toEqual([expect.objectContaining({ id: ids.proposalV2, label: `P-${tag}-0417 v2`, href: `/proposals/${ids.proposalV2}` })]);
    const invoices = (await search(`inv-${tag}-0093`)).filter((h) => h.kind === 'invoice');
    expect(invoices).toEqual([expect.objectContaining({ id: ids.invoice, label: `INV-${tag}-0093`, href: `/invoices/${ids.invoice}` })]);
  });

  it('finds a client contact by name or e-mail, linking to the client they belong to', async () => {
    for (const q of [`margerite okonkwo ${tag}`, `marguerite.${tag}@example`]) {
      const hit = (await search(q)).find((h) => h.kind === 'contact');
      expect(hit, q).toMatchObject({ id: ids.contact, href: `/clients/${ids.client}` });
    }
  });

  it('never shows another firm’s records', async () => {
    const labels = (await search(`halvorsen ${tag}`)).map((h) => h.label).concat((await search(`bluestem ridge ${tag} elsewhere`)).map((h) => h.label));
    expect(labels).not.toContain(otherFirmClientName);
    expect(labels).not.toContain(`Bluestem Ridge ${tag} elsewhere`);
  });

  it('answers an empty list for nothing searchable: only punctuation, control characters, blanks', async () => {
    for (const q of ['', '   ', '!!!???', '%_%', '\\', '\u0000\u0001\u007f', '\u200b\u200e', '--- ... ***']) expect(await search(q), JSON.stringify(q)).toEqual([]);
  });

  it('takes LIKE wildcards and control characters inside a real query literally, without a 500', async () => {
    expect(await search(`%${tag}%`)).toEqual(expect.any(Array));
    const hits = await search(`halvorsen\u0000family\u0007 ${tag}`);
    expect(hits[0]?.id).toBe(ids.client);
  });

  it('refuses a query over the limit, and a 1 MB query, with a 4xx and never a 500', async () => {
    const long = await consultant.get('/api/search').query({ q: 'a'.repeat(201) });
    expect(long.status).toBe(400);
    expect(long.body.error).toMatch(/too long/);
    const twice = await consultant.get('/api/search?q=a&q=b');
    expect(twice.status).toBe(400);
    // A 1 MB query: Node's HTTP parser refuses the header block (431) before the app sees it.
    const huge = await consultant.get('/api/search').query({ q: 'x'.repeat(1024 * 1024) }).ok(() => true);
    expect(huge.status).toBeGreaterThanOrEqual(400);
    expect(huge.status).toBeLessThan(500);
  });

  it('is for the firm’s staff only', async () => {
    expect((await (await anonymousAgent()).get('/api/search?q=a')).status).toBe(401);
  });
});
