import { describe, expect, it } from 'vitest';
import {
  classifySendError,
  completionForm,
  createSyncRunner,
  makeQueuedCompletion,
  memoryStore,
  newCompletionKey,
  syncQueue,
  waitingItems,
  type QueuedCompletion,
  type SendCompletion,
  type SyncReport,
} from '../../../../src/features/field/lib/completion-queue';
import { IdempotencyKeySchema } from '../../../../shared/schemas/task';

/** An error as the api-client throws it: a status (0 = the network) and the server's sentence. */
const apiError = (status: number, message: string, code?: string) => Object.assign(new Error(message), { status, code });

let n = 0;
const item = (over: Partial<QueuedCompletion> = {}): QueuedCompletion =>
  ({
    ...makeQueuedCompletion(
      {
        key: `done-test-${(n += 1)}`,
        taskId: n,
        taskName: 'Broadcast seed',
        unitName: 'Club plot',
        userId: 7,
        fields: { doneOn: '2026-06-14', notes: 'Dry soil', hours: '3.5', quantitiesUsed: [{ key: 'seed', label: 'Brassica blend', amount: 12.5, unit: 'lb' }] },
        photos: [],
      },
      new Date(Date.UTC(2026, 5, 14, 9, 0, n)),
    ),
    ...over,
  }) as QueuedCompletion;

/**
 * A server that keeps one record per idempotency key, as POST /api/tasks/:id/complete does: a new
 * key records (201), the same key again answers the first record (200, replayed).
 */
function fakeServer() {
  const records = new Map<string, number>();
  const keysSeen: string[] = [];
  let failNext: 'network-before' | 'answer-lost' | null = null;
  const send: SendCompletion = async (i) => {
    keysSeen.push(i.key);
    const mode = failNext;
    failNext = null;
    if (mode === 'network-before') throw apiError(0, 'Browseline cannot be reached.');
    const replayed = records.has(i.key);
    if (!replayed) records.set(i.key, i.taskId);
    if (mode === 'answer-lost') throw apiError(0, 'Browseline cannot be reached.');
    return { replayed };
  };
  return { send, records, keysSeen, fail: (mode: 'network-before' | 'answer-lost') => (failNext = mode) };
}

describe('the completion queue', () => {
  it('makes idempotency keys the server accepts, new each time', () => {
    const a = newCompletionKey();
    const b = newCompletionKey();
    // The server's rule: 8–200 characters of [A-Za-z0-9_.:-] (shared/schemas/task.ts).
    expect(IdempotencyKeySchema.safeParse(a).success).toBe(true);
    expect(a).not.toBe(b);
    // Fixed UUID for the format check: RFC 9562 section 4 writes a UUID as 36 characters, 8-4-4-4-12 hex.
    expect(newCompletionKey(() => '6f1c1d2e-8a4b-4c3d-9e2f-0a1b2c3d4e5f')).toBe('done-6f1c1d2e-8a4b-4c3d-9e2f-0a1b2c3d4e5f');
  });

  it('removes a completion once the server took it, whether fresh (201) or replayed (200)', async () => {
    const store = memoryStore();
    const server = fakeServer();
    const first = item();
    const second = item();
    await store.put(first);
    await store.put(second);
    server.records.set(second.key, second.taskId); // already recorded by an earlier send whose answer was lost
    const report = await syncQueue(store, server.send);
    expect(report.sent).toEqual([first.key, second.key]);
    expect(report.replayed).toEqual([second.key]);
    expect(store.items.size).toBe(0);
  });

  it('keeps a completion when the network fails, and sends it with the same key later: one record (common practice for idempotent retries, no source)', async () => {
    const store = memoryStore();
    const server = fakeServer();
    const queued = item();
    await store.put(queued);
    server.fail('network-before');
    const down = await syncQueue(store, server.send);
    expect(down.stillQueued).toEqual([queued.key]);
    expect(store.items.get(queued.key)).toMatchObject({ attempts: 1, rejected: null });
    expect(store.items.get(queued.key)?.lastError).toMatch(/cannot be reached/);
    const up = await syncQueue(store, server.send);
    expect(up.sent).toEqual([queued.key]);
    expect(server.keysSeen).toEqual([queued.key, queued.key]);
    expect(server.records.size).toBe(1);
  });

  it('records once when the server saved it but the answer was lost on the way back', async () => {
    const store = memoryStore();
    const server = fakeServer();
    const queued = item();
    await store.put(queued);
    server.fail('answer-lost');
    await syncQueue(store, server.send);
    expect(store.items.has(queued.key)).toBe(true); // the phone does not know it landed
    const again = await syncQueue(store, server.send);
    expect(again.replayed).toEqual([queued.key]);
    expect(store.items.size).toBe(0);
    expect([...server.records.keys()]).toEqual([queued.key]);
  });

  it('tries nothing while the phone says it is offline', async () => {
    const store = memoryStore();
    const server = fakeServer();
    const queued = item();
    await store.put(queued);
    const report = await syncQueue(store, server.send, { isOnline: () => false });
    expect(report).toMatchObject({ skippedOffline: true, stillQueued: [queued.key], sent: [] });
    expect(server.keysSeen).toEqual([]);
    expect(store.items.get(queued.key)?.attempts).toBe(0);
  });

  it('stops after a network failure instead of trying every item against a dead link', async () => {
    const store = memoryStore();
    const server = fakeServer();
    const [a, b, c] = [item(), item(), item()];
    for (const i of [c, a, b]) await store.put(i);
    server.fail('network-before');
    const report = await syncQueue(store, server.send);
    expect(server.keysSeen).toEqual([a.key]); // oldest first, then stop
    expect(report.stillQueued).toEqual([a.key, b.key, c.key]);
    expect(store.items.get(b.key)?.attempts).toBe(0);
  });

  it('keeps a refused completion with the server’s message and does not send it again', async () => {
    const store = memoryStore();
    const refused = item();
    await store.put(refused);
    const message = 'This task is already done (on 2026-06-13). Ask your consultant to reopen it if it must be done again.';
    let calls = 0;
    const send: SendCompletion = async () => {
      calls += 1;
      throw apiError(409, message);
    };
    const report = await syncQueue(store, send, { now: () => new Date(Date.UTC(2026, 5, 14, 10)) });
    expect(report.rejected).toEqual([refused.key]);
    expect(store.items.get(refused.key)?.rejected).toEqual({ status: 409, message, at: '2026-06-14T10:00:00.000Z' });
    await syncQueue(store, send);
    expect(calls).toBe(1);
    expect(waitingItems([...store.items.values()])).toEqual([]);
  });

  it('sends only the signed-in person’s completions', async () => {
    const store = memoryStore();
    const server = fakeServer();
    const mine = item({ userId: 7 });
    const theirs = item({ userId: 8 });
    await store.put(mine);
    await store.put(theirs);
    await syncQueue(store, server.send, { userId: 7 });
    expect(server.keysSeen).toEqual([mine.key]);
    expect(store.items.has(theirs.key)).toBe(true);
  });
});

describe('what a failed send means', () => {
  // HTTP semantics (RFC 9110 section 15): 5xx and 408/429 may succeed on retry; other 4xx are the server's answer to this request.
  it.each([
    [0, 'retry'],
    [408, 'retry'],
    [429, 'retry'],
    [500, 'retry'],
    [503, 'retry'],
    [401, 'retry'],
    [404, 'rejected'],
    [409, 'rejected'],
    [413, 'rejected'],
    [415, 'rejected'],
    [422, 'rejected'],
  ] as const)('status %i → %s', (status, kind) => {
    expect(classifySendError(apiError(status, 'x')).kind).toBe(kind);
  });

  it('retries a stale CSRF token but not another 403', () => {
    expect(classifySendError(apiError(403, 'x', 'csrf')).kind).toBe('retry');
    expect(classifySendError(apiError(403, 'Crew members complete only their own tasks.')).kind).toBe('rejected');
  });

  it('asks a signed-out person to sign in again', () => {
    const outcome = classifySendError(apiError(401, 'Sign in first.'));
    expect(outcome).toEqual({ kind: 'retry', message: expect.stringMatching(/Sign in again/) });
  });
});

describe('the sync runner', () => {
  it('never runs two syncs at once, and runs once more for a call made during a sync', async () => {
    let running = 0;
    let maxRunning = 0;
    let runs = 0;
    const releases: (() => void)[] = [];
    const empty: SyncReport = { sent: [], replayed: [], rejected: [], stillQueued: [], skippedOffline: false };
    const runner = createSyncRunner(async () => {
      runs += 1;
      running += 1;
      maxRunning = Math.max(maxRunning, running);
      await new Promise<void>((resolve) => releases.push(resolve));
      running -= 1;
      return empty;
    });
    const a = runner();
    const b = runner();
    const c = runner();
    expect(runs).toBe(1);
    releases.shift()!();
    await a;
    await Promise.resolve();
    await Promise.resolve();
    expect(runs).toBe(2);
    releases.shift()!();
    await Promise.all([b, c]);
    expect(runs).toBe(2);
    expect(maxRunning).toBe(1);
  });
});

describe('the multipart body of a completion', () => {
  it('carries the fields the server reads and every photo under "photos"', async () => {
    const photo = new Blob([new Uint8Array([0xff, 0xd8, 0xff])], { type: 'image/jpeg' });
    const form = completionForm(item({ photos: [{ name: 'plot.jpg', type: 'image/jpeg', blob: photo }], fields: { doneOn: '2026-06-14', notes: '  ', hours: '', quantitiesUsed: [] } }));
    expect(form.get('doneOn')).toBe('2026-06-14');
    expect(form.has('notes')).toBe(false); // blank notes are left out
    expect(form.has('hours')).toBe(false);
    expect(form.get('quantitiesUsed')).toBe('[]');
    const files = form.getAll('photos') as File[];
    expect(files).toHaveLength(1);
    expect(files[0].name).toBe('plot.jpg');
    expect(files[0].size).toBe(3);
  });
});
