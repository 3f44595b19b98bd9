/**
 * The steps integration tests share around a firm and its settings: a firm of its own with its
 * people signed in, a CSRF-carrying write, a change to the firm's settings (PATCH /api/firm), and a
 * PDF answer read back as bytes or as text (pdftotext from poppler-utils).
 */
import { execFileSync } from 'node:child_process';
import { expect } from 'vitest';
import { signedInAgent, type Agent } from './test-app';
import { makeFirm, PASSWORD } from './factories';

/** A firm made by makeFirm: the firm, its client and its people. */
export type FirmContext = Awaited<ReturnType<typeof makeFirm>>;
/** The people makeFirm makes. */
export type FirmRole = keyof FirmContext['users'];

/** A new firm of the test's own, with an agent signed in for each role asked for. */
export async function signedInFirm<R extends FirmRole>(...roles: R[]): Promise<{ ctx: FirmContext } & Record<R, Agent>> {
  const ctx = await makeFirm();
  const agents = {} as Record<R, Agent>;
  for (const role of roles) agents[role] = await signedInAgent(ctx.users[role].email, PASSWORD);
  return { ctx, ...agents };
}

/** A write with the agent's CSRF token. */
export const send = (agent: Agent, method: 'post' | 'put' | 'patch' | 'delete', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

/** Changes the firm's settings (profile, time zone, units, defaults) as the owner. */
export const patchFirm = (owner: Agent, body: Record<string, unknown>) => send(owner, 'patch', '/api/firm', body);

/** A binary answer (a PDF, an image) as bytes, with its status and type. */
export async function binary(agent: Agent, url: string): Promise<{ status: number; body: Buffer; type: string }> {
  const res = await agent
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
  return { status: res.status, body: res.body as Buffer, type: String(res.headers['content-type']) };
}

/** A PDF's text as pdftotext -layout reads it. */
export const textOfPdf = (pdf: Buffer) => execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf }).toString();

/** Fetches a PDF (expecting 200) and reads its text. */
export async function pdfText(agent: Agent, url: string): Promise<string> {
  const res = await binary(agent, url);
  expect(res.status).toBe(200);
  return textOfPdf(res.body);
}
