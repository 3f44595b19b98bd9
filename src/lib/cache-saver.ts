/**
 * When the kept query cache is written: soon after it changes, at most once per interval, at a moment
 * the page is idle (the snapshot and its JSON are made then, not on every change), and at once when
 * asked (the page is hidden or left).
 */

export interface CacheSaver {
  /** Something changed: a save is scheduled unless one already is. */
  changed(): void;
  /** Saves now, as the page is hidden or left (cancelling a scheduled save); saving goes on after it. */
  flush(): void;
  /** No save after this one. */
  stop(): void;
}

export interface CacheSaverOptions {
  /** At most one scheduled save per this many milliseconds. */
  intervalMs?: number;
  now?: () => number;
  /** Runs `fn` when the page is idle (or after `timeoutMs` at the latest); answers a canceller. */
  whenIdle?: (fn: () => void, timeoutMs: number) => () => void;
}

/** `requestIdleCallback` where the browser has it (not Safari), a short timer elsewhere. */
export function whenIdle(fn: () => void, timeoutMs: number): () => void {
  if (typeof window !== 'undefined' && typeof window.requestIdleCallback === 'function') {
    const id = window.requestIdleCallback(fn, { timeout: timeoutMs });
    return () => window.cancelIdleCallback(id);
  }
  const timer = setTimeout(fn, 0);
  return () => clearTimeout(timer);
}

/** A saver that calls `save` as described above (`leaving` is true for a `flush`). */
export function createCacheSaver(save: (leaving: boolean) => void, { intervalMs = 1000, now = Date.now, whenIdle: idle = whenIdle }: CacheSaverOptions = {}): CacheSaver {
  let last = Number.NEGATIVE_INFINITY;
  let cancel: (() => void) | null = null;
  let stopped = false;
  const run = (leaving = false) => {
    cancel = null;
    if (stopped) return;
    last = now();
    save(leaving);
  };
  return {
    changed() {
      if (stopped || cancel) return;
      const wait = Math.max(0, last + intervalMs - now());
      let cancelIdle: (() => void) | null = null;
      const timer = setTimeout(() => {
        cancelIdle = idle(() => run(), intervalMs);
      }, wait);
      cancel = () => {
        clearTimeout(timer);
        cancelIdle?.();
      };
    },
    flush() {
      cancel?.();
      run(true);
    },
    stop() {
      stopped = true;
      cancel?.();
      cancel = null;
    },
  };
}
