/**
 * The camera fleet on Kettle Hollow Farm, all invented: three cameras, one moved from the hollow to
 * the ridge during the fall, a pulled card of small generated photos already tagged, and a roster
 * of two bucks followed across seasons. Dates are counted back from the firm's today, so a card is
 * always due for a pull on the Desk. Idempotent: nothing is written when the firm has cameras.
 */
import sharp from 'sharp';
import { Buck, Camera, CameraDeployment, CardPull, Property, Unit, type Firm } from '../../models';
import { firmToday } from '../../services/clock';
import type { CameraTag } from '../../../shared/domain/camera-events';
import { seedPhoto } from './demo-photo';

const addDays = (date: string, days: number) => new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

/** Photos of the pulled card: [day after the camera was set, wall-clock time, tag, buck name]. */
const CARD: [number, string, CameraTag, string | null][] = [
  [1, '06:42', 'doe', null], [1, '06:48', 'fawn', null], [1, '06:55', 'doe', null],
  [2, '18:20', 'buck', 'Wide eight'], [2, '18:31', 'buck', 'Wide eight'],
  [3, '02:10', 'doe', null], [4, '07:05', 'buck', 'Split brow'], [4, '07:12', 'doe', null],
  [5, '12:40', 'other-species', null], [6, '19:02', 'doe', null], [6, '19:09', 'fawn', null],
  [7, '05:55', 'buck', 'Wide eight'], [8, '10:15', 'person', null], [9, '22:30', 'empty', null],
  [10, '17:48', 'buck', 'Split brow'], [11, '06:30', 'doe', null], [12, '18:05', 'fawn', null], [13, '23:40', 'doe', null],
];

/** A small JPEG of a plain colour (a stand-in for a trail-camera picture). */
const tile = (i: number) => sharp({ create: { width: 96, height: 72, channels: 3, background: { r: 60 + ((i * 29) % 120), g: 70 + ((i * 17) % 110), b: 40 + ((i * 11) % 80) } } }).jpeg({ quality: 70 }).toBuffer();

/** Writes the demo camera fleet when the firm has none. */
export async function seedDemoCameras(firm: Firm): Promise<number> {
  if (await Camera.count({ where: { firmId: firm.id } })) return 0;
  const property = await Property.findOne({ where: { firmId: firm.id, name: 'Kettle Hollow Farm' } });
  if (!property) return 0;
  const sites = await Unit.findAll({ where: { propertyId: property.id, kind: 'camera-site' }, order: [['name', 'ASC']] });
  if (sites.length < 2) return 0;
  const [ridge, hollow] = sites;
  const today = await firmToday(firm.id);
  const zone = firm.timezone || 'America/Chicago';

  const [cam1, cam2] = await Promise.all(['Cam 1', 'Cam 2', 'Cam 3 (spare)'].map((label, i) => Camera.create({ firmId: firm.id, label, serial: `HX-20${41 + i}`, retiredAt: null, createdById: null })));
  // Cam 2 watched the hollow over the summer, then moved to the ridge; Cam 1 went into the hollow.
  const setOn = addDays(today, -40);
  const pulledOn = addDays(today, -26);
  const summer = await CameraDeployment.create({ firmId: firm.id, cameraId: cam2.id, propertyId: property.id, unitId: hollow.id, startedOn: addDays(today, -120), endedOn: addDays(today, -45), mode: 'photo', notes: 'Summer on the hollow trail', clockOffsetSeconds: 0, createdById: null });
  await CardPull.create({ firmId: firm.id, deploymentId: summer.id, pulledOn: addDays(today, -45), batteryPct: 38, photoCount: 212, notes: 'Moved to the ridge the same day', createdById: null });
  await CameraDeployment.create({ firmId: firm.id, cameraId: cam2.id, propertyId: property.id, unitId: ridge.id, startedOn: addDays(today, -45), endedOn: null, mode: 'hybrid', notes: 'Facing the ridge scrape line', clockOffsetSeconds: 0, createdById: null });
  const fall = await CameraDeployment.create({ firmId: firm.id, cameraId: cam1.id, propertyId: property.id, unitId: hollow.id, startedOn: setOn, endedOn: null, mode: 'photo', notes: 'Creek crossing; its clock runs 4 minutes slow', clockOffsetSeconds: 240, createdById: null });
  await CardPull.create({ firmId: firm.id, deploymentId: fall.id, pulledOn, batteryPct: 71, photoCount: CARD.length, notes: 'Card swapped, batteries fine', createdById: null });

  const season = Number(today.slice(0, 4)) - (Number(today.slice(5, 7)) >= 7 ? 0 : 1);
  const bucks = new Map<string, Buck>();
  for (const [name, ages, notes] of [
    ['Wide eight', ['3.5', '4.5', '5.5+'], 'Wide, heavy eight; drops a G4 on the left.'],
    ['Split brow', ['2.5', '3.5', '4.5'], 'Split brow tine on the right side.'],
  ] as const) {
    bucks.set(name, await Buck.create({ firmId: firm.id, propertyId: property.id, name, notes, ageEstimates: ages.map((ageClass, i) => ({ season: season - 2 + i, ageClass })) }));
  }

  const featured = new Set<string>();
  for (const [i, [day, time, tag, buckName]] of CARD.entries()) {
    const cameraTime = `${addDays(setOn, day)}T${time}:00`;
    const buck = buckName ? bucks.get(buckName)! : null;
    const feature = !!buck && !featured.has(buck.name);
    if (buck) featured.add(buck.name);
    await seedPhoto(fall, zone, {
      bytes: await tile(i),
      originalName: `IMG_${String(i + 1).padStart(4, '0')}.JPG`,
      cameraTime,
      tag,
      buckId: buck?.id ?? null,
      featured: feature,
    });
  }
  return CARD.length;
}
