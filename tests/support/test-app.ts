/** The app under test and signed-in supertest agents. */
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import { makeProperty } from './factories';
import { rectangle } from './geodesy';
import { Practice } from '../../server/models';

let app: Express | null = null;

/** One app per test file (createApp without listen). */
export function testApp(): Express {
  if (!app) app = createApp();
  return app;
}

export type Agent = ReturnType<typeof request.agent> & { csrf: string };

/** A cookie-keeping agent with a CSRF token, not signed in. */
export async function anonymousAgent(): Promise<Agent> {
  const agent = request.agent(testApp()) as Agent;
  const res = await agent.get('/api/auth/csrf').expect(200);
  agent.csrf = res.body.csrfToken;
  return agent;
}

/** An agent signed in as the given user; its csrf field holds the new session's token. */
export async function signedInAgent(email: string, password: string): Promise<Agent> {
  const agent = request.agent(testApp()) as Agent;
  const res = await agent.post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in failed for ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  agent.csrf = res.body.csrfToken;
  return agent;
}

/** Messages the SMTP capture server holds for an address, newest first. */
export async function capturedMailTo(address: string): Promise<{ id: number; subject: string; to: string[] }[]> {
  const res = await fetch(`${process.env.MAIL_CAPTURE_URL}/messages`);
  const body = (await res.json()) as { data: { id: number; subject: string; to: string[] }[] };
  return body.data.filter((m) => m.to.includes(address));
}

/** The full text of a captured message. */
export async function capturedMessage(id: number): Promise<{ text: string; subject: string; attachments: { filename: string }[] }> {
  const res = await fetch(`${process.env.MAIL_CAPTURE_URL}/messages/${id}`);
  return ((await res.json()) as { data: { text: string; subject: string; attachments: { filename: string }[] } }).data;
}

/** Delivers every due outbox message (the worker takes 20 at a time), so a test finds its mail whatever ran before. */
export async function deliverAllMail(): Promise<void> {
  const { deliverDueMessages } = await import('../../server/services/mail/outbox');
  for (let round = 0; round < 50; round++) {
    const { sent } = await deliverDueMessages(100);
    if (sent === 0) return;
  }
}

/**
 * A new property of the client with one 120 m × 80 m food plot carrying the starter library's fall
 * brassica prescription, made through the API as the consultant: the usual start of a priced plan.
 */
export async function propertyWithBrassicaPlot(consultant: Agent, firmId: number, clientId: number): Promise<{ propertyId: number; plotId: number }> {
  const propertyId = (await makeProperty(firmId, clientId)).id;
  const plot = await consultant.post(`/api/properties/${propertyId}/units`).set('X-CSRF-Token', consultant.csrf).send({ kind: 'food-plot', name: 'North plot', geometry: rectangle(-90.938, 43.2655, 120, 80) });
  if (plot.status !== 201) throw new Error(`plot not drawn: ${plot.status} ${JSON.stringify(plot.body)}`);
  const brassica = (await Practice.findOne({ where: { firmId, key: 'fall-brassica-plot' } }))!.id;
  const made = await consultant.post(`/api/units/${plot.body.data.id}/prescriptions`).set('X-CSRF-Token', consultant.csrf).send({ practiceId: brassica });
  if (made.status !== 201) throw new Error(`prescription not written: ${made.status} ${JSON.stringify(made.body)}`);
  return { propertyId, plotId: plot.body.data.id as number };
}
