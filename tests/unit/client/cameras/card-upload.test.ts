import { describe, expect, it } from 'vitest';
import { uploadCard, type CardUploadProgress } from '../../../../src/features/cameras/lib/card-upload';
import { reviewAction } from '../../../../src/features/cameras/lib/review-keys';
import type { CardUploadResult } from '../../../../shared/schemas/cameras';

/** An in-memory server: keeps hashes; can drop the connection on a chosen request. */
function fakeServer(failOnCall: number | null = null) {
  const stored = new Set<string>();
  let calls = 0;
  return {
    stored,
    deps: {
      hash: async (f: string) => `h-${f}`,
      known: async (hashes: string[]) => hashes.filter((h) => stored.has(h)),
      send: async (files: string[]): Promise<CardUploadResult> => {
        calls += 1;
        if (calls === failOnCall) throw new Error('Browseline cannot be reached.');
        let added = 0;
        for (const f of files) {
          if (stored.has(`h-${f}`)) continue;
          stored.add(`h-${f}`);
          added++;
        }
        return { added, skipped: files.length - added, photos: [], skips: [], flagged: [] };
      },
    },
  };
}

describe('card upload', () => {
  const card = Array.from({ length: 12 }, (_, i) => `IMG_${i}`);

  it('sends a card in batches with progress', async () => {
    const server = fakeServer();
    const seen: CardUploadProgress[] = [];
    const done = await uploadCard(card, server.deps, (p) => seen.push(p), 5);
    expect(done).toMatchObject({ total: 12, sent: 12, added: 12, alreadyThere: 0 });
    expect(seen.map((p) => p.sent)).toEqual([0, 5, 10, 12]);
  });

  it('continues after a dropped connection: a second run sends only what did not arrive', async () => {
    const server = fakeServer(2);
    await expect(uploadCard(card, server.deps, () => undefined, 5)).rejects.toThrow(/cannot be reached/);
    expect(server.stored.size).toBe(5);
    const again = await uploadCard(card, server.deps, () => undefined, 5);
    expect(again).toMatchObject({ alreadyThere: 5, sent: 7, added: 7 });
    expect(server.stored.size).toBe(12);
  });

  it('sends a file picked twice once', async () => {
    const server = fakeServer();
    const done = await uploadCard(['A', 'B', 'A'], server.deps, () => undefined, 5);
    expect(done).toMatchObject({ sent: 2, alreadyThere: 1 });
  });
});

describe('review keys', () => {
  it('maps letters to tags, digits to roster bucks and arrows to moves in a 4-wide grid', () => {
    expect(reviewAction('b', 4)).toEqual({ kind: 'tag', tag: 'buck' });
    expect(reviewAction('O', 4)).toEqual({ kind: 'tag', tag: 'other-species' });
    expect(reviewAction('2', 4)).toEqual({ kind: 'buck', index: 1 });
    expect(reviewAction('ArrowDown', 4)).toEqual({ kind: 'move', by: 4 });
    expect(reviewAction('s', 4)).toEqual({ kind: 'feature' });
    expect(reviewAction('x', 4)).toBeNull();
  });
});
