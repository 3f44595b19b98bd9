import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { seedDemo } from '../../server/db/seeds/demo';
import { seedDemoPrescriptions } from '../../server/db/seeds/demo-prescriptions';
import { Client, Invoice, Prescription, Property, Unit, User } from '../../server/models';
import { testApp } from '../support/test-app';

const counts = async () => ({ users: await User.count(), clients: await Client.count(), properties: await Property.count(), units: await Unit.count(), prescriptions: await Prescription.count(), invoices: await Invoice.count() });

describe('the demo seed', () => {
  it('is idempotent, signs every demo role in, and is refused in production mode', async () => {
    const firm = await seedDemo();
    await seedDemoPrescriptions(firm);
    const first = await counts();
    await seedDemoPrescriptions(await seedDemo());
    expect(await counts()).toEqual(first);
    expect(await Prescription.count({ where: { firmId: firm.id } })).toBeGreaterThanOrEqual(6);
    const club = await Client.findOne({ where: { firmId: firm.id, name: 'Bluestem Ridge Hunting Club' } });
    const clubInvoices = await Invoice.findAll({ where: { clientId: club!.id } });
    expect(clubInvoices.map((i) => i.status).sort()).toEqual(['open', 'paid']); // Receivables is not empty
    expect(clubInvoices.every((i) => i.totalCents > 0)).toBe(true);
    for (const email of ['owner@browseline.test', 'consultant@browseline.test', 'crew@browseline.test', 'client@browseline.test']) {
      const res = await request(testApp()).post('/api/auth/login').send({ email, password: 'demo-browseline' });
      expect(res.status, email).toBe(200);
    }
    const before = process.env.NODE_ENV;
    process.env.NODE_ENV = 'production';
    try {
      await expect(seedDemo()).rejects.toThrow(/production/);
    } finally {
      process.env.NODE_ENV = before;
    }
  });
});
