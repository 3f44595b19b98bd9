/**
 * Aerial photos marked "print under the plan" (`inDocuments`) appear in the plan PDF and the
 * proposal map as an image; unmarked, they do not. A sent proposal keeps the photo it was sent with.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import sharp from 'sharp';
import { signedInAgent, type Agent, propertyWithBrassicaPlot } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { OverlaySchema } from '../../shared/schemas/firm';
import { GEOMETRY_LIMITS } from '../../shared/limits';

const send = (agent: Agent, method: 'post' | 'patch' | 'delete', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

async function binary(agent: Agent, url: string): Promise<{ status: number; body: Buffer }> {
  const res = await agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  return { status: res.status, body: res.body as Buffer };
}

/** Image XObjects in a PDF (poppler's pdfimages -list: two header lines, then one line per image with its width and height). */
function pdfImages(pdf: Buffer): { width: number; height: number }[] {
  const lines = execFileSync('pdfimages', ['-list', '-'], { input: pdf }).toString().trim().split('\n').slice(2);
  return lines.map((l) => l.trim().split(/\s+/)).map((cols) => ({ width: Number(cols[3]), height: Number(cols[4]) }));
}

/** A 3000 × 2000 JPEG of Gaussian noise (varied pixels, like a real photo), made by sharp. */
const photo = (): Promise<Buffer> => sharp({ create: { width: 3000, height: 2000, channels: 3, background: '#4a6b3c', noise: { type: 'gaussian', mean: 120, sigma: 40 } } }).jpeg({ quality: 85 }).toBuffer();

describe('aerial photos printed under the plan', () => {
  let ctx: Awaited<ReturnType<typeof makeFirm>>;
  let consultant: Agent;
  let client: Agent;
  let propertyId: number;
  let overlayId: number;

  beforeAll(async () => {
    ctx = await makeFirm();
    consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
    client = await signedInAgent(ctx.users.client.email, PASSWORD);
    propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
    // Over the factory property (-90.94…-90.93 E, 43.265…43.27 N) and beyond it: the frame clips the rest.
    const corners = [[-90.945, 43.272], [-90.925, 43.272], [-90.925, 43.262], [-90.945, 43.262]];
    const created = await consultant.post(`/api/properties/${propertyId}/overlays`).set('X-CSRF-Token', consultant.csrf).field('corners', JSON.stringify(corners)).attach('file', await photo(), 'spring-flight.jpg');
    expect(created.status).toBe(201);
    overlayId = OverlaySchema.parse(created.body.data).id;
  });

  it('the plan PDF carries no image until the photo is marked, then one downscaled for print', async () => {
    const before = await binary(consultant, `/api/properties/${propertyId}/plan.pdf`);
    expect(before.status).toBe(200);
    expect(pdfImages(before.body)).toEqual([]);
    expect((await send(consultant, 'patch', `/api/overlays/${overlayId}`, { inDocuments: true })).status).toBe(200);
    const after = await binary(consultant, `/api/properties/${propertyId}/plan.pdf`);
    const images = pdfImages(after.body);
    expect(images).toHaveLength(1);
    // 3000 × 2000 fitted inside the print limit keeps its 3:2 shape.
    expect(images[0]).toEqual({ width: GEOMETRY_LIMITS.overlayPrintMaxSidePx, height: Math.round((GEOMETRY_LIMITS.overlayPrintMaxSidePx * 2) / 3) });
    expect(execFileSync('pdftotext', ['-', '-'], { input: after.body }).toString()).toContain('Aerial photo: spring-flight.jpg');
  });

  it('a draft proposal shows it live; a sent one keeps the photo it was sent with after it is unmarked or deleted', async () => {
    await send(consultant, 'patch', `/api/overlays/${overlayId}`, { inDocuments: true }).expect(200);
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, {});
    expect(draft.status).toBe(201);
    const id = draft.body.data.id as number;
    expect(pdfImages((await binary(consultant, `/api/proposals/${id}/pdf`)).body)).toHaveLength(1);
    await send(consultant, 'patch', `/api/overlays/${overlayId}`, { inDocuments: false }).expect(200);
    expect(pdfImages((await binary(consultant, `/api/proposals/${id}/pdf`)).body)).toEqual([]);

    await send(consultant, 'patch', `/api/overlays/${overlayId}`, { inDocuments: true }).expect(200);
    expect((await send(consultant, 'post', `/api/proposals/${id}/send`)).status).toBe(200);
    const sent = (await binary(consultant, `/api/proposals/${id}/pdf`)).body;
    const sentImages = pdfImages(sent);
    expect(sentImages).toHaveLength(1);
    expect((await send(consultant, 'delete', `/api/overlays/${overlayId}`)).status).toBe(204);
    const later = (await binary(client, `/api/proposals/${id}/pdf`)).body;
    expect(pdfImages(later)).toEqual(sentImages);
    expect(pdfImages((await binary(consultant, `/api/properties/${propertyId}/plan.pdf`)).body)).toEqual([]);
  });
});
