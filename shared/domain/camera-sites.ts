/**
 * Camera numbers per site: a camera-site unit may hold several deployments over a season (a camera
 * moved in, a second camera beside the first, a camera swapped after a card pull). The site's
 * numbers add them up:
 *
 * - camera-nights at a site = the sum of each deployment's nights (`cameraNights` in camera-events.ts:
 *   set Oct 1, taken down Oct 22 → 21 nights), so two cameras side by side count two camera-nights a night;
 * - independent events are grouped over all the site's photos together (one animal in front of two
 *   cameras within the gap is one event), per kind, as `groupEvents` does for one deployment;
 * - events per 100 camera-nights = events ÷ camera-nights × 100, per kind;
 * - activity by hour: events of a kind by the hour (0–23) they started, on the firm's clock.
 *
 * Summing effort over deployments and expressing detections per 100 trap-nights is common practice
 * in camera-trap work (no single source); the 30-minute event gap's source is in camera-events.ts.
 */
import { zonedReading } from './clock';
import { activitySummary, cameraNights, eventsPer100CameraNights, groupEvents, type CameraEvent, type EventKind, type TaggedPhoto } from './camera-events';

/** Kinds of independent events, in the order the summary shows them. */
export const EVENT_KINDS: readonly EventKind[] = ['deer', 'other-species', 'person'];

/** One deployment's running days at a site: from the day it was set to its end (taken down, last pull, or today). */
export interface SiteDeploymentSpan {
  startedOn: string;
  endOn: string;
}

/** One camera site's deployments and their usable (timed, in range) photos. */
export interface SiteInput {
  unitId: number;
  deployments: readonly SiteDeploymentSpan[];
  photos: readonly TaggedPhoto[];
  /** The site's position [lon, lat], for the deer events' share in daylight; null when unknown. */
  position: [number, number] | null;
}

/** A camera site's numbers over all its deployments. */
export interface SiteSummary {
  unitId: number;
  deploymentCount: number;
  cameraNights: number;
  eventsByKind: Record<EventKind, number>;
  /** Events per 100 camera-nights, per kind (null when the site ran no night). */
  per100ByKind: Record<EventKind, number | null>;
  /** Events of each kind by the hour (0–23, firm's zone) they started. */
  byHour: Record<EventKind, number[]>;
  /** Share (0–1) of deer events between sunrise and sunset; null without deer events or a position. */
  deerDaylightShare: number | null;
}

/** Camera-nights of a site: the sum of each deployment's nights (a deployment ending before it starts counts 0). */
export function siteCameraNights(deployments: readonly SiteDeploymentSpan[]): number {
  return deployments.reduce((sum, d) => sum + (d.endOn < d.startedOn ? 0 : cameraNights(d.startedOn, d.endOn)), 0);
}

/** Events of one kind by the hour of the firm's day (24 counts, 0 = midnight to 1 am) they started in `zone`. */
export function hourlyActivity(events: readonly CameraEvent[], zone: string, kind: EventKind): number[] {
  const hours = Array.from({ length: 24 }, () => 0);
  for (const e of events) if (e.kind === kind) hours[zonedReading(new Date(e.startedAt), zone).hour % 24] += 1;
  return hours;
}

/** Each site's camera-nights, events by kind, events per 100 camera-nights and activity by hour (file header). */
export function summarizeSite(site: SiteInput, gapMinutes: number, zone: string): SiteSummary {
  const events = groupEvents(site.photos, gapMinutes);
  const nights = siteCameraNights(site.deployments);
  const eventsByKind = { deer: 0, 'other-species': 0, person: 0 } as Record<EventKind, number>;
  for (const e of events) eventsByKind[e.kind] += 1;
  const per100ByKind = {} as Record<EventKind, number | null>;
  const byHour = {} as Record<EventKind, number[]>;
  for (const k of EVENT_KINDS) {
    per100ByKind[k] = eventsPer100CameraNights(eventsByKind[k], nights);
    byHour[k] = hourlyActivity(events, zone, k);
  }
  const deerDaylightShare = site.position ? activitySummary(events, zone, site.position[1], site.position[0]).daylightShare : null;
  return { unitId: site.unitId, deploymentCount: site.deployments.length, cameraNights: nights, eventsByKind, per100ByKind, byHour, deerDaylightShare };
}
