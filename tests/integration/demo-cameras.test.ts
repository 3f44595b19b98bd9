import { describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { seedDemo } from '../../server/db/seeds/demo';
import { seedDemoCameras } from '../../server/db/seeds/demo-cameras';
import { seedDemoCameraSites } from '../../server/db/seeds/demo-camera-sites';
import { seedDemoPressureHarvest } from '../../server/db/seeds/demo-pressure-harvest';
import { Camera, CameraPhoto, HarvestRecord, Sit } from '../../server/models';
import { signedInAgent } from '../support/test-app';
import { CameraSitesAnswerSchema, DeploymentEventsDtoSchema, DuePullDtoSchema } from '../../shared/schemas/cameras';

describe('the demo camera fleet', () => {
  it('seeds cameras, a moved camera, a tagged card and a roster once; a card is due with its access route', async () => {
    const firm = await seedDemo();
    const written = await seedDemoCameras(firm);
    expect(written === 0 || written === 18).toBe(true);
    expect(await seedDemoCameras(firm)).toBe(0);
    expect(await Camera.count({ where: { firmId: firm.id } })).toBe(3);
    expect(await CameraPhoto.count({ where: { firmId: firm.id, tag: 'buck' } })).toBe(5);
    const consultant = await signedInAgent('consultant@browseline.test', 'demo-browseline');
    const due = (await consultant.get('/api/deployments/due')).body.data.map((d: unknown) => DuePullDtoSchema.parse(d));
    expect(due.find((d: { cameraLabel: string }) => d.cameraLabel === 'Cam 1')).toMatchObject({ daysSince: 26, unitName: 'Camera 2 — hollow' });
    const photo = await CameraPhoto.findOne({ where: { firmId: firm.id }, order: [['id', 'ASC']] });
    const events = DeploymentEventsDtoSchema.parse((await consultant.get(`/api/deployments/${photo!.deploymentId}/events`)).body.data);
    expect(events.eventCount).toBeGreaterThan(5);
    expect(events.cameraNights).toBe(14);
    const roster = await consultant.get(`/api/properties/${photo!.propertyId}/bucks`);
    expect(roster.body.data.map((b: { name: string }) => b.name)).toEqual(['Split brow', 'Wide eight']);
  });

  it('adds the hollow’s summer card, so the hollow site sums two deployments, and names the roster buck on the sits that saw one', async () => {
    const firm = await seedDemo();
    await seedDemoCameras(firm);
    const first = await seedDemoCameraSites(firm);
    expect(await seedDemoCameraSites(firm)).toBe(0);
    expect(first === 0 || first >= 12).toBe(true);
    const consultant = await signedInAgent('consultant@browseline.test', 'demo-browseline');
    const photo = await CameraPhoto.findOne({ where: { firmId: firm.id }, order: [['id', 'ASC']] });
    const sites = CameraSitesAnswerSchema.parse((await consultant.get(`/api/properties/${photo!.propertyId}/camera-sites`)).body);
    const hollow = sites.data.find((s) => s.name === 'Camera 2 — hollow')!;
    // Summer: set 120 days ago, taken down 45 days ago (75 nights); fall: set 40 days ago, card pulled 26 days ago (14 nights).
    expect(hollow).toMatchObject({ deploymentCount: 2, cameraNights: 89 });
    expect(hollow.eventsByKind.deer).toBeGreaterThan(10);
    const sits = await Sit.findAll({ where: { propertyId: photo!.propertyId } });
    expect(sits.filter((s) => s.bucks > 0).every((s) => s.buckIds.length === 1)).toBe(true);
  });

  it('records the deer taken on the newest sit that saw a buck, with its disease-sampling number, once', async () => {
    const firm = await seedDemo();
    await seedDemoPressureHarvest(firm);
    expect(await seedDemoPressureHarvest(firm)).toBe(0);
    // The seed's own record (another file may log a deer with the same sampling number through the API).
    const sampled = await HarvestRecord.findAll({ where: { firmId: firm.id, diseaseSampleNumber: 'WI-CWD 2026-0417', sitId: { [Op.ne]: null } } });
    expect(sampled).toHaveLength(1);
    const sit = (await Sit.findByPk(sampled[0]!.sitId!))!;
    expect(sit.bucks).toBeGreaterThan(0);
    expect(sampled[0]!.standUnitId).toBe(sit.standUnitId);
  });
});
