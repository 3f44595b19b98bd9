/**
 * The demo scenario, all invented: Fernhill Habitat Consulting, a three-person firm working in the
 * hill country of southwestern Wisconsin (Crawford and Vernon counties), and three of its clients.
 * Boundaries are drawn to look like ordinary rural tracts; they follow no real parcel.
 */
import type { Polygon } from 'geojson';

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

export const demoClients = [
  {
    name: 'Okonkwo-Larsen Family',
    email: 'priya.okonkwo@example.test',
    phone: '(608) 555-0161',
    address: 'S2291 Kettle Hollow Road, Soldiers Grove, WI',
    notes: 'Three generations hunt the farm. Want more mature bucks and a place for the kids to sit.',
    contacts: [{ email: 'client@browseline.test', name: 'Priya Okonkwo' }],
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
