/**
 * Kettle Hollow Farm's camera sites, summed over deployments, all invented: the summer card of the
 * camera that watched the hollow before it moved to the ridge (so the hollow site's numbers add two
 * deployments), and the roster's bucks named on the ridge sits that saw a buck (the sit log's buck
 * picker). Runs after `seedDemoCameras` and the hunting seed; idempotent.
 */
import sharp from 'sharp';
import { Op } from 'sequelize';
import { Buck, CameraDeployment, CameraPhoto, Property, Sit, type Firm } from '../../models';
import type { CameraTag } from '../../../shared/domain/camera-events';
import { seedPhoto } from './demo-photo';

const addDays = (date: string, days: number) => new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

/** The summer card at the hollow: [day after the camera was set, wall-clock time, tag]. */
const SUMMER_CARD: [number, string, CameraTag][] = [
  [3, '05:40', 'doe'], [3, '05:52', 'fawn'], [9, '20:35', 'doe'], [14, '21:10', 'other-species'],
  [22, '06:05', 'doe'], [22, '06:20', 'fawn'], [31, '19:45', 'doe'], [38, '13:15', 'other-species'],
  [47, '20:50', 'doe'], [55, '05:30', 'doe'], [61, '21:40', 'fawn'], [70, '06:10', 'doe'],
];

/** A small JPEG of a summer-green colour (a stand-in for a trail-camera picture). */
const tile = (i: number) => sharp({ create: { width: 96, height: 72, channels: 3, background: { r: 50 + ((i * 23) % 60), g: 110 + ((i * 31) % 100), b: 30 + ((i * 7) % 50) } } }).jpeg({ quality: 70 }).toBuffer();

/** Adds the summer card to the hollow's first deployment and names roster bucks on sits; answers the rows written. */
export async function seedDemoCameraSites(firm: Firm): Promise<number> {
  const property = await Property.findOne({ where: { firmId: firm.id, name: 'Kettle Hollow Farm' } });
  if (!property) return 0;
  let written = 0;
  const summer = await CameraDeployment.findOne({ where: { firmId: firm.id, propertyId: property.id, notes: 'Summer on the hollow trail' } });
  if (summer && (await CameraPhoto.count({ where: { deploymentId: summer.id } })) === 0) {
    const zone = firm.timezone || 'America/Chicago';
    for (const [i, [day, time, tag]] of SUMMER_CARD.entries()) {
      const cameraTime = `${addDays(summer.startedOn, day)}T${time}:00`;
      await seedPhoto(summer, zone, {
        bytes: await tile(i),
        originalName: `SUMMER_${String(i + 1).padStart(4, '0')}.JPG`,
        cameraTime,
        tag,
      });
      written++;
    }
  }
  // The ridge sits that saw a buck name the one the hunter could tell apart.
  const wide = await Buck.findOne({ where: { propertyId: property.id, name: 'Wide eight' } });
  if (wide) {
    const sits = await Sit.findAll({ where: { propertyId: property.id, bucks: { [Op.gt]: 0 }, idempotencyKey: { [Op.like]: 'demo-sit-%' } } });
    for (const sit of sits) {
      if (sit.buckIds.length) continue;
      await sit.update({ buckIds: [wide.id] });
      written++;
    }
  }
  return written;
}
