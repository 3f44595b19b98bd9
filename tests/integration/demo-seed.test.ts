import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { seedDemo } from '../../server/db/seeds/demo';
import { seedDemoPrescriptions } from '../../server/db/seeds/demo-prescriptions';
import { seedDemoSchedule } from '../../server/db/seeds/demo-schedule';
import { Client, Invoice, Prescription, Property, Proposal, Task, TaskPhoto, Unit, User } from '../../server/models';
import { testApp } from '../support/test-app';
import { seedDemoSpray } from '../../server/db/seeds/demo-spray';
import { SprayRecord } from '../../server/models/spray-record';

const counts = async () => ({ users: await User.count(), clients: await Client.count(), properties: await Property.count(), units: await Unit.count(), prescriptions: await Prescription.count(), proposals: await Proposal.count(), tasks: await Task.count(), photos: await TaskPhoto.count(), invoices: await Invoice.count() });

describe('the demo seed', () => {
  it('is idempotent, signs every demo role in, and is refused in production mode', async () => {
    const firm = await seedDemo();
    await seedDemoPrescriptions(firm);
    await seedDemoSchedule(firm);
    const first = await counts();
    const again = await seedDemo();
    await seedDemoPrescriptions(again);
    await seedDemoSchedule(again);
    expect(await counts()).toEqual(first);
    expect(await Prescription.count({ where: { firmId: firm.id } })).toBeGreaterThanOrEqual(6);
    // Work in progress: an approved proposal whose tasks are on the crew's sheet, one done with a photo.
    expect(await Proposal.count({ where: { firmId: firm.id, status: 'approved' } })).toBe(1);
    const crew = await User.findOne({ where: { email: 'crew@browseline.test' } });
    expect(await Task.count({ where: { firmId: firm.id, assigneeId: crew!.id, status: 'scheduled' } })).toBeGreaterThanOrEqual(2);
    expect(await Task.count({ where: { firmId: firm.id, status: 'done' } })).toBe(1);
    expect(await TaskPhoto.count({ where: { firmId: firm.id } })).toBe(1);
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

  it('finishes one herbicide step with its spray record, once', async () => {
    const firm = await seedDemo();
    await seedDemoPrescriptions(firm);
    await seedDemoSchedule(firm);
    const made = await seedDemoSpray(firm);
    expect(made).toBeGreaterThanOrEqual(1);
    expect(await seedDemoSpray(firm)).toBe(0);
    const record = await SprayRecord.findOne({ where: { firmId: firm.id } });
    expect(record).toMatchObject({ windDirection: 'SW', restrictedUse: false });
    expect(record!.latitude).not.toBeNull();
  });
});
