import { describe, expect, it } from 'vitest';
import { seedDemo } from '../../server/db/seeds/demo';
import { seedDemoPrescriptions } from '../../server/db/seeds/demo-prescriptions';
import { seedDemoSchedule } from '../../server/db/seeds/demo-schedule';
import { seedDemoPortal } from '../../server/db/seeds/demo-portal';
import { SharedFile, Task, TaskPhoto } from '../../server/models';
import { signedInAgent } from '../support/test-app';

const counts = async () => ({ files: await SharedFile.count(), tasks: await Task.count(), photos: await TaskPhoto.count() });
const names = (body: { data: { properties: { name: string }[] } }) => body.data.properties.map((p) => p.name);

describe('the portal demo', () => {
  it('is idempotent and gives the family files, tasks with a photo, and uploads', async () => {
    const firm = await seedDemo();
    await seedDemoPrescriptions(firm);
    // The portal demo builds on the scheduled work, as `npm start` seeds it: this file must not rely on another having run first.
    await seedDemoSchedule(firm);
    await seedDemoPortal(firm);
    const first = await counts();
    await seedDemoPortal(await seedDemo());
    expect(await counts()).toEqual(first);
    expect(first.files).toBeGreaterThanOrEqual(2);
    expect(first.tasks).toBeGreaterThan(5);
    expect(first.photos).toBeGreaterThan(0);
  });

  it('lets both family contacts see the same two properties, and the club only its own', async () => {
    const priya = await signedInAgent('client@browseline.test', 'demo-browseline');
    const anders = await signedInAgent('client2@browseline.test', 'demo-browseline');
    const club = await signedInAgent('club@browseline.test', 'demo-browseline');
    const a = (await priya.get('/api/portal/properties')).body;
    expect([...names(a)].sort()).toEqual(['Kettle Hollow Farm', 'Kettle Hollow — North 40'].sort());
    expect(names((await anders.get('/api/portal/properties')).body)).toEqual(names(a));
    expect(a.data.client.portalUploadsAllowed).toBe(true);
    expect(names((await club.get('/api/portal/properties')).body)).toEqual(['Bluestem Ridge']);
    const farm = a.data.properties.find((p: { name: string }) => p.name === 'Kettle Hollow Farm');
    expect(farm.percentDone).toBeGreaterThan(0);
    expect((await club.get(`/api/portal/properties/${farm.id}`)).status).toBe(404);
  });
});
