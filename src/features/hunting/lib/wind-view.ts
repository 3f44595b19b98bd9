/** Pure helpers for the planner's screens: the stands that suit a wind, with their routes, and reason wording. */
import type { StandWindsAnswer, StandWindsRow } from '../../../../shared/schemas/hunting';
import type { WindName } from '../../../../shared/domain/stand-winds';

export interface SuitableStand {
  stand: StandWindsRow;
  /** Names of the routes to walk in by (empty when the stand has no mapped route). */
  routes: { id: number; name: string }[];
}

/** The stands that suit a wind, best huntable share first, each with the routes that suit it too. */
export function standsForWind(answer: StandWindsAnswer, wind: WindName): SuitableStand[] {
  const names = new Map(answer.meta.layout.map((u) => [u.id, u.name]));
  return answer.data
    .filter((s) => s.winds.find((w) => w.from === wind)?.suitable)
    .sort((a, b) => (b.huntableShare ?? 0) - (a.huntableShare ?? 0) || a.name.localeCompare(b.name))
    .map((stand) => ({ stand, routes: (stand.winds.find((w) => w.from === wind)?.routeIds ?? []).map((id) => ({ id, name: names.get(id) ?? 'Access route' })) }));
}

const REASON_WORDS = { 'bedding-area': 'scent over the bedding area', sanctuary: 'scent over the sanctuary', 'approach-side': 'scent over the side deer approach', route: 'every way in lays scent where deer are' } as const;

/** A reason in words: “scent over the bedding area “North thicket””. */
export function reasonText(reason: { kind: keyof typeof REASON_WORDS; name: string }): string {
  return reason.kind === 'route' ? `walking in by “${reason.name}” lays scent over protected cover` : `${REASON_WORDS[reason.kind]} “${reason.name}”`;
}

/** A share as a percent for people: 0.4286 → "43%". */
export const percent = (share: number | null) => (share === null ? '—' : `${Math.round(share * 100)}%`);
