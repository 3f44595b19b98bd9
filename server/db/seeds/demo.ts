/** Seeds the demo scenario; idempotent (finds before it creates) and refused in production. */
import { sequelize } from '../sequelize';
import { Client, Firm, Property, Unit, User } from '../../models';
import { measureUnit } from '../../../shared/domain/geometry';
import { installStarterLibrary } from '../../commands/library-installer';
import { hashPassword } from '../../services/auth/passwords';
import { boundaryColumns } from '../../commands/property-writer';
import { DEMO_PASSWORD, demoClients, demoFirm, demoStaff } from './demo-data';
import { seedDemoInvoices } from './demo-invoices';
import { seedDemoResults } from './demo-results';
import { seedDemoMap } from './demo-map';
import { seedDemoObservations } from './demo-observations';
import { seedDemoHunting } from './demo-hunting';

/** Creates whatever part of the demo is missing; answers the firm. */
export async function seedDemo(): Promise<Firm> {
  if (process.env.NODE_ENV === 'production') {
    throw new Error('Refusing to seed demo data in production mode (NODE_ENV=production).');
  }
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return sequelize.transaction(async (transaction) => {
    const [firm] = await Firm.findOrCreate({
      where: { slug: demoFirm.slug },
      defaults: { ...demoFirm, settings: { taxRatePct: 5.5 } },
      transaction,
    });
    await installStarterLibrary(firm.id, transaction);
    for (const staff of demoStaff) {
      const existing = await User.findOne({ where: { email: staff.email }, transaction });
      if (!existing) {
        await User.create({ firmId: firm.id, clientId: null, email: staff.email, name: staff.name, role: staff.role, phone: staff.phone, passwordHash, lastSignInAt: null }, { transaction });
      }
    }
    for (const c of demoClients) {
      const [client] = await Client.findOrCreate({
        where: { firmId: firm.id, name: c.name },
        defaults: { firmId: firm.id, name: c.name, email: c.email, phone: c.phone, address: c.address, notes: c.notes },
        transaction,
      });
      for (const contact of c.contacts) {
        const existing = await User.findOne({ where: { email: contact.email }, transaction });
        if (!existing) {
          await User.create({ firmId: firm.id, clientId: client.id, email: contact.email, name: contact.name, role: 'client', phone: null, passwordHash, lastSignInAt: null }, { transaction });
        }
      }
      for (const p of c.properties) {
        const existing = await Property.findOne({ where: { firmId: firm.id, clientId: client.id, name: p.name }, transaction });
        if (!existing) {
          const property = await Property.create(
            { firmId: firm.id, clientId: client.id, name: p.name, county: p.county, state: p.state, region: p.region, objectives: p.objectives, notes: null, ...boundaryColumns(p.boundary) },
            { transaction },
          );
          for (const u of 'units' in p ? (p.units ?? []) : []) {
            const m = measureUnit(u.kind, u.geometry);
            await Unit.create({ firmId: firm.id, propertyId: property.id, kind: u.kind, name: u.name, notes: u.notes ?? null, geometry: u.geometry, acres: m.acres, perimeterFt: m.perimeterFt, lengthFt: m.lengthFt }, { transaction });
          }
        }
      }
    }
    await seedDemoInvoices(firm, transaction);
    await seedDemoResults(firm, transaction);
    await seedDemoMap(firm, transaction);
    await seedDemoObservations(firm, transaction);
    await seedDemoHunting(firm, transaction);
    return firm;
  });
}
