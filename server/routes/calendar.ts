/** Calendar feeds: a signed-in worker makes, lists and revokes their private feed URLs; calendar apps read the feed by its secret token. */
import { defineRoutes } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { CalendarFeed } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { actor } from '../policies/firm-scope';
import { calendarForToken } from '../services/tasks/calendar-feed';
import { createCalendarFeed, revokeCalendarFeed } from '../commands/calendar-feed-writer';
import type { CalendarFeedDto } from '../../shared/schemas/task';
import { notFound } from '../errors';

const feeds = defineRoutes('/calendar-feeds');
const publicFeed = defineRoutes('/calendar');
const WORKERS = ['owner', 'consultant', 'crew'] as const;

const dto = (f: CalendarFeed, url?: string): CalendarFeedDto => ({ id: f.id, createdAt: f.createdAt.toISOString(), lastUsedAt: f.lastUsedAt?.toISOString() ?? null, ...(url ? { url } : {}) });

feeds.get('/', WORKERS, async (req, res) => {
  const me = actor(req);
  const rows = await CalendarFeed.findAll({ where: { userId: me.id, firmId: me.firmId, revokedAt: null }, order: [['createdAt', 'DESC']] });
  res.json({ data: rows.map((f) => dto(f)) });
});

feeds.post('/', WORKERS, async (req, res) => {
  const me = actor(req);
  const { feed, url } = await createCalendarFeed(me, req.ip ?? null);
  res.status(201).json({ data: dto(feed, url) });
});

feeds.delete('/:id', WORKERS, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await revokeCalendarFeed(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

/** The feed itself: public, but only to whoever holds the unguessable token (192 random bits). */
publicFeed.get('/:file', 'public', async (req, res) => {
  const match = /^([A-Za-z0-9_-]{20,64})\.ics$/.exec(String(req.params.file));
  const text = match ? await calendarForToken(match[1]) : null;
  if (!text) throw notFound('That calendar feed (it may have been revoked)');
  res.setHeader('Content-Type', 'text/calendar; charset=utf-8');
  res.setHeader('Cache-Control', 'private, no-store');
  res.setHeader('X-Robots-Tag', 'noindex');
  res.send(text);
});

export const calendarFeedsRouter = feeds.router;
export const calendarRouter = publicFeed.router;
