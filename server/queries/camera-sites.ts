/**
 * A property's camera sites with their numbers summed over every deployment at each site:
 * camera-nights, independent events by kind, events per 100 camera-nights and activity by hour
 * (computed by `summarizeSite` in shared/domain/camera-sites.ts). Three queries, firm-scoped.
 */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { cameraSettings } from './camera-fleet';
import { summarizeSite } from '../../shared/domain/camera-sites';
import type { CameraTag, TaggedPhoto } from '../../shared/domain/camera-events';
import type { CameraSitesAnswer } from '../../shared/schemas/cameras';

const select = <T extends object>(sql: string, replacements: Record<string, unknown>) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

/** Every camera site of the property that has had a deployment, by name; `today` is the firm's today. */
export async function cameraSiteSummaries(firmId: number, propertyId: number, today: string): Promise<CameraSitesAnswer> {
  const { eventGapMinutes, zone } = await cameraSettings(firmId);
  // A deployment ran until it was taken down, else until its last card pull (photos after it are not in yet), else until today.
  const deployments = await select<{ id: number; unit_id: number; unit_name: string; started_on: string; end_on: string; lon: number | null; lat: number | null }>(
    `SELECT d.id, d.unit_id, u.name AS unit_name, d.started_on::text AS started_on,
            COALESCE(d.ended_on, (SELECT max(pulled_on) FROM card_pulls cp WHERE cp.deployment_id = d.id), :today::date)::text AS end_on,
            ST_X(ST_PointOnSurface(u.geometry)) AS lon, ST_Y(ST_PointOnSurface(u.geometry)) AS lat
     FROM camera_deployments d JOIN units u ON u.id = d.unit_id
     WHERE d.firm_id = :firmId AND d.property_id = :propertyId
     ORDER BY u.name, d.started_on`,
    { firmId, propertyId, today },
  );
  if (deployments.length === 0) return { data: [], meta: { gapMinutes: eventGapMinutes, timezone: zone } };
  const photos = await select<{ id: number; unit_id: number; taken_at: Date; tag: CameraTag | null; buck_id: number | null }>(
    `SELECT ph.id, d.unit_id, ph.taken_at, ph.tag, ph.buck_id
     FROM camera_photos ph JOIN camera_deployments d ON d.id = ph.deployment_id
     WHERE d.firm_id = :firmId AND d.property_id = :propertyId AND ph.taken_at IS NOT NULL AND ph.tag IS NOT NULL
       AND NOT (ph.flags @> '["time-out-of-range"]'::jsonb)`,
    { firmId, propertyId },
  );
  const sites = new Map<number, { name: string; position: [number, number] | null; spans: { startedOn: string; endOn: string }[]; photos: TaggedPhoto[] }>();
  for (const d of deployments) {
    const site = sites.get(d.unit_id) ?? { name: d.unit_name, position: d.lon !== null && d.lat !== null ? [Number(d.lon), Number(d.lat)] : null, spans: [], photos: [] };
    site.spans.push({ startedOn: d.started_on, endOn: d.end_on });
    sites.set(d.unit_id, site);
  }
  for (const p of photos) sites.get(p.unit_id)?.photos.push({ id: p.id, takenAt: new Date(p.taken_at), tag: p.tag, buckId: p.buck_id });
  const data = [...sites.entries()].map(([unitId, s]) => {
    const summary = summarizeSite({ unitId, deployments: s.spans, photos: s.photos, position: s.position }, eventGapMinutes, zone);
    return {
      unitId,
      name: s.name,
      deploymentCount: summary.deploymentCount,
      cameraNights: summary.cameraNights,
      eventsByKind: summary.eventsByKind,
      eventsPer100CameraNights: summary.per100ByKind,
      byHour: summary.byHour,
      deerDaylightShare: summary.deerDaylightShare,
    };
  });
  return { data, meta: { gapMinutes: eventGapMinutes, timezone: zone } };
}
