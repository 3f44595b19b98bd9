/** Makes and revokes a worker's private calendar feeds, each with its audit record. */
import crypto from 'node:crypto';
import { sequelize } from '../db/sequelize';
import { CalendarFeed } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import { config } from '../config';
import { hashFeedToken } from '../services/tasks/calendar-feed';
import { notFound } from '../errors';
import { recordAudit } from './audit-recorder';

/** Makes a new feed for the actor; the answer holds the only copy of its secret URL (the database keeps only a hash). */
export async function createCalendarFeed(me: SessionUser, ip: string | null): Promise<{ feed: CalendarFeed; url: string }> {
  const token = crypto.randomBytes(24).toString('base64url');
  const feed = await sequelize.transaction(async (transaction) => {
    const created = await CalendarFeed.create({ userId: me.id, firmId: me.firmId, tokenHash: hashFeedToken(token) }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'calendar-feed.created', subjectType: 'CalendarFeed', subjectId: created.id, ip }, transaction);
    return created;
  });
  return { feed, url: `${config.publicUrl}/api/calendar/${token}.ics` };
}

/** Revokes one of the actor's own live feeds (404 for any other); its address stops answering at once. */
export async function revokeCalendarFeed(me: SessionUser, feedId: number, ip: string | null): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const feed = await CalendarFeed.findOne({ where: { id: feedId, userId: me.id, firmId: me.firmId, revokedAt: null }, transaction, lock: transaction.LOCK.UPDATE });
    if (!feed) throw notFound('That calendar feed');
    await feed.update({ revokedAt: new Date() }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'calendar-feed.revoked', subjectType: 'CalendarFeed', subjectId: feed.id, ip }, transaction);
  });
}
