import { afterEach, describe, expect, it, vi } from 'vitest';
import { createCacheSaver } from '../../../../src/lib/cache-saver';

/** The saver's schedule with a fake clock: the idle moment comes at once. */
function saverWithLog(intervalMs = 1000) {
  const saves: { at: number; leaving: boolean }[] = [];
  const saver = createCacheSaver((leaving) => saves.push({ at: Date.now(), leaving }), {
    intervalMs,
    whenIdle: (fn) => {
      const t = setTimeout(fn, 0);
      return () => clearTimeout(t);
    },
  });
  return { saver, saves };
}

afterEach(() => {
  vi.useRealTimers();
});

describe('when the kept cache is written', () => {
  it('soon after the first change, then at most once a second however often it changes', async () => {
    vi.useFakeTimers({ now: 0 });
    const { saver, saves } = saverWithLog();
    saver.changed();
    await vi.advanceTimersByTimeAsync(1);
    expect(saves).toHaveLength(1); // the first change is saved at the next idle moment
    expect(saves[0].at).toBeLessThanOrEqual(1);
    for (let t = 0; t < 20; t += 1) {
      saver.changed();
      await vi.advanceTimersByTimeAsync(100);
    }
    await vi.advanceTimersByTimeAsync(1000);
    // 2 s of changes every 100 ms: one save a second (the last change included), not twenty.
    expect(saves).toHaveLength(3);
    const gaps = saves.slice(1).map((s, i) => s.at - saves[i].at);
    for (const gap of gaps) expect(gap).toBeGreaterThanOrEqual(1000);
    expect(saves.every((s) => !s.leaving)).toBe(true);
  });

  it('saves at once when the page is left, and nothing after it is stopped', async () => {
    vi.useFakeTimers({ now: 0 });
    const { saver, saves } = saverWithLog();
    saver.changed();
    saver.flush(); // the scheduled save is replaced by this one
    await vi.advanceTimersByTimeAsync(2000);
    expect(saves).toEqual([{ at: 0, leaving: true }]);
    saver.changed();
    saver.stop();
    await vi.advanceTimersByTimeAsync(5000);
    saver.flush();
    expect(saves).toHaveLength(1);
  });
});
