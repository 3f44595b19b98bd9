import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { seedDemo } from '../../server/db/seeds/demo';
import { seedDemoPrescriptions } from '../../server/db/seeds/demo-prescriptions';
import { seedDemoSchedule } from '../../server/db/seeds/demo-schedule';
import { Client, Invoice, Prescription, Property, Proposal, Task, TaskPhoto, Unit, User } from '../../server/models';
import { signedInAgent, testApp } from '../support/test-app';
import { seedDemoSoilMehlich } from '../../server/db/seeds/demo-soil-mehlich';
import { SoilTestDtoSchema } from '../../shared/schemas/soil-tests';
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

  it('gives the Club plot one Mehlich-3 soil test, worked on the Tri-State basis after conversion, once', async () => {
    const firm = await seedDemo();
    await seedDemoPrescriptions(firm);
    expect(await seedDemoSoilMehlich(firm)).toBe(1);
    expect(await seedDemoSoilMehlich(firm)).toBe(0);
    const plot = await Unit.findOne({ where: { firmId: firm.id, name: 'Club plot' } });
    const consultant = await signedInAgent('consultant@browseline.test', 'demo-browseline');
    const res = await consultant.get(`/api/units/${plot!.id}/soil-tests`);
    expect(res.status).toBe(200);
    const tests = (res.body.data as unknown[]).map((t) => SoilTestDtoSchema.parse(t));
    const m3 = tests.filter((t) => t.labMethod === 'mehlich-3');
    expect(m3).toHaveLength(1);
    expect(m3[0]).toMatchObject({ pPpm: 24, kPpm: 115, cropGroup: 'brassica' });
    // Worked by hand: Ohio State ANR-75 puts Mehlich-3 P 24 at Bray P1 24 ÷ 1.35 = 17.8 ppm and K 115 at ammonium-acetate
    // K 115 ÷ 1.14 = 100.9 ppm; Tri-State build-up (Vitosh et al. 1995, MSU E-2567) then gives P2O5 (25 − 17.8) × 20 ÷ 4 + 40
    // brassica maintenance (from memory) = 76 and K2O (105 − 100.9) × 8 ÷ 4 + 60 = 68.2 → 68 lb/acre. Unconverted it would be 45 and 60.
    expect(m3[0]!.nutrients).toMatchObject({ p2o5LbPerAcre: 76, k2oLbPerAcre: 68 });
    expect(m3[0]!.nutrients.source).toMatch(/ANR-75/);
  });
});
