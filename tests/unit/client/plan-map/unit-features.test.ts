import { describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { defaultUnitName, groupByKind, kindsPresent, unitsToCollections, type MapUnit } from '../../../../src/features/plan-map/lib/unit-features';

const square: Polygon = { type: 'Polygon', coordinates: [[[0, 0], [0.001, 0], [0.001, 0.001], [0, 0.001], [0, 0]]] };
const unit = (id: number, kind: MapUnit['kind'], name: string, family: MapUnit['family']): MapUnit => ({
  id,
  kind,
  family,
  name,
  geometry: family === 'area' ? square : family === 'line' ? { type: 'LineString', coordinates: [[0, 0], [0.001, 0.001]] } : { type: 'Point', coordinates: [0, 0] },
  acres: family === 'area' ? 3 : null,
  lengthFt: family === 'line' ? 500 : null,
});

describe('units as map data', () => {
  it('puts each unit in the collection of its family, with the unit id as feature id', () => {
    const c = unitsToCollections([unit(1, 'food-plot', 'A', 'area'), unit(2, 'fence', 'B', 'line'), unit(3, 'gate', 'C', 'point'), unit(4, 'timber', 'D', 'area')]);
    // Families by kind as listed in shared/domain/unit-kinds.ts (DESIGN.md's kind table).
    expect(c.area.features.map((f) => f.id)).toEqual([1, 4]);
    expect(c.line.features.map((f) => f.properties.kind)).toEqual(['fence']);
    expect(c.point.features[0].properties).toEqual({ id: 3, kind: 'gate', name: 'C', acres: 0, workStatus: 'no-work' });
  });

  it('carries each unit’s work status for the "colour by work status" mode; units without tasks have none', () => {
    // Status names from shared/domain/tasks.ts (unitWorkStatus); common practice, no source.
    const c = unitsToCollections([unit(1, 'food-plot', 'A', 'area'), unit(4, 'timber', 'D', 'area')], new Map([[1, 'in-progress' as const]]));
    expect(c.area.features.map((f) => f.properties.workStatus)).toEqual(['in-progress', 'no-work']);
  });

  it('lists the kinds present in palette order, each once', () => {
    // Palette order of UNIT_KINDS: areas, then lines, then points (shared/domain/unit-kinds.ts).
    expect(kindsPresent([unit(1, 'gate', 'g', 'point'), unit(2, 'food-plot', 'f', 'area'), unit(3, 'food-plot', 'f2', 'area')])).toEqual(['food-plot', 'gate']);
  });

  it('groups units by kind and sorts each group by name with numbers in numeric order', () => {
    const groups = groupByKind([unit(1, 'food-plot', 'Food plot 10', 'area'), unit(2, 'food-plot', 'Food plot 2', 'area'), unit(3, 'water', 'Pond', 'area')]);
    expect(groups.map((g) => g.kind)).toEqual(['food-plot', 'water']);
    // Natural sort order: common practice, no source.
    expect(groups[0].units.map((u) => u.name)).toEqual(['Food plot 2', 'Food plot 10']);
  });
});

describe('default name of a new unit', () => {
  it('is the kind label and 1 on a plan without that kind', () => {
    // Label "Food plot" from KIND_STYLES; naming scheme "<Kind label> N" from the plan-map brief.
    expect(defaultUnitName('food-plot', [])).toBe('Food plot 1');
  });

  it('follows the highest number already used, not the count, so names do not repeat after a delete', () => {
    const units = [unit(1, 'food-plot', 'Food plot 1', 'area'), unit(3, 'food-plot', 'Food plot 3', 'area')];
    expect(defaultUnitName('food-plot', units)).toBe('Food plot 4');
  });

  it('counts units of the kind with other names, and ignores other kinds', () => {
    const units = [unit(1, 'food-plot', 'North clover', 'area'), unit(2, 'food-plot', 'Creek bottom', 'area'), unit(3, 'timber', 'Timber 7', 'area')];
    expect(defaultUnitName('food-plot', units)).toBe('Food plot 3');
    expect(defaultUnitName('timber', units)).toBe('Timber 8');
  });

  it('reads labels with a slash literally', () => {
    // "Gate / parking" is the gate kind's label in KIND_STYLES.
    expect(defaultUnitName('gate', [unit(1, 'gate', 'Gate / parking 2', 'point')])).toBe('Gate / parking 3');
  });
});
