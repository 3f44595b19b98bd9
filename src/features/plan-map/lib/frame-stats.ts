/** Frame-time statistics for the plan map's performance probe. */

export interface FrameStats {
  frames: number;
  medianMs: number;
  p95Ms: number;
  maxMs: number;
}

/** Median, 95th percentile (nearest rank) and maximum of frame intervals in milliseconds. */
export function frameStats(intervalsMs: readonly number[]): FrameStats {
  if (intervalsMs.length === 0) return { frames: 0, medianMs: 0, p95Ms: 0, maxMs: 0 };
  const sorted = [...intervalsMs].sort((a, b) => a - b);
  const n = sorted.length;
  const median = n % 2 === 1 ? sorted[(n - 1) / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2;
  const rank = Math.max(1, Math.ceil(0.95 * n));
  return { frames: n, medianMs: median, p95Ms: sorted[rank - 1], maxMs: sorted[n - 1] };
}

/** Records requestAnimationFrame intervals until stopped; stop() answers their statistics. */
export function startFrameProbe(): { stop: () => FrameStats } {
  const intervals: number[] = [];
  let last = performance.now();
  let running = true;
  const tick = (now: number) => {
    intervals.push(now - last);
    last = now;
    if (running) requestAnimationFrame(tick);
  };
  requestAnimationFrame((now) => {
    last = now;
    requestAnimationFrame(tick);
  });
  return {
    stop: () => {
      running = false;
      return frameStats(intervals);
    },
  };
}
