/**
 * The hunting planner on Kettle Hollow Farm: what each stand watches, a walk-in to the hollow stand,
 * an invented fall wind record typed as 16-wind shares, sits over the last two weeks (the ridge stand
 * sat three times this week, so the Desk and the portal warn), and sit logging turned on for the
 * landowner's family. Idempotent: it writes only what is missing.
 */
import type { Transaction } from 'sequelize';
import { Client, Firm, Property, Sit, StandSite, Unit, WindRecord } from '../../models';
import { measureUnit } from '../../../shared/domain/geometry';
import { normalizeSectors } from '../../../shared/domain/wind-record';

const HOLLOW_ROUTE = 'South walk-in to hollow stand';

/** Writes the demo's stands, wind record and sits; answers how many rows were written. */
export async function seedDemoHunting(firm: Firm, transaction?: Transaction): Promise<number> {
  const property = await Property.findOne({ where: { firmId: firm.id, name: 'Kettle Hollow Farm' }, transaction });
  if (!property) return 0;
  let written = 0;
  if (!(await Unit.findOne({ where: { propertyId: property.id, name: HOLLOW_ROUTE }, transaction }))) {
    const geometry = { type: 'LineString' as const, coordinates: [[-90.9313, 43.27], [-90.9326, 43.2693], [-90.9338, 43.2692], [-90.9344, 43.2695]] };
    const m = measureUnit('access-route', geometry);
    await Unit.create({ firmId: firm.id, propertyId: property.id, kind: 'access-route', name: HOLLOW_ROUTE, notes: 'Along the field edge, below the plot.', geometry, acres: m.acres, perimeterFt: m.perimeterFt, lengthFt: m.lengthFt }, { transaction });
    written++;
  }
  const units = await Unit.findAll({ where: { propertyId: property.id }, attributes: ['id', 'name', 'kind'], transaction });
  const id = (name: string) => units.find((u) => u.name === name)?.id ?? null;
  const stands = [
    { name: 'Ridge stand', watched: 'Ridge clover plot', standType: 'ladder', heightFt: 15, approachFrom: 'S' },
    { name: 'Hollow stand', watched: 'Hollow brassica plot', standType: 'hang-on', heightFt: 20, approachFrom: null },
  ];
  for (const s of stands) {
    const unitId = id(s.name);
    if (!unitId || (await StandSite.findByPk(unitId, { transaction }))) continue;
    await StandSite.create({ unitId, firmId: firm.id, watchedUnitId: id(s.watched), standType: s.standType, heightFt: s.heightFt, approachFrom: s.approachFrom }, { transaction });
    written++;
  }
  if (!(await WindRecord.findByPk(property.id, { transaction }))) {
    // Invented fall shares for the demo (prevailing north-west and south winds), not observations.
    const rose = normalizeSectors([
      { from: 'N', share: 6 }, { from: 'NNE', share: 3 }, { from: 'NE', share: 3 }, { from: 'ENE', share: 2 },
      { from: 'E', share: 3 }, { from: 'ESE', share: 3 }, { from: 'SE', share: 5 }, { from: 'SSE', share: 7 },
      { from: 'S', share: 10 }, { from: 'SSW', share: 8 }, { from: 'SW', share: 7 }, { from: 'WSW', share: 6 },
      { from: 'W', share: 9 }, { from: 'WNW', share: 10 }, { from: 'NW', share: 11 }, { from: 'NNW', share: 7 },
    ]);
    await WindRecord.create({ propertyId: property.id, firmId: firm.id, source: 'sectors', fileName: null, months: [], hoursFilter: 'typed', rose, hours: 0, calmHours: 0, skippedRows: 0, createdById: null }, { transaction });
    written++;
  }
  if ((await Sit.count({ where: { propertyId: property.id }, transaction })) === 0) {
    const ridge = id('Ridge stand');
    const hollow = id('Hollow stand');
    const day = 86400_000;
    const now = Date.now();
    const sits = [
      { stand: hollow, daysAgo: 12, hours: 3, wind: 'NW', seen: [0, 4, 2] },
      { stand: ridge, daysAgo: 9, hours: 2.5, wind: 'W', seen: [1, 2, 1] },
      { stand: ridge, daysAgo: 5, hours: 3, wind: 'NW', seen: [1, 3, 0] },
      { stand: ridge, daysAgo: 3, hours: 2, wind: 'S', seen: [0, 1, 0] },
      { stand: ridge, daysAgo: 1, hours: 2.5, wind: 'WNW', seen: [0, 0, 0] },
    ];
    for (const [i, s] of sits.entries()) {
      if (!s.stand) continue;
      const start = new Date(now - s.daysAgo * day - 4 * 3600_000);
      await Sit.create(
        { firmId: firm.id, propertyId: property.id, standUnitId: s.stand, startedAt: start, endedAt: new Date(start.getTime() + s.hours * 3600_000), windFrom: s.wind, windMph: 6, bucks: s.seen[0]!, does: s.seen[1]!, fawns: s.seen[2]!, notes: null, loggedById: null, idempotencyKey: `demo-sit-${property.id}-${i}` },
        { transaction },
      );
      written++;
    }
  }
  const client = await Client.findByPk(property.clientId, { transaction });
  if (client && !client.portalSitsAllowed) await client.update({ portalSitsAllowed: true }, { transaction });
  return written;
}
