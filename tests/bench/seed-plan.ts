/** Seeds the benchmark database: one firm, one consultant, one property with 500 units. */
import { Client, Firm, Property, Unit, User } from '../../server/models';
import { hashPassword } from '../../server/services/auth/passwords';
import { boundaryColumns } from '../../server/commands/property-writer';
import { measureUnit } from '../../shared/domain/geometry';
import { sequelize } from '../../server/db/sequelize';
import type { Geometry, Polygon } from 'geojson';
import type { UnitKind } from '../../shared/domain/unit-kinds';

const firm = await Firm.create({ name: 'Bench Firm', slug: 'bench', email: null, phone: null, address: null });
await User.create({ firmId: firm.id, clientId: null, email: 'bench@browseline.test', name: 'Bench', role: 'consultant', phone: null, passwordHash: await hashPassword('bench-password-1'), lastSignInAt: null });
const client = await Client.create({ firmId: firm.id, name: 'Bench client', email: null, phone: null, address: null, notes: null });
const [w, s, e, n] = [-90.96, 43.25, -90.9, 43.29];
const boundary: Polygon = { type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] };
const property = await Property.create({ firmId: firm.id, clientId: client.id, name: 'Bench property', county: null, state: null, region: 'midwest', objectives: null, notes: null, ...boundaryColumns(boundary) });
const kinds: UnitKind[] = ['food-plot', 'timber', 'bedding-area', 'access-route', 'stand-site', 'camera-site'];
const rows = [];
for (let i = 0; i < 500; i++) {
  const kind = kinds[i % kinds.length];
  const x = w + 0.0024 * (i % 25);
  const y = s + 0.0019 * Math.floor(i / 25);
  let geometry: Geometry;
  if (kind === 'access-route') geometry = { type: 'LineString', coordinates: [[x, y], [x + 0.0008, y + 0.0005], [x + 0.0016, y + 0.0002]] };
  else if (kind === 'stand-site' || kind === 'camera-site') geometry = { type: 'Point', coordinates: [x + 0.001, y + 0.001] };
  else {
    const ring: [number, number][] = [];
    for (let k = 0; k < 24; k++) ring.push([x + 0.001 + 0.0009 * Math.cos((k / 24) * 2 * Math.PI), y + 0.0009 + 0.0007 * Math.sin((k / 24) * 2 * Math.PI)]);
    ring.push(ring[0]);
    geometry = { type: 'Polygon', coordinates: [ring] };
  }
  const m = measureUnit(kind, geometry);
  rows.push({ firmId: firm.id, propertyId: property.id, kind, name: `${kind} ${i + 1}`, notes: null, geometry, acres: m.acres, perimeterFt: m.perimeterFt, lengthFt: m.lengthFt });
}
await Unit.bulkCreate(rows);
console.log(`bench plan: ${rows.length} units`);
await sequelize.close();
