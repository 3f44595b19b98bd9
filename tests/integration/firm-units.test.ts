/** Switching the firm to hectares and metres changes what its screens and documents show. */
import { beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { signedInAgent, type Agent, propertyWithBrassicaPlot } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { SessionUserSchema } from '../../shared/schemas/auth';
import { formatArea } from '../../shared/units';
import { Property } from '../../server/models';

async function pdfText(agent: Agent, url: string): Promise<string> {
  const res = await agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  expect(res.status).toBe(200);
  return execFileSync('pdftotext', ['-layout', '-', '-'], { input: res.body as Buffer }).toString();
}

describe('the firm’s units', () => {
  let ctx: Awaited<ReturnType<typeof makeFirm>>;
  let owner: Agent;
  let consultant: Agent;
  let client: Agent;
  let propertyId: number;

  beforeAll(async () => {
    ctx = await makeFirm();
    owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
    consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
    client = await signedInAgent(ctx.users.client.email, PASSWORD);
    propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
  });

  it('reach every signed-in screen through the session (staff and the portal), and the plan PDF’s area follows them', async () => {
    const acres = (await Property.findByPk(propertyId))!.acres!;
    expect(SessionUserSchema.parse((await consultant.get('/api/auth/me').expect(200)).body.data.user)).toMatchObject({ firmAreaUnit: 'acres', firmLengthUnit: 'feet' });
    const before = await pdfText(consultant, `/api/properties/${propertyId}/plan.pdf`);
    expect(before).toContain(formatArea(acres, 'acres'));

    expect((await owner.patch('/api/firm').set('X-CSRF-Token', owner.csrf).send({ areaUnit: 'hectares', lengthUnit: 'metres' })).status).toBe(200);
    // Same sessions, next request: no sign-in again needed.
    expect(SessionUserSchema.parse((await consultant.get('/api/auth/me').expect(200)).body.data.user)).toMatchObject({ firmAreaUnit: 'hectares', firmLengthUnit: 'metres' });
    expect((await client.get('/api/auth/me').expect(200)).body.data.user).toMatchObject({ firmAreaUnit: 'hectares', firmLengthUnit: 'metres' });
    const after = await pdfText(consultant, `/api/properties/${propertyId}/plan.pdf`);
    // 1 acre = 0.40468564224 ha exactly (NIST Handbook 44, App. C).
    expect(after).toContain(formatArea(acres, 'hectares'));
    expect(after).not.toContain(formatArea(acres, 'acres'));
  });
});
