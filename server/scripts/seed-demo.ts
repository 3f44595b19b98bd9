/** Migrates, then seeds the demo scenario (idempotent; refused in production). */
import { migrateUp } from '../db/migrator';
import { sequelize } from '../db/sequelize';
import { seedDemo } from '../db/seeds/demo';
import { seedDemoPrescriptions } from '../db/seeds/demo-prescriptions';
import { seedDemoSchedule } from '../db/seeds/demo-schedule';
import { seedDemoPortal } from '../db/seeds/demo-portal';
import { seedDemoChecks } from '../db/seeds/demo-checks';
import { seedDemoCameras } from '../db/seeds/demo-cameras';
import { seedDemoCameraSites } from '../db/seeds/demo-camera-sites';
import { seedDemoPressureHarvest } from '../db/seeds/demo-pressure-harvest';
import { seedDemoSpray } from '../db/seeds/demo-spray';
import { seedDemoSeasons } from '../db/seeds/demo-seasons';
import { seedDemoSoilMehlich } from '../db/seeds/demo-soil-mehlich';
import { startJobQueue, stopJobQueue } from '../services/jobs/job-queue';

try {
  await migrateUp();
  // Jobs the seed hands over (the sent proposal's e-mail) wait for the app's workers.
  await startJobQueue({ workers: false, install: true });
  const firm = await seedDemo();
  await seedDemoPrescriptions(firm);
  await seedDemoSchedule(firm);
  await seedDemoPortal(firm);
  await seedDemoChecks(firm);
  await seedDemoSeasons(firm);
  await seedDemoCameras(firm);
  await seedDemoCameraSites(firm);
  await seedDemoPressureHarvest(firm);
  await seedDemoSpray(firm);
  await seedDemoSoilMehlich(firm);
  console.log(`demo data ready for ${firm.name}`);
} catch (err) {
  console.error((err as Error).message);
  process.exitCode = 1;
} finally {
  await stopJobQueue();
  await sequelize.close();
}
