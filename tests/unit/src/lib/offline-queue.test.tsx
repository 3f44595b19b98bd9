// @vitest-environment jsdom
/**
 * The generic offline queue hook (src/lib/offline-queue.ts) in a browser-like page: jsdom for the
 * window and its online/offline events, fake-indexeddb for the phone's store, so a "reload" (a fresh
 * copy of the module over the same database) finds what was saved before it.
 */
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { act, cleanup, renderHook, waitFor } from '@testing-library/react';
import * as queueModule from '../../../../src/lib/offline-queue';
import type { QueuedItem, SendItem } from '../../../../src/lib/offline-queue';

type Lib = typeof queueModule;

interface QueuedNote extends QueuedItem {
  text: string;
}

/** An error as the api-client throws it: a status (0 = the network) and the server's sentence. */
const apiError = (status: number, message: string) => Object.assign(new Error(message), { status });

let online = true;
vi.spyOn(window.navigator, 'onLine', 'get').mockImplementation(() => online);

afterEach(() => {
  cleanup();
  online = true;
});

let n = 0;
/** A fresh kind of write per test, so no runner or database is shared between tests. */
const kind = () => `notes-${(n += 1)}`;

function mount(lib: Lib, name: string, send: SendItem<QueuedNote>, userId = 7) {
  const store = lib.browserStore<QueuedNote>(`test-${name}`, 'items');
  return renderHook(() => lib.useOfflineQueue<QueuedNote>({ name, userId, store, send, what: 'note' }));
}

const note = (lib: Lib, key: string, userId = 7) => lib.makeQueuedItem<QueuedNote>({ key, userId, text: 'Gate on the north lane is down' });

describe('useOfflineQueue', () => {
  it('sends a saved item once, even with two components using the same queue', async () => {
    const name = kind();
    const sent: string[] = [];
    const send: SendItem<QueuedNote> = async (item) => {
      sent.push(item.key);
      return { replayed: false };
    };
    const a = mount(queueModule, name, send);
    const b = mount(queueModule, name, send);
    let outcome: queueModule.SaveOutcome | undefined;
    await act(async () => {
      outcome = await a.result.current.save(note(queueModule, 'note-key-0001'));
    });
    expect(outcome).toEqual({ kind: 'sent' });
    await act(async () => {
      b.result.current.syncNow();
      a.result.current.syncNow();
    });
    await waitFor(() => expect(a.result.current.waiting).toEqual([]));
    expect(sent.filter((k) => k === 'note-key-0001')).toHaveLength(1);
  });

  it('keeps an item saved offline across a reload and sends it, with the same key, once back online', async () => {
    const name = kind();
    online = false;
    const neverCalled = vi.fn<SendItem<QueuedNote>>();
    const before = mount(queueModule, name, neverCalled);
    let outcome: queueModule.SaveOutcome | undefined;
    await act(async () => {
      outcome = await before.result.current.save(note(queueModule, 'note-key-0002'));
    });
    expect(outcome).toEqual({ kind: 'queued' });
    expect(before.result.current.waiting.map((i) => i.key)).toEqual(['note-key-0002']);
    expect(neverCalled).not.toHaveBeenCalled();
    before.unmount();

    // The reload: a fresh copy of the module (no runner, no cached store) over the same IndexedDB.
    vi.resetModules();
    const reloaded: Lib = await import('../../../../src/lib/offline-queue');
    online = true;
    const sent: string[] = [];
    const after = mount(reloaded, name, async (item) => {
      sent.push(item.key);
      return { replayed: false };
    });
    await waitFor(() => expect(sent).toEqual(['note-key-0002']));
    await waitFor(() => expect(after.result.current.waiting).toEqual([]));
  });

  it('drops a 4xx answer from the waiting list and shows its message until dismissed, without sending it again', async () => {
    const name = kind();
    const send = vi.fn<SendItem<QueuedNote>>(async () => {
      throw apiError(422, 'The note is longer than 2,000 characters.');
    });
    const q = mount(queueModule, name, send);
    let outcome: queueModule.SaveOutcome | undefined;
    await act(async () => {
      outcome = await q.result.current.save(note(queueModule, 'note-key-0003'));
    });
    expect(outcome).toEqual({ kind: 'rejected', message: 'The note is longer than 2,000 characters.' });
    await waitFor(() => expect(q.result.current.rejected.map((i) => i.rejected?.message)).toEqual(['The note is longer than 2,000 characters.']));
    expect(q.result.current.waiting).toEqual([]);
    await act(async () => {
      q.result.current.syncNow();
    });
    expect(send).toHaveBeenCalledTimes(1);
    await act(async () => {
      await q.result.current.dismiss('note-key-0003');
    });
    expect(q.result.current.rejected).toEqual([]);
  });

  it('keeps an item after a network failure and retries it with the same key when the phone comes back online', async () => {
    const name = kind();
    const tries: string[] = [];
    const delivered: string[] = [];
    let networkUp = false;
    const q = mount(queueModule, name, async (item) => {
      tries.push(item.key);
      if (!networkUp) throw apiError(0, 'No connection.');
      delivered.push(item.key);
      return { replayed: false };
    });
    let outcome: queueModule.SaveOutcome | undefined;
    await act(async () => {
      outcome = await q.result.current.save(note(queueModule, 'note-key-0004'));
    });
    expect(outcome).toEqual({ kind: 'queued' });
    expect(q.result.current.waiting[0]).toMatchObject({ key: 'note-key-0004', lastError: 'No connection.' });
    const failedTries = tries.length;
    expect(failedTries).toBeGreaterThanOrEqual(1);

    networkUp = true;
    await act(async () => {
      window.dispatchEvent(new Event('online'));
    });
    await waitFor(() => expect(q.result.current.waiting).toEqual([]));
    expect(tries.length).toBe(failedTries + 1);
    expect(new Set(tries)).toEqual(new Set(['note-key-0004']));
    expect(delivered).toEqual(['note-key-0004']);
  });

  it("shows and sends only the signed-in person's items", async () => {
    const name = kind();
    const store = queueModule.browserStore<QueuedNote>(`test-${name}`, 'items');
    await store.put(note(queueModule, 'someone-else-01', 8));
    const sent: string[] = [];
    const q = mount(queueModule, name, async (item) => {
      sent.push(item.key);
      return { replayed: false };
    });
    await act(async () => {
      await q.result.current.save(note(queueModule, 'note-key-0005'));
    });
    expect(sent).toEqual(['note-key-0005']);
    expect(q.result.current.waiting).toEqual([]);
    expect((await store.all()).map((i) => i.key)).toEqual(['someone-else-01']);
  });
});
