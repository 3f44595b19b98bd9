/** A printed scale bar: a round length in feet or miles that fits in a given width. */
import { FEET_PER_MILE, METRES_PER_FOOT } from '../../../../shared/units';

const FEET_STEPS = [10, 20, 25, 50, 100, 200, 250, 500, 1000, 2000];
const MILE_STEPS = [0.5, 1, 2, 5, 10, 20, 50, 100];

/** The longest round length not wider than maxPx at metresPerPx, and its width in pixels. */
export function niceScaleBar(metresPerPx: number, maxPx: number): { label: string; px: number } {
  const maxFt = (metresPerPx * maxPx) / METRES_PER_FOOT;
  const ftPerPx = metresPerPx / METRES_PER_FOOT;
  const ft = [...FEET_STEPS].reverse().find((s) => s <= maxFt);
  if (maxFt < FEET_PER_MILE / 2 || !MILE_STEPS.some((m) => m * FEET_PER_MILE <= maxFt)) {
    const len = ft ?? FEET_STEPS[0];
    return { label: `${len.toLocaleString('en-US')} ft`, px: len / ftPerPx };
  }
  const mi = [...MILE_STEPS].reverse().find((m) => m * FEET_PER_MILE <= maxFt)!;
  return { label: `${mi} mi`, px: (mi * FEET_PER_MILE) / ftPerPx };
}
