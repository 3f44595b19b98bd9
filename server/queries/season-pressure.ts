/** The season report's pressure section: sits, hours and deer seen per stand in a season, with the harvests taken from each stand. */
import { Op, type Transaction } from 'sequelize';
import { HarvestRecord, Property, Sit } from '../models';
import { notFound } from '../errors';
import { layoutOf, standWindsOf } from './hunting';
import { standPressure } from '../../shared/domain/pressure';
import { seasonRange } from '../../shared/domain/season-results';
import { todayIn } from '../../shared/domain/clock';
import type { WindName } from '../../shared/domain/stand-winds';
import type { SeasonReportPressure } from '../../templates/documents/season-report';

/**
 * Pressure and sits of a property's hunting season (July–June, sit days in the firm's zone): one row
 * per stand site, the season's totals and how many harvests carry a disease-sampling number.
 */
export async function buildSeasonPressure(firmId: number, propertyId: number, season: number, transaction?: Transaction): Promise<SeasonReportPressure> {
  const property = await Property.findOne({ where: { id: propertyId, firmId }, transaction });
  if (!property) throw notFound('That property');
  const layout = await layoutOf(property);
  const range = seasonRange(season);
  // A day's margin either side of the UTC bounds, then the exact cut by the sit's day in the firm's zone.
  const rows = await Sit.findAll({
    where: { firmId, propertyId, startedAt: { [Op.gte]: new Date(Date.parse(`${range.startsOn}T00:00:00Z`) - 86400_000), [Op.lt]: new Date(Date.parse(`${range.endsOn}T00:00:00Z`) + 2 * 86400_000) } },
    order: [['startedAt', 'ASC']],
    transaction,
  });
  const sits = rows
    .filter((s) => {
      const day = todayIn(layout.zone, s.startedAt);
      return day >= range.startsOn && day <= range.endsOn;
    })
    .map((s) => ({ standUnitId: s.standUnitId, startedAt: s.startedAt, endedAt: s.endedAt, windFrom: (s.windFrom as WindName | null) ?? null, bucks: s.bucks, does: s.does, fawns: s.fawns }));
  const harvests = await HarvestRecord.findAll({ where: { firmId, propertyId, season }, attributes: ['id', 'standUnitId', 'diseaseSampleNumber'], transaction });
  const winds = standWindsOf(layout);
  const pressure = standPressure(winds.map((w) => ({ unitId: w.unitId, name: w.name, winds: w.winds })), sits, range.endsOn, layout.zone, layout.settings.maxSitsPerWeek);
  const stands = pressure.map((p) => ({
    name: p.name,
    sits: p.sits,
    hours: p.hours,
    deerSeen: sits.filter((s) => s.standUnitId === p.unitId).reduce((n, s) => n + s.bucks + s.does + s.fawns, 0),
    deerPerHour: p.deerPerHour,
    sitsOnUnsuitableWind: p.sitsOnUnsuitableWind,
    harvests: harvests.filter((h) => h.standUnitId === p.unitId).length,
  }));
  const hours = sits.reduce((n, s) => n + (s.endedAt.getTime() - s.startedAt.getTime()) / 3600_000, 0);
  return {
    stands,
    totals: { sits: sits.length, hours: Math.round(hours * 100) / 100, deerSeen: stands.reduce((n, s) => n + s.deerSeen, 0) },
    sampledHarvests: harvests.filter((h) => h.diseaseSampleNumber).length,
  };
}
