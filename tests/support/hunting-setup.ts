/**
 * The start both hunting integration files share: a firm of its own with its consultant, client and
 * crew signed in, one property of the firm's client, and the stand site "Oak ladder" at STAND.
 */
import { expect } from 'vitest';
import type { Agent } from './test-app';
import { makeProperty } from './factories';
import { send, signedInFirm, type FirmContext } from './firm-settings';

/** The stand's position, [lon, lat], near 43.27° N, 90.94° W (invented). */
export const STAND: [number, number] = [-90.935, 43.267];

/** What huntingSetup made, and a way to draw more units on the same property. */
export interface HuntingSetup {
  ctx: FirmContext;
  consultant: Agent;
  client: Agent;
  crew: Agent;
  propertyId: number;
  /** The "Oak ladder" stand site at STAND. */
  standId: number;
  /** Draws a unit on the property as the consultant (expects a 201) and answers its id. */
  addUnit: (body: object) => Promise<number>;
}

/** Makes the firm, signs its people in, makes the property and draws the stand site. */
export async function huntingSetup(): Promise<HuntingSetup> {
  const { ctx, consultant, client, crew } = await signedInFirm('consultant', 'client', 'crew');
  const propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  const addUnit = async (body: object) => {
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/units`, body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.data.id as number;
  };
  const standId = await addUnit({ kind: 'stand-site', name: 'Oak ladder', geometry: { type: 'Point', coordinates: STAND } });
  return { ctx, consultant, client, crew, propertyId, standId, addUnit };
}
