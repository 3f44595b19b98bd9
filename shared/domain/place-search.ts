/** Ranking places (counties, towns) against what someone typed: case- and accent-blind, prefix-tolerant. */

export type PlaceKind = 'county' | 'town' | 'coordinates';

export interface Place {
  name: string;
  kind: PlaceKind;
  center: [number, number];
  bbox?: [number, number, number, number];
}

/** A place prepared for search: its folded name and state (abbreviation and name, folded). */
export interface IndexedPlace extends Place {
  key: string;
  state: string;
  stateName: string;
}

/** Lower case, accents removed (NFD, combining marks dropped), punctuation to spaces, spaces collapsed. */
export function fold(text: string): string {
  return text
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();
}

const COUNTY_WORDS = /\s+(county|co|parish|borough|census area|municipality)$/;

/** What the query asks for: the place name folded, an optional state, and whether it said "county". */
export function readQuery(q: string): { name: string; state: string | null; wantsCounty: boolean } {
  const [namePart = '', ...rest] = q.split(',');
  let name = fold(namePart);
  let state = rest.length ? fold(rest.join(' ')) || null : null;
  // "Crawford County WI" without a comma: a trailing two-letter word is a state.
  if (!state) {
    const m = /^(.*\S)\s+([a-z]{2})$/.exec(name);
    if (m && COUNTY_WORDS.test(m[1]!)) {
      name = m[1]!;
      state = m[2]!;
    }
  }
  const wantsCounty = COUNTY_WORDS.test(name);
  name = name.replace(COUNTY_WORDS, '');
  return { name, state, wantsCounty };
}

/** The best `limit` places for the query: exact names first, then name prefixes, then word prefixes; counties first when asked for. */
export function rankPlaces(index: readonly IndexedPlace[], q: string, limit = 10): Place[] {
  const { name, state, wantsCounty } = readQuery(q);
  if (!name) return [];
  const scored: { place: IndexedPlace; score: number }[] = [];
  const wordPrefix = ` ${name}`;
  for (const p of index) {
    if (state && p.state !== state && !p.stateName.startsWith(state)) continue;
    let score: number;
    if (p.key === name) score = 0;
    else if (p.key.startsWith(name)) score = 10;
    else if (p.key.includes(wordPrefix)) score = 20;
    else continue;
    if (p.kind === 'county') score += wantsCounty ? -5 : 1;
    scored.push({ place: p, score });
  }
  scored.sort((a, b) => a.score - b.score || a.place.key.length - b.place.key.length || a.place.name.localeCompare(b.place.name));
  return scored.slice(0, limit).map(({ place: { name: n, kind, center, bbox } }) => (bbox ? { name: n, kind, center, bbox } : { name: n, kind, center }));
}
