/** The crew's private iCalendar (RFC 5545) feed: one all-day event per scheduled task. */
import crypto from 'node:crypto';
import ical, { ICalCalendarMethod } from 'ical-generator';
import { Op } from 'sequelize';
import { CalendarFeed, Firm, Task, User } from '../../models';
import { addDays } from '../../../shared/domain/planting-windows';
import { config } from '../../config';
import { formatDateSpan } from '../../../shared/domain/clock';

/** SHA-256 of a feed token: the database never holds the token itself. */
export const hashFeedToken = (token: string): string => crypto.createHash('sha256').update(token).digest('hex');

/** The calendar text for a feed token, or null when the token is unknown or revoked. */
export async function calendarForToken(token: string): Promise<string | null> {
  const feed = await CalendarFeed.findOne({ where: { tokenHash: hashFeedToken(token), revokedAt: null } });
  if (!feed) return null;
  const [user, firm] = await Promise.all([User.findOne({ where: { id: feed.userId, active: true } }), Firm.findByPk(feed.firmId)]);
  if (!user) return null;
  await feed.update({ lastUsedAt: new Date() });
  const tasks = await Task.findAll({ where: { firmId: feed.firmId, assigneeId: user.id, status: { [Op.in]: ['scheduled', 'planned', 'done'] }, startDate: { [Op.ne]: null } }, order: [['startDate', 'ASC']], limit: 1000 });
  const host = new URL(config.publicUrl).hostname;
  const calendar = ical({ name: `${firm?.name ?? 'Browseline'} — ${user.name}`, prodId: { company: 'Browseline', product: 'work-schedule', language: 'EN' }, method: ICalCalendarMethod.PUBLISH, ttl: 60 * 60 });
  for (const t of tasks) {
    const start = t.startDate as string;
    const end = addDays(t.endDate ?? start, 1); // DTEND of an all-day event is exclusive (RFC 5545 §3.6.1).
    const quantities = t.quantities.map((q) => `${q.label}: ${q.amount} ${q.unit}${q.rateText ? ` (${q.rateText})` : ''}`);
    calendar.createEvent({
      id: `task-${t.id}@${host}`,
      start: new Date(`${start}T00:00:00Z`),
      end: new Date(`${end}T00:00:00Z`),
      allDay: true,
      summary: `${t.status === 'done' ? '✓ ' : ''}${t.name} — ${t.unitName}`,
      description: [`${t.practiceName}. Window ${formatDateSpan(t.earliest, t.latest)}.`, ...quantities, ...t.cautions.map((c) => `Caution — ${c.title}`), `${config.publicUrl}/field/tasks/${t.id}`].join('\n'),
      url: `${config.publicUrl}/field/tasks/${t.id}`,
      stamp: t.updatedAt,
      lastModified: t.updatedAt,
    });
  }
  return calendar.toString();
}
