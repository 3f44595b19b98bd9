/**
 * Seeds two invented firms for the growth benchmark: "scale-1" and "scale-10", the second with ten
 * times the first's clients, properties, units, tasks and invoices (same shapes, same dates), each
 * with a consultant (`scale1@…`, `scale10@…`, password bench-password-1) and a client contact
 * of its first client (`scale1-client@…`).
 */
import { Client, Firm, Invoice, Property, Task, Unit, User } from '../../server/models';
import { hashPassword } from '../../server/services/auth/passwords';
import { boundaryColumns } from '../../server/commands/property-writer';
import { measureUnit } from '../../shared/domain/geometry';
import { sequelize } from '../../server/db/sequelize';
import type { Polygon } from 'geojson';

const CLIENTS = 4;
const PROPERTIES_PER_CLIENT = 2;
const UNITS_PER_PROPERTY = 8;
const TASKS_PER_UNIT = 3;
const passwordHash = await hashPassword('bench-password-1');
const addDays = (iso: string, n: number) => new Date(Date.parse(`${iso}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
const today = new Date().toISOString().slice(0, 10);

for (const factor of [1, 10]) {
  const firm = await Firm.create({ name: `Scale ${factor}× Firm`, slug: `scale-${factor}`, email: null, phone: null, address: null });
  await User.create({ firmId: firm.id, clientId: null, email: `scale${factor}@browseline.test`, name: 'Consultant', role: 'consultant', phone: null, passwordHash, lastSignInAt: null });
  let invoiceNo = 0;
  for (let c = 0; c < CLIENTS * factor; c++) {
    const client = await Client.create({ firmId: firm.id, name: `Client ${String(c + 1).padStart(3, '0')}`, email: null, phone: null, address: null, notes: null });
    if (c === 0) await User.create({ firmId: firm.id, clientId: client.id, email: `scale${factor}-client@browseline.test`, name: 'Landowner', role: 'client', phone: null, passwordHash, lastSignInAt: null });
    for (let p = 0; p < PROPERTIES_PER_CLIENT; p++) {
      const [w, s] = [-90.96 + 0.02 * p, 43.25 + 0.001 * c];
      const boundary: Polygon = { type: 'Polygon', coordinates: [[[w, s], [w + 0.015, s], [w + 0.015, s + 0.01], [w, s + 0.01], [w, s]]] };
      const property = await Property.create({ firmId: firm.id, clientId: client.id, name: `Property ${c + 1}-${p + 1}`, county: null, state: null, region: 'midwest', objectives: null, notes: null, ...boundaryColumns(boundary) });
      const units = [];
      for (let u = 0; u < UNITS_PER_PROPERTY; u++) {
        const x = w + 0.0015 * u;
        const geometry: Polygon = { type: 'Polygon', coordinates: [[[x, s + 0.002], [x + 0.001, s + 0.002], [x + 0.001, s + 0.004], [x, s + 0.004], [x, s + 0.002]]] };
        const m = measureUnit('food-plot', geometry);
        units.push(await Unit.create({ firmId: firm.id, propertyId: property.id, kind: 'food-plot', name: `Plot ${u + 1}`, notes: null, geometry, acres: m.acres, perimeterFt: m.perimeterFt, lengthFt: m.lengthFt }));
      }
      const tasks = [];
      for (const unit of units) {
        for (let t = 0; t < TASKS_PER_UNIT; t++) {
          // Spread over twenty weeks around today, so every week and the timeline's window hold some.
          const start = addDays(today, ((unit.id * 7 + t * 23 + c * 5) % 140) - 70);
          tasks.push({ firmId: firm.id, propertyId: property.id, unitId: unit.id, stepKey: `step-${t}`, name: `Step ${t + 1}`, kind: 'planting', practiceName: 'Clover plot', unitName: unit.name, earliest: start, latest: addDays(start, 21), startDate: start, endDate: addDays(start, 1) });
        }
      }
      await Task.bulkCreate(tasks);
      for (let i = 0; i < 2; i++) {
        invoiceNo++;
        await Invoice.create({ firmId: firm.id, clientId: client.id, propertyId: property.id, kind: 'progress', number: `INV-2026-${String(invoiceNo).padStart(4, '0')}`, status: 'open', issuedOn: addDays(today, -10 * i), dueOn: addDays(today, 20 - 10 * i), subtotalCents: 10_000, totalCents: 10_000, billedCents: 10_000 });
      }
    }
  }
  console.log(`scale firm ${factor}×: ${CLIENTS * factor} clients, ${CLIENTS * factor * PROPERTIES_PER_CLIENT} properties, ${CLIENTS * factor * PROPERTIES_PER_CLIENT * UNITS_PER_PROPERTY * TASKS_PER_UNIT} tasks`);
}
await sequelize.close();
