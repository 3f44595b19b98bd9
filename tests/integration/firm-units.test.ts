/** Switching the firm to hectares and metres changes what its screens and documents show. */
import { beforeAll, describe, expect, it } from 'vitest';
import { type Agent, propertyWithBrassicaPlot } from '../support/test-app';
import { patchFirm, pdfText, signedInFirm, type FirmContext } from '../support/firm-settings';
import { SessionUserSchema } from '../../shared/schemas/auth';
import { formatArea } from '../../shared/units';
import { Property } from '../../server/models';

describe('the firm’s units', () => {
  let ctx: FirmContext;
  let owner: Agent;
  let consultant: Agent;
  let client: Agent;
  let propertyId: number;

  beforeAll(async () => {
    ({ ctx, owner, consultant, client } = await signedInFirm('owner', 'consultant', 'client'));
    propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
  });

  it('reach every signed-in screen through the session (staff and the portal), and the plan PDF’s area follows them', async () => {
    const acres = (await Property.findByPk(propertyId))!.acres!;
    expect(SessionUserSchema.parse((await consultant.get('/api/auth/me').expect(200)).body.data.user)).toMatchObject({ firmAreaUnit: 'acres', firmLengthUnit: 'feet' });
    const before = await pdfText(consultant, `/api/properties/${propertyId}/plan.pdf`);
    expect(before).toContain(formatArea(acres, 'acres'));

    expect((await patchFirm(owner, { areaUnit: 'hectares', lengthUnit: 'metres' })).status).toBe(200);
    // Same sessions, next request: no sign-in again needed.
    expect(SessionUserSchema.parse((await consultant.get('/api/auth/me').expect(200)).body.data.user)).toMatchObject({ firmAreaUnit: 'hectares', firmLengthUnit: 'metres' });
    expect((await client.get('/api/auth/me').expect(200)).body.data.user).toMatchObject({ firmAreaUnit: 'hectares', firmLengthUnit: 'metres' });
    const after = await pdfText(consultant, `/api/properties/${propertyId}/plan.pdf`);
    // 1 acre = 0.40468564224 ha exactly (NIST Handbook 44, App. C).
    expect(after).toContain(formatArea(acres, 'hectares'));
    expect(after).not.toContain(formatArea(acres, 'acres'));
  });
});
