/**
 * Place search time (npx tsx tests/bench/places.ts): median per query of a mix of county, town,
 * partial, accented and coordinate searches, interleaved with its baseline — a linear pass that only
 * folds the query and tests `startsWith` on every key — so the ratio shows the ranking's own cost.
 * Target: under 50 ms at the median on this machine.
 */
import { placeIndex, searchPlaces } from '../../server/services/places/place-index';
import { fold } from '../../shared/domain/place-search';

const QUERIES = ['Crawford County, WI', 'viroqua', 'Prairie du Ch', 'CAÑON CITY', 'Madison, Wisconsin', 'spring', '43.2655, -90.938', 'zzzz', 'Jefferson County', 'san'];

const t0 = performance.now();
const size = placeIndex().length;
const buildMs = performance.now() - t0;

const baseline = (q: string) => {
  const key = fold(q);
  let n = 0;
  for (const p of placeIndex()) if (p.key.startsWith(key)) n++;
  return n;
};

const search: number[] = [];
const base: number[] = [];
for (let round = 0; round < 30; round++) {
  for (const q of QUERIES) {
    let t = performance.now();
    searchPlaces(q);
    search.push(performance.now() - t);
    t = performance.now();
    baseline(q);
    base.push(performance.now() - t);
  }
}
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
console.log(JSON.stringify({ bench: 'places', places: size, buildMs: Number(buildMs.toFixed(0)), medianMs: Number(median(search).toFixed(3)), baselineMedianMs: Number(median(base).toFixed(3)), ratio: Number((median(search) / median(base)).toFixed(2)) }));
