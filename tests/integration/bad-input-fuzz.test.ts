/**
 * No 500 on bad input, over every registered route: a signed-in owner sends NUL characters, lone
 * surrogates, impossible dates, denormal and huge numbers, ids written 0x10, " 1" or true, and
 * truncated multipart bodies, in bodies, path parameters and queries. Every answer must be below 500
 * and carry an error sentence. The routes are enumerated from the registry at run time, so routes
 * other branches add are fuzzed without editing this file.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { logger } from '../../server/logger';
import { routeRegistry, type RouteRecord } from '../../server/middlewares/access';
import { signedInAgent, testApp, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { Material, Practice } from '../../server/models';
import { rectangle } from '../support/geodesy';

/** Text no database column should take: NUL (PostgreSQL text refuses it), lone UTF-16 surrogates. */
const BAD_TEXT = ['nul\u0000inside', '\u0000', 'lone \ud800 high', 'lone \udfff low', '\udc00\ud800'];
/** Dates that pass a YYYY-MM-DD format check but do not exist (common practice, no source). */
const BAD_DATES = ['2026-02-30', '2025-02-29', '2026-13-01', '2026-04-31', '0000-00-00'];
/** Numbers JSON can carry that a database check or column refuses: denormals, the largest double, int4 overflow. */
const BAD_NUMBERS = [5e-324, -5e-324, 1.7976931348623157e308, 2147483648, -2147483649, 1e21];
/** Ids as a careless or hostile client writes them. */
const BAD_IDS: unknown[] = ['0x10', ' 1', '1 ', true, '1e3', '+1', '01', '1.0', 2147483648, '9'.repeat(40), -1];
const BAD_ID_PARAMS = ['0x10', '%201', '1%20', 'true', '1e3', '+1', '2147483648', '9'.repeat(40), '-1', '%00', '%ED%A0%80'];

/** Field names the shared schemas use; each is filled with the bad value in turn. */
const TEXT_KEYS = ['name', 'title', 'notes', 'description', 'reason', 'address', 'signedName', 'tileAttribution', 'intro', 'label'];
const DATE_KEYS = ['doneOn', 'startDate', 'endDate', 'expiresOn', 'validUntil', 'dueOn', 'issuedOn', 'takenOn', 'harvestedOn', 'date', 'from', 'to', 'week', 'startOn', 'endOn'];
const NUMBER_KEYS = ['amountCents', 'priceCents', 'unitPriceCents', 'quantity', 'hours', 'taxRatePct', 'depositPct', 'opacity', 'rate', 'ratePerAcre', 'weightLb', 'points', 'buckPhotos', 'doePhotos', 'fawnPhotos', 'uniqueBucks', 'cameraCount', 'termsDays', 'costCents', 'acres', 'lengthFt', 'idleTimeoutHours'];
const ID_KEYS = ['id', 'clientId', 'propertyId', 'proposalId', 'unitId', 'practiceId', 'materialId', 'paymentId', 'assigneeId', 'taskId', 'prescriptionId'];
const QUERY_KEYS = ['clientId', 'propertyId', 'proposalId', 'status', 'from', 'to', 'week', 'q', 'format', 'kind', 'assigneeId', 'season'];

const NOT_CALLED = [/^post \/auth\/logout$/];
/** Requests in flight at once against the in-process app. */
const BATCH = 6;
const key = (r: RouteRecord) => `${r.method} ${r.path}`;

let owner: Agent;
const realIds: Record<string, number> = {};

/** The route's path with its parameters filled: a real record of the owner's firm where we have one. */
function concrete(path: string, override?: { name: string; value: string }): string {
  const resource = path.split('/')[1];
  return `/api${path.replace(/:([a-zA-Z]+)/g, (_m, name: string) => {
    if (override && override.name === name) return override.value;
    if (name === 'token' || name === 'file') return 'x'.repeat(43);
    if (name === 'season') return '2025';
    if (name === 'id' && realIds[resource]) return String(realIds[resource]);
    if (name === 'clientId' && realIds.clients) return String(realIds.clients);
    return '2147480000';
  })}`;
}

/**
 * The bodies sent to every write route: each bad value in the fields most schemas have, one field at
 * a time (so the rest of the body can pass and the value reaches as far as it can), plus nested places.
 */
function bodiesFor(): { what: string; body: Record<string, unknown> }[] {
  const out: { what: string; body: Record<string, unknown> }[] = [];
  const base = { name: 'Fuzz record', title: 'Fuzz record', kind: 'food-plot' };
  for (const v of BAD_TEXT.slice(0, 2)) for (const k of TEXT_KEYS) out.push({ what: `${k}=${JSON.stringify(v)}`, body: { ...base, [k]: v } });
  for (const v of BAD_TEXT) out.push({ what: `nested text ${JSON.stringify(v)}`, body: { ...base, lines: [{ description: v }], quantitiesUsed: [{ materialName: v, quantity: 1, unit: v }], bucks: [{ label: v, ageClass: '2.5' }], properties: { note: v }, [v]: 'a key' } });
  for (const v of BAD_DATES) out.push({ what: `every date=${v}`, body: { ...base, ...Object.fromEntries(DATE_KEYS.map((k) => [k, v])) } });
  for (const v of BAD_DATES.slice(0, 1)) for (const k of DATE_KEYS.slice(0, 8)) out.push({ what: `${k}=${v}`, body: { ...base, [k]: v } });
  for (const v of BAD_NUMBERS) out.push({ what: `every number=${v}`, body: { ...base, ...Object.fromEntries(NUMBER_KEYS.map((k) => [k, v])) } });
  for (const v of BAD_NUMBERS.slice(0, 3)) for (const k of NUMBER_KEYS.slice(0, 8)) out.push({ what: `${k}=${v}`, body: { ...base, [k]: v } });
  for (const v of BAD_NUMBERS.slice(0, 3)) out.push({ what: `geometry ${v}`, body: { ...base, geometry: { type: 'Point', coordinates: [v, 43.2] }, corners: [[v, 43], [-90, 43], [-90, 42], [v, 42]] } });
  for (const v of BAD_IDS) out.push({ what: `every id=${JSON.stringify(v)}`, body: { ...base, ...Object.fromEntries(ID_KEYS.map((k) => [k, v])) } });
  for (const v of BAD_IDS.slice(0, 4)) for (const k of ID_KEYS.slice(0, 4)) out.push({ what: `${k}=${JSON.stringify(v)}`, body: { ...base, [k]: v } });
  return out;
}

/** Values the database refused after validation let them through (the error handler's safety net logs them). */
const reachedDatabase: string[] = [];
let warnSpy: ReturnType<typeof vi.spyOn>;

beforeAll(async () => {
  testApp();
  warnSpy = vi.spyOn(logger, 'warn').mockImplementation(((obj: unknown, msg?: string) => {
    if (msg === 'database refused a value that validation let through') reachedDatabase.push(JSON.stringify(obj));
  }) as typeof logger.warn);
  const ctx = await makeFirm();
  owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
  const property = await makeProperty(ctx.firm.id, ctx.client.id);
  realIds.clients = ctx.client.id;
  realIds.properties = property.id;
  const unit = await owner.post(`/api/properties/${property.id}/units`).set('X-CSRF-Token', owner.csrf).send({ kind: 'food-plot', name: 'Fuzz plot', geometry: rectangle(-90.938, 43.2655, 120, 80) });
  expect(unit.status).toBe(201);
  realIds.units = unit.body.data.id;
  realIds.materials = (await Material.findOne({ where: { firmId: ctx.firm.id } }))!.id;
  realIds.practices = (await Practice.findOne({ where: { firmId: ctx.firm.id } }))!.id;
  const proposal = await owner.post(`/api/properties/${property.id}/proposals`).set('X-CSRF-Token', owner.csrf).send({});
  if (proposal.status === 201) realIds.proposals = proposal.body.data.id;
});

afterAll(() => warnSpy?.mockRestore());

/** Sends one request and notes a failure when it answers 5xx or without a sentence. */
async function probe(failures: string[], r: RouteRecord, url: string, what: string, send: (req: ReturnType<Agent['get']>) => ReturnType<Agent['get']>) {
  const req = owner[r.method](url).set('X-CSRF-Token', owner.csrf);
  const res = await send(req);
  if (res.status >= 500) failures.push(`${key(r)} ${what} → ${res.status} ${JSON.stringify(res.body).slice(0, 160)}`);
  else if (res.status >= 400 && !(typeof res.body?.error === 'string' && res.body.error.length >= 10) && res.type === 'application/json') failures.push(`${key(r)} ${what} → ${res.status} without an error sentence`);
  return res.status;
}

describe('bad input never causes a 5xx', () => {
  const counted = { requests: 0, refused: 0 };

  it('bodies: bad text, dates, numbers and ids in every write route', async () => {
    const failures: string[] = [];
    const bodies = bodiesFor();
    const writes = routeRegistry.filter((r) => r.method !== 'get' && !NOT_CALLED.some((re) => re.test(key(r))));
    expect(writes.length).toBeGreaterThan(40);
    for (const r of writes) {
      // A delete with a real id would remove the records the next routes use.
      const url = r.method === 'delete' ? concrete(r.path, { name: 'id', value: '2147480000' }) : concrete(r.path);
      for (let i = 0; i < bodies.length; i += BATCH) {
        const statuses = await Promise.all(bodies.slice(i, i + BATCH).map(({ what, body }) => probe(failures, r, url, what, (req) => req.send(body))));
        counted.requests += statuses.length;
        counted.refused += statuses.filter((st) => st >= 400).length;
      }
    }
    expect(failures.slice(0, 40)).toEqual([]);
  }, 600_000);

  it('path parameters: ids written 0x10, " 1", true, overflowing or with NUL', async () => {
    const failures: string[] = [];
    for (const r of routeRegistry.filter((x) => /:[a-zA-Z]+/.test(x.path) && !NOT_CALLED.some((re) => re.test(key(x))))) {
      for (const name of [...r.path.matchAll(/:([a-zA-Z]+)/g)].map((m) => m[1])) {
        for (const value of BAD_ID_PARAMS) {
          const status = await probe(failures, r, concrete(r.path, { name, value }), `:${name}=${value}`, (req) => (r.method === 'get' ? req : req.send({})));
          counted.requests++;
          if (status >= 400) counted.refused++;
          // A route that takes a numeric id must refuse these forms rather than read them as another id.
          if (name !== 'token' && name !== 'file' && status < 300) failures.push(`${key(r)} :${name}=${value} → ${status}: accepted a malformed id`);
        }
      }
    }
    expect(failures.slice(0, 40)).toEqual([]);
  }, 600_000);

  it('queries: bad text, dates, numbers and ids on every read', async () => {
    const failures: string[] = [];
    const values = [...BAD_TEXT, ...BAD_DATES, ...BAD_NUMBERS.map(String), ...BAD_IDS.map(String)];
    for (const r of routeRegistry.filter((x) => x.method === 'get')) {
      // Dummy ids: the query is validated before any record is read, and no PDF is rendered 40 times.
      const url = `/api${r.path.replace(/:token|:file/g, 'x'.repeat(43)).replace(/:season/g, '2025').replace(/:[a-zA-Z]+/g, '2147480000')}`;
      for (let i = 0; i < values.length; i += BATCH) {
        const statuses = await Promise.all(values.slice(i, i + BATCH).map((v) => probe(failures, r, url, `?…=${JSON.stringify(v)}`, (req) => req.query(Object.fromEntries(QUERY_KEYS.map((k) => [k, v]))))));
        counted.requests += statuses.length;
        counted.refused += statuses.filter((st) => st >= 400).length;
      }
    }
    expect(failures.slice(0, 40)).toEqual([]);
  }, 600_000);

  it('truncated multipart bodies on every write route', async () => {
    const failures: string[] = [];
    const boundary = 'fuzzboundary';
    const cut = `--${boundary}\r\nContent-Disposition: form-data; name="name"\r\n\r\nFuzz\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.4 cut off here`;
    for (const r of routeRegistry.filter((x) => x.method !== 'get' && !NOT_CALLED.some((re) => re.test(key(x))))) {
      const url = r.method === 'delete' ? concrete(r.path, { name: 'id', value: '2147480000' }) : concrete(r.path);
      await probe(failures, r, url, 'truncated multipart', (req) => req.set('Content-Type', `multipart/form-data; boundary=${boundary}`).set('Idempotency-Key', 'fuzz-key-123456').send(cut));
      counted.requests++;
    }
    expect(failures).toEqual([]);
    // The shared schemas and the validate middleware refuse these at the door: none reached PostgreSQL.
    expect(reachedDatabase.slice(0, 20)).toEqual([]);
    console.log(`bad-input fuzz: ${counted.requests} requests over ${routeRegistry.length} routes, ${counted.refused} refused with a 4xx, 0 answered 5xx`);
  }, 600_000);
});
