import { describe, expect, it } from 'vitest';
import { QueryClient } from '@tanstack/react-query';
import { persistedSnapshot } from '../../../src/lib/query-persistence';

/** The save made at once when a page is left writes what the throttled persister would: the same rules. */
describe('the cache saved when a page is left', () => {
  it('keeps a crew member’s own answered queries and nothing else', () => {
    const client = new QueryClient();
    client.setQueryData(['auth', 'me'], { id: 3, role: 'crew' });
    client.setQueryData(['tasks', 'mine'], { tasks: [{ id: 1 }] });
    client.setQueryData(['desk'], { counts: {} });
    const snapshot = persistedSnapshot(client, 1_700_000_000_000);
    expect(snapshot.buster).toBe('browseline-1');
    expect(snapshot.timestamp).toBe(1_700_000_000_000);
    expect(snapshot.clientState.queries.map((q) => q.queryKey)).toEqual([['auth', 'me'], ['tasks', 'mine']]);
  });

  it('keeps none of a staff preview of a client’s portal', () => {
    const client = new QueryClient();
    client.setQueryData(['auth', 'me'], { id: 5, role: 'consultant' });
    client.setQueryData(['portal', 'preview', 12, 'properties'], []);
    expect(persistedSnapshot(client).clientState.queries.map((q) => q.queryKey)).toEqual([['auth', 'me']]);
  });
});
