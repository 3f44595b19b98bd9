import { describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { choicesFor, defaultImportChoice, planImportSave, type ImportCandidate } from '../../../../src/features/plan-map/lib/import-choices';

const ring = (x: number): Polygon => ({ type: 'Polygon', coordinates: [[[x, 43], [x + 0.01, 43], [x + 0.01, 43.01], [x, 43.01], [x, 43]]] });
const area = (name: string, x = -90, kind?: ImportCandidate['kind']): ImportCandidate => ({ name, family: 'area', geometry: ring(x), ...(kind ? { kind } : {}) });
const line: ImportCandidate = { name: 'Trail', family: 'line', geometry: { type: 'LineString', coordinates: [[-90, 43], [-90.01, 43.01]] } };
const point: ImportCandidate = { name: 'Ladder stand', family: 'point', geometry: { type: 'Point', coordinates: [-90, 43] }, kind: 'stand-site' };

describe('what an imported feature becomes by default', () => {
  it('takes the kind the file states', () => {
    expect(defaultImportChoice(area('North plot', -90, 'food-plot'))).toBe('food-plot');
    expect(defaultImportChoice(point)).toBe('stand-site');
  });

  it('offers the boundary for an area named like one', () => {
    expect(defaultImportChoice(area('Property boundary'))).toBe('boundary');
    expect(defaultImportChoice(area('Parcel outline'))).toBe('boundary');
    // "Boundaryless" is not the word boundary (word match): common practice, no source.
    expect(defaultImportChoice(area('Boundaryless field'))).toBe('other-area');
  });

  it('falls back on a kind of the feature’s family', () => {
    // Defaults chosen for this app: other area, access route, stand site (no source).
    expect(defaultImportChoice(area('Field 3'))).toBe('other-area');
    expect(defaultImportChoice(line)).toBe('access-route');
  });

  it('offers only kinds of the feature’s family, and the boundary only for areas', () => {
    expect(choicesFor('line')).toEqual(['access-route', 'firebreak', 'fence', 'skip']);
    expect(choicesFor('area')[0]).toBe('boundary');
    expect(choicesFor('point')).not.toContain('boundary');
  });
});

describe('turning the choices into what to save', () => {
  it('joins several areas chosen as the boundary into one MultiPolygon and makes units of the rest', () => {
    const plan = planImportSave([area('East', -90), area('West', -91), line, point], ['boundary', 'boundary', 'firebreak', 'skip']);
    expect(plan.boundary?.type).toBe('MultiPolygon');
    expect(plan.boundary?.coordinates).toHaveLength(2);
    expect(plan.units).toEqual([{ kind: 'firebreak', name: 'Trail', geometry: line.geometry }]);
    expect(plan.problems).toEqual([]);
  });

  it('keeps a single boundary polygon a Polygon', () => {
    const plan = planImportSave([area('Property boundary')], ['boundary']);
    expect(plan.boundary).toEqual(ring(-90));
    expect(plan.units).toEqual([]);
  });

  it('refuses a line as the boundary and a kind of another family, saying what to choose', () => {
    const plan = planImportSave([line, area('Field')], ['boundary', 'fence']);
    expect(plan.boundary).toBeNull();
    expect(plan.units).toEqual([]);
    expect(plan.problems).toHaveLength(2);
    expect(plan.problems[0]).toMatch(/“Trail” is a line, so it cannot be the property boundary/);
    expect(plan.problems[1]).toMatch(/choose one of the area kinds or Skip/);
  });

  it('names an unnamed feature by its place in the file and cuts long names to the name limit', () => {
    const long = 'x'.repeat(300);
    const plan = planImportSave([area(''), area(long)], ['timber', 'timber']);
    expect(plan.units[0].name).toBe('Feature 1');
    // LIMITS.nameMax is 120 characters (shared/limits.ts).
    expect(plan.units[1].name).toHaveLength(120);
  });
});

describe('a walked track whose ends lie close together', () => {
  // An open walk around a field: four corners, the last a few metres short of the first.
  const walked: ImportCandidate = {
    name: 'Field walk',
    family: 'line',
    closableGapM: 8,
    geometry: { type: 'LineString', coordinates: [[-90, 43], [-90, 43.002], [-89.997, 43.002], [-89.997, 43], [-89.9999, 43]] },
  };

  it('offers the boundary and the area kinds besides the line kinds', () => {
    expect(choicesFor('line', true)).toContain('boundary');
    expect(choicesFor('line', true)).toContain('food-plot');
    expect(choicesFor('line', false)).not.toContain('boundary');
  });

  it('becomes the boundary or an area unit, closed by joining its ends', () => {
    const plan = planImportSave([walked, { ...walked, name: 'Plot walk' }], ['boundary', 'food-plot']);
    expect(plan.problems).toEqual([]);
    expect(plan.boundary).toEqual({ type: 'Polygon', coordinates: [[...walked.geometry.type === 'LineString' ? walked.geometry.coordinates : [], [-90, 43]]] });
    expect(plan.units[0].kind).toBe('food-plot');
    expect(plan.units[0].geometry.type).toBe('Polygon');
  });

  it('stays a line when chosen as one, and an open line without the mark cannot be the boundary', () => {
    const plan = planImportSave([walked, { ...walked, closableGapM: undefined }], ['fence', 'boundary']);
    expect(plan.units[0].geometry.type).toBe('LineString');
    expect(plan.problems[0]).toMatch(/cannot be the property boundary/);
  });
});
