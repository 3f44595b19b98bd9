/** Library writes and property delete go through commands: each leaves its audit record, in the same transaction. */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { AuditEvent } from '../../server/models';

let consultant: Agent;
let ctx: Awaited<ReturnType<typeof makeFirm>>;
const send = (method: 'post' | 'patch' | 'delete', url: string, body: unknown = {}) => consultant[method](url).set('X-CSRF-Token', consultant.csrf).send(body as object);
const actions = async (subjectType: string, subjectId: number) =>
  (await AuditEvent.findAll({ where: { firmId: ctx.firm.id, subjectType, subjectId }, order: [['id', 'ASC']] })).map((e) => e.action);

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
});

describe('library and property writes are audited', () => {
  it('a material: created, updated, archived', async () => {
    const seed = { kind: 'seed', name: 'Audit rye', species: 'cereal rye', purityPct: 98, germinationPct: 85, rateLbPerAcre: 90, packageSizeLb: 50, packagePriceCents: 2500 };
    const created = await send('post', '/api/materials', seed);
    expect(created.status).toBe(201);
    const id = created.body.data.id as number;
    expect((await send('patch', `/api/materials/${id}`, { ...seed, name: 'Audit rye 2' })).status).toBe(200);
    expect((await send('delete', `/api/materials/${id}`)).status).toBe(204);
    expect(await actions('Material', id)).toEqual(['material.created', 'material.updated', 'material.archived']);
  });

  it('a rate: created, updated, archived', async () => {
    const created = await send('post', '/api/rates', { name: 'Audit rate', category: 'labor', basis: 'per-hour', unitPriceCents: 6500 });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.data.id as number;
    expect((await send('patch', `/api/rates/${id}`, { name: 'Audit rate 2' })).status).toBe(200);
    expect((await send('delete', `/api/rates/${id}`)).status).toBe(204);
    expect(await actions('ServiceRateEntry', id)).toEqual(['rate.created', 'rate.updated', 'rate.archived']);
  });

  it('a practice: duplicated, updated, archived', async () => {
    const practices = (await consultant.get('/api/practices').expect(200)).body.data as { id: number }[];
    const copy = await send('post', `/api/practices/${practices[0]!.id}/duplicate`);
    expect(copy.status).toBe(201);
    const id = copy.body.data.id as number;
    expect((await send('patch', `/api/practices/${id}`, { name: 'Audit practice' })).status).toBe(200);
    expect((await send('delete', `/api/practices/${id}`)).status).toBe(200);
    expect(await actions('Practice', id)).toEqual(['practice.duplicated', 'practice.updated', 'practice.archived']);
  });

  it('a property delete', async () => {
    const property = await makeProperty(ctx.firm.id, ctx.client.id);
    expect((await send('delete', `/api/properties/${property.id}`)).status).toBe(204);
    expect(await actions('Property', property.id)).toEqual(['property.deleted']);
  });
});
