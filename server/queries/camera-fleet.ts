/**
 * Reads of the camera fleet: cameras with their running deployment, deployments with their pulls
 * and photo counts, the deployments due for a card pull, a deployment's photos, events and the
 * property's buck roster. Every read is scoped by the firm.
 */
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Buck, CameraDeployment, CameraPhoto, Firm } from '../models';
import { notFound } from '../errors';
import { buckFields, presentCameraPhoto } from '../presenters/camera';
import { usableZone } from '../services/clock';
import { activitySummary, cameraNights, DEFAULT_EVENT_GAP_MINUTES, DEFAULT_PULL_INTERVAL_DAYS, eventsPer100CameraNights, groupEvents } from '../../shared/domain/camera-events';
import type { BuckDto, CameraDto, CameraPhotoDto, CardPullDto, DeploymentDto, DeploymentEventsDto, DuePullDto } from '../../shared/schemas/cameras';
import type { CameraTag } from '../../shared/domain/camera-events';

const select = <T extends object>(sql: string, replacements: Record<string, unknown>, transaction?: Transaction) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });

/** The firm's camera settings: the card-pull interval (days) and the event gap (minutes). */
export async function cameraSettings(firmId: number, transaction?: Transaction): Promise<{ pullIntervalDays: number; eventGapMinutes: number; zone: string }> {
  const firm = await Firm.findByPk(firmId, { attributes: ['settings', 'timezone'], transaction });
  const s = (firm?.settings ?? {}) as { cardPullIntervalDays?: number; eventGapMinutes?: number };
  return {
    pullIntervalDays: typeof s.cardPullIntervalDays === 'number' ? s.cardPullIntervalDays : DEFAULT_PULL_INTERVAL_DAYS,
    eventGapMinutes: typeof s.eventGapMinutes === 'number' ? s.eventGapMinutes : DEFAULT_EVENT_GAP_MINUTES,
    zone: usableZone(firm?.timezone),
  };
}

/** The firm's cameras, each with its running deployment. */
export async function listCameras(firmId: number): Promise<CameraDto[]> {
  const rows = await select<{ id: number; label: string; serial: string | null; retired_at: Date | null; d_id: number | null; property_id: number | null; property_name: string | null; unit_id: number | null; unit_name: string | null; started_on: string | null }>(
    `SELECT c.id, c.label, c.serial, c.retired_at, d.id AS d_id, d.property_id, p.name AS property_name, d.unit_id, u.name AS unit_name, d.started_on
     FROM cameras c
     LEFT JOIN camera_deployments d ON d.camera_id = c.id AND d.ended_on IS NULL
     LEFT JOIN properties p ON p.id = d.property_id
     LEFT JOIN units u ON u.id = d.unit_id
     WHERE c.firm_id = :firmId ORDER BY c.retired_at NULLS FIRST, c.label`,
    { firmId },
  );
  return rows.map((r) => ({
    id: r.id,
    label: r.label,
    serial: r.serial,
    retired: r.retired_at !== null,
    deployment: r.d_id ? { id: r.d_id, propertyId: r.property_id!, propertyName: r.property_name!, unitId: r.unit_id!, unitName: r.unit_name!, startedOn: r.started_on! } : null,
  }));
}

const presentPull = (p: { id: number; deployment_id: number; pulled_on: string; battery_pct: number | null; photo_count: number | null; notes: string | null }): CardPullDto => ({
  id: p.id,
  deploymentId: p.deployment_id,
  pulledOn: p.pulled_on,
  batteryPct: p.battery_pct,
  photoCount: p.photo_count,
  notes: p.notes,
});

/** Deployments of the firm matching `where` (SQL over alias d), with camera, unit, pulls and photo counts. */
async function readDeployments(firmId: number, where: string, replacements: Record<string, unknown>, transaction?: Transaction): Promise<DeploymentDto[]> {
  const rows = await select<{ id: number; camera_id: number; camera_label: string; property_id: number; property_name: string; unit_id: number; unit_name: string; started_on: string; ended_on: string | null; mode: DeploymentDto['mode']; notes: string | null; clock_offset_seconds: number; photo_count: string }>(
    `SELECT d.id, d.camera_id, c.label AS camera_label, d.property_id, p.name AS property_name, d.unit_id, u.name AS unit_name, d.started_on, d.ended_on, d.mode, d.notes, d.clock_offset_seconds,
            (SELECT count(*) FROM camera_photos ph WHERE ph.deployment_id = d.id) AS photo_count
     FROM camera_deployments d JOIN cameras c ON c.id = d.camera_id JOIN properties p ON p.id = d.property_id JOIN units u ON u.id = d.unit_id
     WHERE d.firm_id = :firmId AND ${where} ORDER BY d.ended_on NULLS FIRST, d.started_on DESC, d.id DESC`,
    { firmId, ...replacements },
    transaction,
  );
  if (rows.length === 0) return [];
  const pulls = await select<{ id: number; deployment_id: number; pulled_on: string; battery_pct: number | null; photo_count: number | null; notes: string | null }>(
    `SELECT id, deployment_id, pulled_on, battery_pct, photo_count, notes FROM card_pulls WHERE deployment_id IN (:ids) ORDER BY pulled_on, id`,
    { ids: rows.map((r) => r.id) },
    transaction,
  );
  return rows.map((r) => {
    const own = pulls.filter((p) => p.deployment_id === r.id).map(presentPull);
    return {
      id: r.id,
      cameraId: r.camera_id,
      cameraLabel: r.camera_label,
      propertyId: r.property_id,
      propertyName: r.property_name,
      unitId: r.unit_id,
      unitName: r.unit_name,
      startedOn: r.started_on,
      endedOn: r.ended_on,
      mode: r.mode,
      notes: r.notes,
      clockOffsetSeconds: r.clock_offset_seconds,
      photoCount: Number(r.photo_count),
      lastPulledOn: own.length ? own[own.length - 1].pulledOn : null,
      pulls: own,
    };
  });
}

/** One deployment of the firm (404 otherwise). */
export async function readDeployment(firmId: number, id: number, transaction?: Transaction): Promise<DeploymentDto> {
  const [row] = await readDeployments(firmId, 'd.id = :id', { id }, transaction);
  if (!row) throw notFound('That deployment');
  return row;
}

/** Deployments of one camera, newest first. */
export const listCameraDeployments = (firmId: number, cameraId: number) => readDeployments(firmId, 'd.camera_id = :cameraId', { cameraId });
/** Deployments on one property, running ones first. */
export const listPropertyDeployments = (firmId: number, propertyId: number) => readDeployments(firmId, 'd.property_id = :propertyId', { propertyId });

/**
 * Running deployments whose card was last pulled (or which were set) at least the firm's interval
 * ago, by `today` in the firm's zone; each with the camera's position and the property's access
 * route nearest the camera (distance on the ellipsoid, PostGIS geography).
 */
export async function listDuePulls(firmId: number, today: string, options: { propertyId?: number } = {}): Promise<DuePullDto[]> {
  const { pullIntervalDays } = await cameraSettings(firmId);
  const rows = await select<{ id: number; camera_label: string; property_id: number; property_name: string; unit_id: number; unit_name: string; since: string; days_since: number; due_on: string; lon: number | null; lat: number | null; route_id: number | null; route_name: string | null; route_m: number | null }>(
    `SELECT d.id, c.label AS camera_label, d.property_id, p.name AS property_name, d.unit_id, u.name AS unit_name,
            s.since::text AS since, (:today::date - s.since) AS days_since, (s.since + :days)::text AS due_on,
            ST_X(ST_PointOnSurface(u.geometry)) AS lon, ST_Y(ST_PointOnSurface(u.geometry)) AS lat,
            r.id AS route_id, r.name AS route_name, r.distance_m AS route_m
     FROM camera_deployments d
     JOIN cameras c ON c.id = d.camera_id JOIN properties p ON p.id = d.property_id JOIN units u ON u.id = d.unit_id
     CROSS JOIN LATERAL (SELECT GREATEST(d.started_on, COALESCE((SELECT max(pulled_on) FROM card_pulls cp WHERE cp.deployment_id = d.id), d.started_on)) AS since) s
     LEFT JOIN LATERAL (
       SELECT a.id, a.name, ST_Distance(a.geometry::geography, u.geometry::geography) AS distance_m
       FROM units a WHERE a.property_id = d.property_id AND a.kind = 'access-route'
       ORDER BY a.geometry::geography <-> u.geometry::geography LIMIT 1
     ) r ON true
     WHERE d.firm_id = :firmId AND d.ended_on IS NULL AND (:today::date - s.since) >= :days ${options.propertyId ? 'AND d.property_id = :propertyId' : ''}
     ORDER BY s.since, c.label`,
    { firmId, today, days: pullIntervalDays, propertyId: options.propertyId ?? null },
  );
  return rows.map((r) => ({
    deploymentId: r.id,
    cameraLabel: r.camera_label,
    propertyId: r.property_id,
    propertyName: r.property_name,
    unitId: r.unit_id,
    unitName: r.unit_name,
    since: r.since,
    daysSince: Number(r.days_since),
    dueOn: r.due_on,
    position: r.lon !== null && r.lat !== null ? [Number(r.lon), Number(r.lat)] : null,
    accessRoute: r.route_id ? { id: r.route_id, name: r.route_name!, distanceFt: Math.round(Number(r.route_m) / 0.3048) } : null,
  }));
}

/** A deployment's photos in time order, optionally of one tag (or untagged). */
export async function listDeploymentPhotos(deploymentId: number, query: { tag?: CameraTag | 'untagged'; limit: number; offset: number }): Promise<{ photos: CameraPhotoDto[]; total: number }> {
  const where: Record<string, unknown> = { deploymentId };
  if (query.tag) where.tag = query.tag === 'untagged' ? null : query.tag;
  const { rows, count } = await CameraPhoto.findAndCountAll({ where, order: [['takenAt', 'ASC NULLS LAST'], ['id', 'ASC']], limit: query.limit, offset: query.offset });
  return { photos: rows.map(presentCameraPhoto), total: count };
}

/** A deployment's independent events, camera-nights, rate per 100 camera-nights and activity. */
export async function deploymentEvents(firmId: number, deploymentId: number, today: string): Promise<DeploymentEventsDto> {
  const deployment = await CameraDeployment.findOne({ where: { id: deploymentId, firmId } });
  if (!deployment) throw notFound('That deployment');
  const { eventGapMinutes, zone } = await cameraSettings(firmId);
  const [site] = await select<{ lon: number; lat: number }>(`SELECT ST_X(ST_PointOnSurface(geometry)) AS lon, ST_Y(ST_PointOnSurface(geometry)) AS lat FROM units WHERE id = :id`, { id: deployment.unitId });
  const [lastPull] = await select<{ last: string | null }>(`SELECT max(pulled_on)::text AS last FROM card_pulls WHERE deployment_id = :id`, { id: deploymentId });
  const photos = await CameraPhoto.findAll({ where: { deploymentId }, attributes: ['id', 'takenAt', 'tag', 'buckId', 'flags'], order: [['takenAt', 'ASC']] });
  const timed = photos.filter((p) => p.takenAt !== null && !p.flags.includes('time-out-of-range')).map((p) => ({ id: p.id, takenAt: p.takenAt!, tag: p.tag, buckId: p.buckId }));
  const events = groupEvents(timed, eventGapMinutes);
  // The camera ran until it was taken down, else until its last card pull (photos after it are not in yet), else until today.
  const endOn = deployment.endedOn ?? lastPull?.last ?? today;
  const nights = cameraNights(deployment.startedOn, endOn < deployment.startedOn ? deployment.startedOn : endOn);
  const byKind = { deer: 0, 'other-species': 0, person: 0 };
  for (const e of events) byKind[e.kind] += 1;
  const position: [number, number] | null = site ? [Number(site.lon), Number(site.lat)] : null;
  return {
    events,
    eventCount: byKind.deer,
    eventsByKind: byKind,
    cameraNights: nights,
    eventsPer100CameraNights: eventsPer100CameraNights(byKind.deer, nights),
    gapMinutes: eventGapMinutes,
    activity: activitySummary(events, zone, position ? position[1] : null, position ? position[0] : null),
    position,
  };
}

/** The property's buck roster with photo counts and photos (for a client: only the featured ones). */
export async function listBucks(propertyId: number, options: { featuredOnly: boolean }): Promise<BuckDto[]> {
  const bucks = await Buck.findAll({ where: { propertyId }, order: [['name', 'ASC']] });
  if (bucks.length === 0) return [];
  const photos = await CameraPhoto.findAll({
    where: { buckId: bucks.map((b) => b.id), tag: 'buck', ...(options.featuredOnly ? { featured: true } : {}) },
    attributes: ['id', 'buckId', 'takenAt', 'thumbnailKey', 'featured'],
    order: [['featured', 'DESC'], ['takenAt', 'DESC']],
  });
  return bucks.map((b) => {
    const own = photos.filter((p) => p.buckId === b.id);
    const times = own.map((p) => p.takenAt?.toISOString()).filter((t): t is string => !!t).sort();
    return {
      ...buckFields(b),
      photoCount: own.length,
      firstSeen: times[0] ?? null,
      lastSeen: times[times.length - 1] ?? null,
      photos: own.slice(0, 12).map((p) => ({ id: p.id, takenAt: p.takenAt?.toISOString() ?? null, thumbnailUrl: p.thumbnailKey ? `/api/camera-photos/${p.id}/thumbnail` : null, url: `/api/camera-photos/${p.id}/file`, featured: p.featured })),
    };
  });
}
