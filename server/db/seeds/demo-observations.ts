/**
 * Sign logged on Kettle Hollow Farm over the 2025–26 season, all invented: rubs and scrapes along
 * the edges in the fall, beds and trails, a shed in late winter, standing water and a thin plot in
 * spring. Positions are drawn inside the farm's area units by PostGIS (ST_GeneratePoints with a fixed
 * seed, so every run places them the same). Idempotent: does nothing when the farm has observations.
 */
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../sequelize';
import { Observation, Property, Unit, User, type Firm } from '../../models';
import type { ObservationKind } from '../../../shared/domain/observations';

/** [kind, month (YYYY-MM), how many, note]. */
const PLAN: [ObservationKind, string, number, string | null][] = [
  ['rub', '2025-09', 3, 'Fresh rub on a cedar, wrist height'],
  ['rub', '2025-10', 5, null],
  ['scrape', '2025-10', 4, 'Licking branch above, pawed bare'],
  ['scrape', '2025-11', 6, null],
  ['bed', '2025-11', 3, 'Beds on the south slope, out of the wind'],
  ['trail', '2025-10', 2, null],
  ['tracks', '2025-12', 3, 'Tracks in fresh snow crossing toward the plot'],
  ['browse', '2026-01', 3, 'Heavy browse on the regrowth'],
  ['droppings', '2026-01', 2, null],
  ['shed', '2026-03', 2, 'Left side of a mature eight'],
  ['standing-water', '2026-04', 2, 'Water standing after the spring rains'],
  ['thin-stand', '2026-05', 2, 'Clover came up thin on the west end'],
  ['invasive-plants', '2026-06', 1, 'Autumn olive along the fence line'],
];

/** Adds the demo observations to Kettle Hollow Farm (once). */
export async function seedDemoObservations(firm: Firm, transaction: Transaction): Promise<void> {
  const property = await Property.findOne({ where: { firmId: firm.id, name: 'Kettle Hollow Farm' }, transaction });
  if (!property) return;
  if (await Observation.count({ where: { propertyId: property.id }, transaction })) return;
  const units = (await Unit.findAll({ where: { propertyId: property.id }, transaction, order: [['id', 'ASC']] })).filter((u) => u.geometry.type === 'Polygon' || u.geometry.type === 'MultiPolygon');
  if (units.length === 0) return;
  const crew = await User.findOne({ where: { firmId: firm.id, email: 'crew@browseline.test' }, transaction });
  let n = 0;
  for (const [kind, month, count, note] of PLAN) {
    for (let i = 0; i < count; i++) {
      n += 1;
      const unit = units[(n * 7) % units.length];
      const [point] = await sequelize.query<{ lon: number; lat: number }>(
        'SELECT ST_X(g) AS lon, ST_Y(g) AS lat FROM (SELECT (ST_Dump(ST_GeneratePoints(geometry, 1, $2))).geom AS g FROM units WHERE id = $1) p',
        { bind: [unit.id, n], type: QueryTypes.SELECT, transaction },
      );
      if (!point) continue;
      const day = String(1 + ((n * 5) % 27)).padStart(2, '0');
      const hour = 6 + ((n * 3) % 11);
      await Observation.create(
        {
          firmId: firm.id,
          propertyId: property.id,
          unitId: unit.id,
          kind,
          observedAt: new Date(`${month}-${day}T${String(hour).padStart(2, '0')}:15:00-05:00`),
          notes: i === 0 ? note : null,
          position: { type: 'Point', coordinates: [Number(point.lon), Number(point.lat)] },
          positionSource: n % 3 === 0 ? 'photo' : 'device',
          insideBoundary: true,
          idempotencyKey: `demo-observation-${n}`,
          createdById: crew?.id ?? null,
        },
        { transaction },
      );
    }
  }
}
