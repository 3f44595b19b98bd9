/** Plan units as map data: one FeatureCollection per geometry family, for data-driven layers. */
import type { Feature, FeatureCollection, Geometry } from 'geojson';
import { KIND_STYLES, UNIT_KINDS, type KindFamily, type UnitKind } from '../../../../shared/domain/unit-kinds';
import type { UnitWorkStatus } from '../../../../shared/domain/tasks';

/** The fields of a unit the map and the ledger need. */
export interface MapUnit {
  id: number;
  kind: UnitKind;
  family: KindFamily;
  name: string;
  geometry: Geometry;
  acres: number | null;
  lengthFt: number | null;
}

export interface UnitProps {
  id: number;
  kind: UnitKind;
  name: string;
  /** Smaller areas win a click where areas overlap. */
  acres: number;
  /** The unit's work status, for the "colour by work status" mode; units without tasks have none. */
  workStatus: UnitWorkStatus;
}

export type FamilyCollections = Record<KindFamily, FeatureCollection<Geometry, UnitProps>>;

/** Splits units into one FeatureCollection per family; the feature id is the unit id (for feature-state). Units missing from `statuses` have no work. */
export function unitsToCollections(units: readonly MapUnit[], statuses?: ReadonlyMap<number, UnitWorkStatus>): FamilyCollections {
  const out: Record<KindFamily, Feature<Geometry, UnitProps>[]> = { area: [], line: [], point: [] };
  for (const u of units) {
    const family = KIND_STYLES[u.kind]?.family ?? u.family;
    out[family].push({ type: 'Feature', id: u.id, geometry: u.geometry, properties: { id: u.id, kind: u.kind, name: u.name, acres: u.acres ?? 0, workStatus: statuses?.get(u.id) ?? 'no-work' } });
  }
  return {
    area: { type: 'FeatureCollection', features: out.area },
    line: { type: 'FeatureCollection', features: out.line },
    point: { type: 'FeatureCollection', features: out.point },
  };
}

/** The kinds that occur among the units, in palette order (for the legend). */
export function kindsPresent(units: readonly Pick<MapUnit, 'kind'>[]): UnitKind[] {
  const seen = new Set(units.map((u) => u.kind));
  return UNIT_KINDS.filter((k) => seen.has(k));
}

/**
 * The default name of a new unit: "<Kind label> N", N one more than the highest number already used
 * in such a name and never below the count of units of that kind plus one.
 */
export function defaultUnitName(kind: UnitKind, units: readonly Pick<MapUnit, 'kind' | 'name'>[]): string {
  const label = KIND_STYLES[kind].label;
  const pattern = new RegExp(`^${label.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')} (\\d+)$`, 'i');
  let highest = 0;
  let count = 0;
  for (const u of units) {
    if (u.kind === kind) count += 1;
    const m = pattern.exec(u.name.trim());
    if (m) highest = Math.max(highest, Number(m[1]));
  }
  return `${label} ${Math.max(highest, count) + 1}`;
}

/** Units grouped by kind in palette order, each group sorted by name. */
export function groupByKind<T extends Pick<MapUnit, 'kind' | 'name'>>(units: readonly T[]): { kind: UnitKind; units: T[] }[] {
  const byKind = new Map<UnitKind, T[]>();
  for (const u of units) {
    const list = byKind.get(u.kind);
    if (list) list.push(u);
    else byKind.set(u.kind, [u]);
  }
  return UNIT_KINDS.filter((k) => byKind.has(k)).map((kind) => ({
    kind,
    units: byKind.get(kind)!.slice().sort((a, b) => a.name.localeCompare(b.name, 'en', { numeric: true })),
  }));
}

/** The colour a kind is known by: the stroke of areas and lines, the fill of point symbols. */
export const kindColour = (kind: UnitKind): string => (KIND_STYLES[kind].family === 'point' ? KIND_STYLES[kind].fill : KIND_STYLES[kind].stroke);
