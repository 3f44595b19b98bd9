/**
 * The demo scenario, all invented: Fernhill Habitat Consulting, a three-person firm working in the
 * hill country of southwestern Wisconsin (Crawford and Vernon counties), and three of its clients.
 * Boundaries are drawn to look like ordinary rural tracts; they follow no real parcel.
 */
import type { LineString, Point, Polygon } from 'geojson';
import type { UnitKind } from '../../../shared/domain/unit-kinds';

export const DEMO_PASSWORD = 'demo-browseline';

export const demoFirm = {
  slug: 'fernhill-habitat',
  name: 'Fernhill Habitat Consulting',
  email: 'office@fernhill-habitat.test',
  phone: '(608) 555-0142',
  address: '214 Mill Street, Gays Mills, WI 54631',
  region: 'midwest',
  timezone: 'America/Chicago',
};

export const demoStaff = [
  { email: 'owner@browseline.test', name: 'Dana Whitcomb', role: 'owner' as const, phone: '(608) 555-0142' },
  { email: 'consultant@browseline.test', name: 'Eli Marchetti', role: 'consultant' as const, phone: '(608) 555-0178' },
  { email: 'crew@browseline.test', name: 'Rosa Quintero', role: 'crew' as const, phone: '(608) 555-0193' },
  { email: 'crew2@browseline.test', name: 'Tobias Lindqvist', role: 'crew' as const, phone: '(608) 555-0117' },
];

/** A closed ring from [lon, lat] corners. */
const ring = (corners: [number, number][]): Polygon => ({ type: 'Polygon', coordinates: [[...corners, corners[0]]] });
const line = (points: [number, number][]): LineString => ({ type: 'LineString', coordinates: points });
const point = (lon: number, lat: number): Point => ({ type: 'Point', coordinates: [lon, lat] });

export interface DemoUnit {
  kind: UnitKind;
  name: string;
  notes?: string;
  geometry: Polygon | LineString | Point;
}

/** The drawn plan of Kettle Hollow Farm. */
const kettleHollowUnits: DemoUnit[] = [
  { kind: 'food-plot', name: 'Ridge clover plot', notes: 'Old hay ground on the ridge top; soil test in hand.', geometry: ring([[-90.9398, 43.2722], [-90.9371, 43.2723], [-90.9370, 43.2712], [-90.9397, 43.2710]]) },
  { kind: 'food-plot', name: 'Hollow brassica plot', geometry: ring([[-90.9352, 43.2690], [-90.9336, 43.2692], [-90.9334, 43.2683], [-90.9350, 43.2681]]) },
  { kind: 'timber', name: 'North oak slope', notes: 'White and red oak, some hickory; crowded pole timber on the lower third.', geometry: ring([[-90.9410, 43.2729], [-90.9400, 43.2729], [-90.9399, 43.2700], [-90.9410, 43.2695]]) },
  { kind: 'bedding-area', name: 'South slope bedding', notes: 'Thin cover; hinge-cut and plant shrubs.', geometry: ring([[-90.9395, 43.2680], [-90.9360, 43.2679], [-90.9358, 43.2665], [-90.9396, 43.2664]]) },
  { kind: 'sanctuary', name: 'Cedar draw sanctuary', notes: 'Nobody enters after Sept 1.', geometry: ring([[-90.9408, 43.2690], [-90.9398, 43.2690], [-90.9398, 43.2662], [-90.9408, 43.2662]]) },
  { kind: 'cover-planting', name: 'Switchgrass screen', geometry: ring([[-90.9368, 43.2727], [-90.9352, 43.2728], [-90.9352, 43.2724], [-90.9368, 43.2723]]) },
  { kind: 'access-route', name: 'East walk-in to ridge stand', geometry: line([[-90.9314, 43.2700], [-90.9335, 43.2706], [-90.9355, 43.2712], [-90.9368, 43.2716]]) },
  { kind: 'firebreak', name: 'Lower field trail', geometry: line([[-90.9395, 43.2700], [-90.9360, 43.2697], [-90.9330, 43.2696]]) },
  { kind: 'stand-site', name: 'Ridge stand', notes: 'Ladder stand for the kids.', geometry: point(-90.9369, 43.2717) },
  { kind: 'stand-site', name: 'Hollow stand', geometry: point(-90.9345, 43.2695) },
  { kind: 'camera-site', name: 'Camera 1 — ridge', geometry: point(-90.9385, 43.2716) },
  { kind: 'camera-site', name: 'Camera 2 — hollow', geometry: point(-90.9343, 43.2686) },
  { kind: 'mock-scrape', name: 'Mock scrape by the oak', geometry: point(-90.9380, 43.2708) },
  { kind: 'water-source', name: 'Stock tank', geometry: point(-90.9374, 43.2690) },
  { kind: 'gate', name: 'East gate and parking', geometry: point(-90.9313, 43.2700) },
];

export const demoClients = [
  {
    name: 'Okonkwo-Larsen Family',
    email: 'priya.okonkwo@example.test',
    phone: '(608) 555-0161',
    address: 'S2291 Kettle Hollow Road, Soldiers Grove, WI',
    notes: 'Three generations hunt the farm. Want more mature bucks and a place for the kids to sit.',
    contacts: [
      { email: 'client@browseline.test', name: 'Priya Okonkwo' },
      // A second household member with their own sign-in: both see the family's properties.
      { email: 'client2@browseline.test', name: 'Anders Larsen' },
    ],
    properties: [
      {
        name: 'Kettle Hollow Farm',
        county: 'Crawford',
        state: 'WI',
        region: 'midwest',
        objectives: 'Hold does and young bucks on the farm through the late season; two kid-friendly stand sites; fix the bedding cover on the south slope.',
        boundary: ring([
          [-90.9412, 43.2731], [-90.9312, 43.2731], [-90.9312, 43.2688], [-90.9335, 43.2671],
          [-90.9336, 43.2659], [-90.9412, 43.2659],
        ]),
        units: kettleHollowUnits,
      },
      {
        name: 'Kettle Hollow — North 40',
        county: 'Crawford',
        state: 'WI',
        region: 'midwest',
        objectives: 'Timber ground: thin the oaks, hinge-cut an edge for screening.',
        boundary: ring([
          [-90.9412, 43.2768], [-90.9362, 43.2768], [-90.9362, 43.2732], [-90.9412, 43.2732],
        ]),
      },
    ],
  },
  {
    name: 'Bluestem Ridge Hunting Club',
    email: 'secretary@bluestem-ridge.test',
    phone: '(608) 555-0124',
    address: 'PO Box 88, Viroqua, WI',
    notes: 'Eight members. Board approves spending at the March meeting.',
    contacts: [{ email: 'club@browseline.test', name: 'Marcus Feld' }],
    properties: [
      {
        name: 'Bluestem Ridge',
        county: 'Vernon',
        state: 'WI',
        region: 'midwest',
        objectives: 'Better food in the late season, quieter access to the ridge stands, a sanctuary nobody enters.',
        boundary: ring([
          [-90.8874, 43.5522], [-90.8731, 43.5522], [-90.8731, 43.5449], [-90.8790, 43.5431],
          [-90.8874, 43.5431],
        ]),
        units: [
          { kind: 'food-plot', name: 'Club plot', geometry: ring([[-90.8800, 43.5500], [-90.8770, 43.5500], [-90.8770, 43.5488], [-90.8800, 43.5488]]) },
          { kind: 'timber', name: 'Ridge hardwoods', geometry: ring([[-90.8870, 43.5520], [-90.8820, 43.5520], [-90.8820, 43.5440], [-90.8870, 43.5440]]) },
          { kind: 'stand-site', name: 'Club ridge stand', geometry: point(-90.8815, 43.5495) },
        ] as DemoUnit[],
      },
    ],
  },
  {
    name: 'Havlicek, Marguerite & Tom',
    email: 'havliceks@example.test',
    phone: '(608) 555-0185',
    address: 'E4410 Sawmill Ridge Lane, Readstown, WI',
    notes: 'Bought the land in 2025. New to habitat work; want a plan they can partly do themselves.',
    contacts: [],
    properties: [
      {
        name: 'Sawmill Ridge 80',
        county: 'Vernon',
        state: 'WI',
        region: 'midwest',
        objectives: 'A first food plot, native grass where the old hayfield is, and trail cameras to see what lives there.',
        boundary: ring([
          [-90.7512, 43.4513], [-90.7463, 43.4513], [-90.7463, 43.4441], [-90.7512, 43.4441],
        ]),
      },
    ],
  },
];
