/**
 * Data a browser journey owns: its own client with a portal contact, a property with a food plot and
 * a fall brassica prescription, and an approved proposal (so the plot's tasks exist). Everything is
 * made through the API, as a person would, so journeys never depend on each other's order on the
 * shared demo seed or on fixed ids.
 */
import { expect, vi } from 'vitest';
import { request, type APIRequestContext } from 'playwright-core';
import { apiSignIn } from './browser';

/** A signed-in API session (the cookie jar and its CSRF token). */
export interface ApiSession {
  request: APIRequestContext;
  csrf: string;
}

/** What {@link ownApprovedPlot} made. */
export interface OwnedPlot {
  clientId: number;
  propertyId: number;
  propertyName: string;
  unitId: number;
  unitName: string;
  /** The client's portal contact: e-mail, password and a signed-in API session. */
  contact: ApiSession & { email: string; password: string; name: string };
}

/** The password every journey contact gets (long enough for the sign-up rule). */
export const JOURNEY_PASSWORD = 'journey-owned-password';

/** The demo's Club plot outline near 43.55° N, 90.88° W (invented), reused so photo GPS and map links land inside it. */
const PLOT_RING: [number, number][] = [[-90.88, 43.55], [-90.877, 43.55], [-90.877, 43.5488], [-90.88, 43.5488], [-90.88, 43.55]];

async function ok<T>(res: { status(): number; json(): Promise<unknown>; text(): Promise<string> }, status = 200): Promise<T> {
  expect(res.status(), await res.text()).toBe(status);
  return ((await res.json()) as { data: T }).data;
}

/** Reads the invitation link e-mailed to an address from the local SMTP capture (polled: the outbox sends it). */
async function invitationToken(mailUrl: string, address: string): Promise<string> {
  return vi.waitFor(
    async () => {
      const list = ((await (await fetch(`${mailUrl}/messages`)).json()) as { data: { id: number; to: string }[] }).data.filter((m) => m.to.includes(address));
      if (list.length === 0) throw new Error(`no invitation to ${address} yet`);
      const text = ((await (await fetch(`${mailUrl}/messages/${list[list.length - 1].id}`)).json()) as { data: { text: string } }).data.text;
      const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(text)?.[1];
      if (!token) throw new Error(`the invitation to ${address} carries no link`);
      return token;
    },
    { timeout: 20_000, interval: 200 },
  );
}

/**
 * Makes a client of the journey's own (named after `label` and a run stamp) with an invited and
 * activated portal contact, a property, a "Club plot" food plot with a fall brassica prescription, and
 * a proposal the consultant sends and the contact approves, which makes the plot's tasks.
 */
export async function ownApprovedPlot(baseUrl: string, mailUrl: string, consultant: ApiSession, label: string): Promise<OwnedPlot> {
  // Each test database is fresh (tests/support/test-db.ts), so a short random stamp is unique enough;
  // it stays short because the schedule's row label is judged by axe against its unit name's length.
  const stamp = Math.random().toString(36).slice(2, 5);
  const post = <T>(url: string, data: unknown, status = 201) => consultant.request.post(`${baseUrl}${url}`, { data: data as object, headers: { 'X-CSRF-Token': consultant.csrf } }).then((r) => ok<T>(r, status));

  const client = await post<{ id: number }>('/api/clients', { name: `${label} Club ${stamp}` });
  const name = `${label} Contact`;
  const email = `${label.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${stamp}@example.test`;
  await post('/api/team/invitations', { email, name, role: 'client', clientId: client.id });
  const token = await invitationToken(mailUrl, email);
  const accept = await request.newContext({ baseURL: baseUrl });
  expect((await accept.post('/api/auth/invitations/accept', { data: { token, password: JOURNEY_PASSWORD, confirmPassword: JOURNEY_PASSWORD } })).status()).toBe(201);
  await accept.dispose();
  const contactSession = await apiSignIn(baseUrl, email, JOURNEY_PASSWORD);

  const propertyName = `${label} ${stamp}`;
  const property = await post<{ id: number }>('/api/properties', { clientId: client.id, name: propertyName });
  const unitName = 'Club plot';
  const unit = await post<{ id: number }>(`/api/properties/${property.id}/units`, { kind: 'food-plot', name: unitName, geometry: { type: 'Polygon', coordinates: [PLOT_RING] } });
  const practices = await ok<{ id: number; key: string }[]>(await consultant.request.get(`${baseUrl}/api/practices`));
  const practice = practices.find((p) => p.key === 'fall-brassica-plot');
  if (!practice) throw new Error('The firm has no fall brassica practice in its library');
  await post(`/api/units/${unit.id}/prescriptions`, { practiceId: practice.id });

  const draft = await post<{ id: number }>(`/api/properties/${property.id}/proposals`, { depositPct: 30 });
  await post(`/api/proposals/${draft.id}/send`, {}, 200);
  await contactSession.request.post(`${baseUrl}/api/proposals/${draft.id}/approve`, { data: { signedName: name }, headers: { 'X-CSRF-Token': contactSession.csrf } }).then((r) => ok(r, 200));
  return { clientId: client.id, propertyId: property.id, propertyName, unitId: unit.id, unitName, contact: { ...contactSession, email, password: JOURNEY_PASSWORD, name } };
}
