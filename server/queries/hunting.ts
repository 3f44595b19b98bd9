/** Reads for the hunting planner: the plan's layout with stand details, the stand winds, the wind record and pressure. */
import { Op } from 'sequelize';
import type { Point } from 'geojson';
import type { SessionUser } from '../../shared/schemas/auth';
import { Client, Firm, Property, Sit, StandSite, Unit, WindRecord } from '../models';
import { readableProperty } from '../services/results/results-reader';
import { readUnitRows } from '../services/plan/plan-reader';
import { stripCrs } from '../presenters/geojson';
import { usableZone, todayInZone } from '../services/clock';
import { accessRouteWarnings, huntableShare, huntingSettings, judgeStandWinds, type HuntingSettings, type LayoutUnit, type StandWinds, type WindName } from '../../shared/domain/stand-winds';
import { standPressure, type StandPressure } from '../../shared/domain/pressure';
import { seasonRange } from '../../shared/domain/season-results';
import { huntingSeasonOf } from '../../shared/domain/survey-estimates';
import { centroidOf } from '../../shared/domain/geometry';
import { HUNTING_CAUTIONS } from '../../shared/domain/hunting-cautions';
import type { StandType } from '../../shared/domain/unit-kinds';
import type { StandWindsRow, WindRecordDto } from '../../shared/schemas/hunting';
import { presentWindRecord } from '../presenters/hunting';

/** The kinds the planner's map draws. */
const LAYOUT_KINDS: LayoutUnit['kind'][] = ['bedding-area', 'sanctuary', 'food-plot', 'access-route', 'stand-site'];

export interface HuntingLayout {
  property: Property;
  units: LayoutUnit[];
  stands: (LayoutUnit & { detail: StandSite | null })[];
  settings: HuntingSettings;
  zone: string;
}

/** The property (as the person may read it), its units and stand details, and the firm's planner settings. */
export async function readHuntingLayout(me: SessionUser, propertyId: number): Promise<HuntingLayout> {
  return layoutOf(await readableProperty(me, propertyId));
}

/** The layout of a property already loaded through its firm (jobs and documents, which have no person's session). */
export async function layoutOf(property: Property): Promise<HuntingLayout> {
  const [rows, firm] = await Promise.all([readUnitRows(property.id), Firm.findByPk(property.firmId, { attributes: ['id', 'settings', 'timezone'] })]);
  const standIds = rows.filter((u) => u.kind === 'stand-site').map((u) => u.id);
  const details = standIds.length ? await StandSite.findAll({ where: { firmId: property.firmId, unitId: standIds } }) : [];
  const units: LayoutUnit[] = rows.map((u) => ({ id: u.id, name: u.name, kind: u.kind, geometry: stripCrs(u.geometry) }));
  const byUnit = new Map(details.map((d) => [d.unitId, d]));
  const stands = units.filter((u) => u.kind === 'stand-site' && u.geometry.type === 'Point').map((u) => ({ ...u, detail: byUnit.get(u.id) ?? null }));
  return { property, units, stands, settings: huntingSettings(firm?.settings), zone: usableZone(firm?.timezone) };
}

/** The 16-wind judgement of every stand of the layout. */
export function standWindsOf(layout: HuntingLayout): StandWinds[] {
  return judgeStandWinds(
    layout.stands.map((s) => ({ id: s.id, name: s.name, geometry: s.geometry as Point, watchedUnitId: s.detail?.watchedUnitId ?? null, approachFrom: (s.detail?.approachFrom as WindName | null) ?? null })),
    layout.units,
    layout.settings,
  );
}

/** `GET /api/properties/:id/stand-winds`: every stand's winds with reasons and huntable share, the route checks and cautions. */
export async function readStandWinds(me: SessionUser, propertyId: number) {
  const layout = await readHuntingLayout(me, propertyId);
  const record = await WindRecord.findByPk(layout.property.id);
  const client = me.role === 'client' && me.clientId ? await Client.findOne({ where: { id: me.clientId, firmId: me.firmId }, attributes: ['id', 'portalSitsAllowed'] }) : null;
  const mayLogSits = me.role === 'owner' || me.role === 'consultant' || Boolean(client?.portalSitsAllowed);
  const rose = record ? (record.rose as { from: WindName; share: number }[]) : null;
  const details = new Map(layout.stands.map((s) => [s.id, s.detail]));
  const data: StandWindsRow[] = standWindsOf(layout).map((s) => {
    const d = details.get(s.unitId) ?? null;
    return {
      unitId: s.unitId,
      name: s.name,
      standType: (d?.standType as StandType | null) ?? null,
      heightFt: d?.heightFt ?? null,
      watchedUnitId: d?.watchedUnitId ?? null,
      approachFrom: (d?.approachFrom as WindName | null) ?? null,
      routeIds: s.routeIds,
      winds: s.winds,
      huntableShare: rose ? huntableShare(s.winds, rose) : null,
    };
  });
  return {
    data,
    meta: {
      settings: layout.settings,
      routeWarnings: accessRouteWarnings(layout.units, layout.settings),
      cautions: [...HUNTING_CAUTIONS],
      hasWindRecord: Boolean(record),
      mayLogSits,
      layout: layout.units.filter((u) => LAYOUT_KINDS.includes(u.kind)),
      boundary: layout.property.boundary ? stripCrs(layout.property.boundary) : null,
    },
  };
}

/** The property's wind record, or null. */
export async function readWindRecord(me: SessionUser, propertyId: number): Promise<WindRecordDto | null> {
  const property = await readableProperty(me, propertyId);
  const record = await WindRecord.findByPk(property.id);
  return record ? presentWindRecord(record) : null;
}

/** Where sun times are computed for a property: its boundary's centre, else its units' centre. */
export function propertyCenter(layout: HuntingLayout): { lat: number; lon: number } | null {
  if (layout.property.boundary) return centroidOf(stripCrs(layout.property.boundary));
  const first = layout.units[0];
  return first ? centroidOf(first.geometry) : null;
}

/** Pressure on every stand in a season (default: the current one in the firm's zone). */
export async function readPressure(me: SessionUser, propertyId: number, season?: number): Promise<{ rows: StandPressure[]; season: number; maxSitsPerWeek: number }> {
  const layout = await readHuntingLayout(me, propertyId);
  const today = todayInZone(layout.zone);
  const theSeason = season ?? huntingSeasonOf(today);
  const range = seasonRange(theSeason);
  const sits = await Sit.findAll({
    where: { propertyId: layout.property.id, firmId: me.firmId, startedAt: { [Op.gte]: new Date(`${range.startsOn}T00:00:00Z`), [Op.lt]: new Date(`${theSeason + 1}-07-02T00:00:00Z`) } },
    order: [['startedAt', 'ASC']],
  });
  const winds = standWindsOf(layout);
  const rows = standPressure(
    winds.map((w) => ({ unitId: w.unitId, name: w.name, winds: w.winds })),
    sits.map((s) => ({ standUnitId: s.standUnitId, startedAt: s.startedAt, endedAt: s.endedAt, windFrom: (s.windFrom as WindName | null) ?? null, bucks: s.bucks, does: s.does, fawns: s.fawns })),
    today,
    layout.zone,
    layout.settings.maxSitsPerWeek,
  );
  return { rows, season: theSeason, maxSitsPerWeek: layout.settings.maxSitsPerWeek };
}

/** The property's sits, newest first (up to `limit`), with the stand's name and whether the wind suited it. */
export async function readSits(me: SessionUser, propertyId: number, limit = 200) {
  const layout = await readHuntingLayout(me, propertyId);
  const sits = await Sit.findAll({ where: { propertyId: layout.property.id, firmId: me.firmId }, order: [['startedAt', 'DESC']], limit });
  return { sits, layout, winds: standWindsOf(layout) };
}

/** Unit ids of a property by id, for checks. */
export async function unitOfProperty(firmId: number, propertyId: number, unitId: number): Promise<Unit | null> {
  return Unit.findOne({ where: { id: unitId, propertyId, firmId } });
}

/** Stands sat more than the firm's weekly limit in the seven days up to today, on the properties the person may read. */
export async function readPressureWarnings(me: SessionUser) {
  const firm = await Firm.findByPk(me.firmId, { attributes: ['id', 'settings', 'timezone'] });
  const settings = huntingSettings(firm?.settings);
  const zone = usableZone(firm?.timezone);
  const today = todayInZone(zone);
  const propertyWhere = me.role === 'client' ? { firmId: me.firmId, clientId: me.clientId ?? -1 } : { firmId: me.firmId };
  const properties = await Property.findAll({ where: propertyWhere, attributes: ['id', 'name'] });
  if (properties.length === 0) return [];
  const sits = await Sit.findAll({ where: { firmId: me.firmId, propertyId: properties.map((p) => p.id), startedAt: { [Op.gte]: new Date(Date.now() - 9 * 86400_000) } }, attributes: ['standUnitId', 'propertyId', 'startedAt', 'endedAt'] });
  const standIds = [...new Set(sits.map((s) => s.standUnitId))];
  if (standIds.length === 0) return [];
  const stands = await Unit.findAll({ where: { id: standIds, firmId: me.firmId }, attributes: ['id', 'name', 'propertyId'] });
  const rows = standPressure(
    stands.map((s) => ({ unitId: s.id, name: s.name, winds: [] })),
    sits.map((s) => ({ standUnitId: s.standUnitId, startedAt: s.startedAt, endedAt: s.endedAt, windFrom: null, bucks: 0, does: 0, fawns: 0 })),
    today,
    zone,
    settings.maxSitsPerWeek,
  );
  const names = new Map(properties.map((p) => [p.id, p.name]));
  const propertyOf = new Map(stands.map((s) => [s.id, s.propertyId]));
  return rows
    .filter((r) => r.overPressured)
    .map((r) => {
      const pid = propertyOf.get(r.unitId)!;
      return {
        propertyId: pid,
        propertyName: names.get(pid) ?? '',
        unitId: r.unitId,
        name: r.name,
        sitsThisWeek: r.sitsThisWeek,
        maxSitsPerWeek: settings.maxSitsPerWeek,
        message: `“${r.name}” was sat ${r.sitsThisWeek} times in the last 7 days (more than ${settings.maxSitsPerWeek}): rest it so deer do not learn to avoid it.`,
      };
    });
}
