/**
 * The field sheet's offline checks end to end on the server side: the phone's queue
 * (src/features/field/lib/check-queue.ts over src/lib/offline-queue.ts, memory store in Node) sends
 * to the real route through a crew member's session; a lost answer and the retry under the same
 * Idempotency-Key record the check once.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, propertyWithBrassicaPlot, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { Task } from '../../server/models';
import { UnitCheck } from '../../server/models/unit-check';
import { memoryStore, syncQueue } from '../../src/lib/offline-queue';
import { makeQueuedCheck, newCheckKey, type QueuedCheck } from '../../src/features/field/lib/check-queue';
import { offersChecks } from '../../src/features/field/lib/check-offer';
import { UnitCheckDtoSchema } from '../../shared/schemas/checks';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let crew: Agent;
let propertyId: number;
let plotId: number;

/** What the phone's sendCheck does, over the crew member's real session (a non-2xx becomes an error with its status). */
async function send(item: QueuedCheck): Promise<{ replayed: boolean }> {
  const res = await crew.post(`/api/units/${item.unitId}/checks`).set('X-CSRF-Token', crew.csrf).set('Idempotency-Key', item.key).send(item.body as object);
  if (res.status >= 300) throw Object.assign(new Error(res.body.error ?? `status ${res.status}`), { status: res.status });
  UnitCheckDtoSchema.parse(res.body.data);
  return { replayed: res.body.replayed === true };
}

// A failed stand: 1 plant over 2 × 1 ft² frames of rape (target 5/ft²: OMAFRA canola stand guide; thresholds common practice, no source).
const failedStand = { kind: 'establishment' as const, checkedOn: '2026-10-01', frameSqFt: 1, samples: [{ species: 'rape', plants: 1 }, { species: 'rape', plants: 0 }], groundCoverPct: 15, weedPressure: 'high' as const };

beforeAll(async () => {
  ctx = await makeFirm();
  const consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  ({ propertyId, plotId } = await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id));
  // The crew member's task on the plot is what lets them check it.
  await Task.create({ firmId: ctx.firm.id, propertyId, unitId: plotId, prescriptionId: null, proposalId: null, stepKey: 'seed', name: 'Broadcast seed', kind: 'seed', practiceName: 'Fall brassica plot', unitName: 'North plot', earliest: '2026-08-01', latest: '2026-08-31', startDate: null, endDate: null, assigneeId: ctx.users.crew.id });
});

describe('field sheet checks through the offline queue', () => {
  it('offers checks on seeded units only', () => {
    expect(offersChecks({ unitId: plotId, unitKind: 'food-plot', kind: 'mow' })).toBe(true);
    expect(offersChecks({ unitId: 1, unitKind: 'timber', kind: 'chainsaw' })).toBe(false);
    expect(offersChecks({ unitId: 1, unitKind: 'bedding-area', kind: 'inspect' })).toBe(false);
    expect(offersChecks({ unitId: null, unitKind: null, kind: 'seed' })).toBe(false);
  });

  it('keeps a check made without signal, and a lost answer replays once under the same key', async () => {
    const store = memoryStore<QueuedCheck>();
    const key = newCheckKey();
    await store.put(makeQueuedCheck({ key, userId: ctx.users.crew.id, unitId: plotId, unitName: 'North plot', body: failedStand }));

    const offline = await syncQueue(store, send, { isOnline: () => false, what: 'check' });
    expect(offline.skippedOffline).toBe(true);
    expect(await UnitCheck.count({ where: { unitId: plotId } })).toBe(0);

    // The server records the check but the answer never reaches the phone (signal lost on the way back).
    const lostAnswer = async (item: QueuedCheck) => {
      await send(item);
      throw Object.assign(new Error('Network request failed'), { status: 0 });
    };
    const lost = await syncQueue(store, lostAnswer, { isOnline: () => true, what: 'check' });
    expect(lost.stillQueued).toEqual([key]);
    expect(await UnitCheck.count({ where: { unitId: plotId } })).toBe(1);

    const again = await syncQueue(store, send, { isOnline: () => true, what: 'check' });
    expect(again.sent).toEqual([key]);
    expect(again.replayed).toEqual([key]);
    expect(await store.all()).toEqual([]);
    expect(await UnitCheck.count({ where: { unitId: plotId } })).toBe(1);
  });

  it('keeps a refused check on the phone with the server’s sentence and saves nothing', async () => {
    const store = memoryStore<QueuedCheck>();
    const key = newCheckKey();
    const before = await UnitCheck.count({ where: { unitId: plotId } });
    await store.put(makeQueuedCheck({ key, userId: ctx.users.crew.id, unitId: plotId, unitName: 'North plot', body: { kind: 'browse', checkedOn: '2026-10-02', pairs: [{ species: 'rape', caged: 5, open: 9 }] } }));
    const report = await syncQueue(store, send, { isOnline: () => true, what: 'check' });
    expect(report.rejected).toEqual([key]);
    const [kept] = await store.all();
    expect(kept.rejected?.status).toBe(422);
    expect(kept.rejected?.message).toMatch(/larger than its cage/);
    expect(await UnitCheck.count({ where: { unitId: plotId } })).toBe(before);
  });
});
