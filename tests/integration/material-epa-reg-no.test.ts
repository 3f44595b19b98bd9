/** The library's herbicide carries its EPA Reg. No. (as on the label), checked by the shared schema and the domain. */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { Material } from '../../server/models';
import { toMaterialDefinition } from '../../server/commands/material-writer';
import { DomainValidationError } from '../../shared/domain/errors';

let consultant: Agent;
const send = (method: 'post' | 'patch', url: string, body: unknown) => consultant[method](url).set('X-CSRF-Token', consultant.csrf).send(body as object);
// An invented product; the numbers only have the label's shape (company-product[-distributor]).
const herbicide = { kind: 'herbicide', name: 'Burndown test 41%', activeIngredient: 'glyphosate 41%', restrictedUse: false, adjuvant: false, pricing: { basis: 'per-gal', pricePerGalCents: 2500 } };

beforeAll(async () => {
  const ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
});

describe('the EPA Reg. No. of a library herbicide', () => {
  it('is stored as typed, shown back, and changed or cleared by an edit', async () => {
    const made = await send('post', '/api/materials', { ...herbicide, epaRegNo: '524-475' });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    expect(made.body.data.epaRegNo).toBe('524-475');
    const id = made.body.data.id as number;
    const distributor = await send('patch', `/api/materials/${id}`, { ...herbicide, epaRegNo: '524-475-123' });
    expect(distributor.status).toBe(200);
    expect((await Material.findByPk(id))!.definition).toMatchObject({ epaRegNo: '524-475-123' });
    const cleared = await send('patch', `/api/materials/${id}`, herbicide);
    expect(cleared.body.data.epaRegNo).toBeUndefined();
  });

  it('is refused with a sentence naming the field when not written as on a label; nothing is saved', async () => {
    const before = await Material.count();
    for (const bad of ['524 475', '524-475-', 'EPA 524-475', '524']) {
      const res = await send('post', '/api/materials', { ...herbicide, epaRegNo: bad });
      expect(res.status, bad).toBe(422);
      expect(JSON.stringify(res.body)).toMatch(/EPA Reg\. No\. \(epaRegNo\): write it as on the label/);
    }
    expect(await Material.count()).toBe(before);
  });

  it('is checked by the domain too, whatever path builds the definition', () => {
    expect(() => toMaterialDefinition({ ...herbicide, epaRegNo: '524_475' } as never, 'herb-x')).toThrow(DomainValidationError);
    expect(() => toMaterialDefinition({ ...herbicide, epaRegNo: '524-475' } as never, 'herb-x')).not.toThrow();
  });
});
