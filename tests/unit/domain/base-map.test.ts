import { describe, expect, it } from 'vitest';
import { createRequire } from 'node:module';
import { baseMapData, labelPoint, labelsInView, type UsAtlasTopology } from '../../../shared/domain/base-map';

const require = createRequire(import.meta.url);
const topology = require('us-atlas/counties-10m.json') as UsAtlasTopology;
const data = baseMapData(topology);

describe('the offline base map', () => {
  it('labels every state and county of the Census file once (counts taken from the file itself)', () => {
    expect(data.labels.filter((l) => l.kind === 'state').length).toBe(topology.objects.states.geometries.length);
    expect(data.labels.filter((l) => l.kind === 'county').length).toBe(topology.objects.counties.geometries.filter((g) => (g.properties as { name?: string } | undefined)?.name).length);
    expect(data.labels.filter((l) => l.kind === 'county').length).toBeGreaterThan(3000);
  });

  it('puts Crawford County, WI’s label inside the county: Prairie du Chien’s county, 90.7–91.2°W, 43.0–43.4°N (Census, from memory)', () => {
    const crawford = data.labels.filter((l) => l.name === 'Crawford County' && l.lon > -91.3 && l.lon < -90.6 && l.lat > 42.9 && l.lat < 43.5);
    expect(crawford).toHaveLength(1);
    expect(data.labels.some((l) => l.name === 'Caddo Parish')).toBe(true); // Louisiana's counties are parishes
  });

  it('draws county lines only between counties of one state, so state lines are not drawn twice', () => {
    expect(data.stateLines.coordinates.length).toBeGreaterThan(10);
    expect(data.countyLines.coordinates.length).toBeGreaterThan(1000);
  });

  it('places a label inside an L-shaped area, not at its box centre (common practice, no source)', () => {
    // An L: the box centre (1, 1) lies outside the shape.
    const l = { type: 'Polygon' as const, coordinates: [[[0, 0], [2, 0], [2, 0.5], [0.5, 0.5], [0.5, 2], [0, 2], [0, 0]]] };
    const [x, y] = labelPoint(l)!;
    expect(x).toBeGreaterThan(0);
    expect(x).toBeLessThan(0.5);
    expect(y).toBe(1);
  });

  it('shows states zoomed out, counties in view zoomed in, never more than the cap', () => {
    expect(labelsInView(data.labels, [-125, 24, -66, 50], 4).every((l) => l.kind === 'state')).toBe(true);
    const near = labelsInView(data.labels, [-91.5, 42.8, -90.3, 43.7], 9);
    expect(near.every((l) => l.kind === 'county')).toBe(true);
    expect(near.map((l) => l.name)).toContain('Crawford County');
    expect(labelsInView(data.labels, [-125, 24, -66, 50], 8, 6.5, 150)).toHaveLength(150);
  });
});
