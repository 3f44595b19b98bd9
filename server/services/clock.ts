/**
 * The server's side of the firm's clock (shared/domain/clock.ts): "now" is the machine's instant,
 * "today" is the calendar date in the firm's own time zone — never the server's UTC date.
 */
import type { Transaction } from 'sequelize';
import { Firm } from '../models';
import { todayIn, usableZone, type IsoDate } from '../../shared/domain/clock';

/** The current instant (one place to read it, so tests can pin it with vitest's fake Date). */
export function now(): Date {
  return new Date();
}

export { usableZone };

/** Today in a zone, now. */
export function todayInZone(zone: string | null | undefined): IsoDate {
  return todayIn(usableZone(zone), now());
}

/** The firm's time zone (read from the firm's row). */
export async function firmZone(firmId: number, transaction?: Transaction): Promise<string> {
  const firm = await Firm.findByPk(firmId, { attributes: ['id', 'timezone'], transaction });
  return usableZone(firm?.timezone);
}

/** Today's calendar date in the firm's time zone. */
export async function firmToday(firmId: number, transaction?: Transaction): Promise<IsoDate> {
  return todayIn(await firmZone(firmId, transaction), now());
}
