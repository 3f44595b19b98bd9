/** Factories: each test makes its own firm, people and records with unique values. */
import crypto from 'node:crypto';
import type { Polygon } from 'geojson';
import { Client, Firm, Property, User } from '../../server/models';
import { hashPassword } from '../../server/services/auth/passwords';
import { boundaryColumns } from '../../server/commands/property-writer';
import type { Role } from '../../shared/schemas/auth';
import { installStarterLibrary } from '../../server/commands/library-installer';

export const PASSWORD = 'factory-password-1';
const unique = () => crypto.randomBytes(5).toString('hex');

/** A firm with one user of each role (and the client its contact belongs to). */
export async function makeFirm(name = `Test Firm ${unique()}`) {
  const firm = await Firm.create({ name, slug: `firm-${unique()}`, email: null, phone: null, address: null });
  await installStarterLibrary(firm.id);
  const client = await makeClient(firm.id);
  const users = {
    owner: await makeUser(firm.id, 'owner'),
    consultant: await makeUser(firm.id, 'consultant'),
    crew: await makeUser(firm.id, 'crew'),
    client: await makeUser(firm.id, 'client', client.id),
  };
  return { firm, client, users };
}

/** A user with the factory password. */
export async function makeUser(firmId: number, role: Role, clientId: number | null = null, overrides: Partial<{ email: string; active: boolean }> = {}) {
  return User.create({
    firmId,
    clientId,
    role,
    email: overrides.email ?? `${role}-${unique()}@example.test`,
    name: `${role[0].toUpperCase()}${role.slice(1)} ${unique()}`,
    phone: null,
    passwordHash: await hashPassword(PASSWORD),
    active: overrides.active ?? true,
    lastSignInAt: null,
  });
}

export async function makeClient(firmId: number, name = `Client ${unique()}`) {
  return Client.create({ firmId, name, email: null, phone: null, address: null, notes: null });
}

/** A square-ish property near 43.3°N, 90.9°W. */
export async function makeProperty(firmId: number, clientId: number, boundary?: Polygon) {
  const b: Polygon = boundary ?? {
    type: 'Polygon',
    coordinates: [[[-90.94, 43.27], [-90.93, 43.27], [-90.93, 43.265], [-90.94, 43.265], [-90.94, 43.27]]],
  };
  return Property.create({ firmId, clientId, name: `Property ${unique()}`, county: 'Crawford', state: 'WI', region: 'midwest', objectives: null, notes: null, ...boundaryColumns(b) });
}
