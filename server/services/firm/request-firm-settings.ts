/**
 * The signed-in firm's own settings that shape every answer (tile origin for the content security
 * policy, idle timeout), read from the database once per request: several instances agree at once,
 * with no cache to go stale.
 */
import type { Request } from 'express';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { DEFAULT_IDLE_TIMEOUT_HOURS } from '../../../shared/schemas/firm';

export interface RequestFirmSettings {
  /** The https origin of the firm's imagery tile service, if it set one. */
  tileOrigin: string | null;
  idleTimeoutHours: number;
}

const memo = new WeakMap<Request, Promise<RequestFirmSettings>>();

/** The https origin of a tile URL template, or null (plain http and malformed values give null). */
export function tileOriginOf(template: unknown): string | null {
  if (typeof template !== 'string' || !template) return null;
  try {
    const url = new URL(template.replace(/\{[a-z]\}/g, '0'));
    return url.protocol === 'https:' ? url.origin : null;
  } catch {
    return null;
  }
}

/** The settings from a firm's stored `tileUrlTemplate` and `idleTimeoutHours` (the JSON's text values). */
export function firmSettingsFrom(tileUrlTemplate: string | null | undefined, idleTimeoutHours: string | null | undefined): RequestFirmSettings {
  const idle = Number(idleTimeoutHours);
  return { tileOrigin: tileOriginOf(tileUrlTemplate), idleTimeoutHours: Number.isFinite(idle) && idle > 0 ? idle : DEFAULT_IDLE_TIMEOUT_HOURS };
}

/** Reads the settings of a firm (one primary-key query). */
export async function readFirmSettings(firmId: number): Promise<RequestFirmSettings> {
  const rows = await sequelize.query<{ tile: string | null; idle: string | null }>(
    `SELECT settings->>'tileUrlTemplate' AS tile, settings->>'idleTimeoutHours' AS idle FROM firms WHERE id = :firmId`,
    { replacements: { firmId }, type: QueryTypes.SELECT },
  );
  return firmSettingsFrom(rows[0]?.tile, rows[0]?.idle);
}

/** Sets this request's firm settings, read along with its session user (passport.ts). */
export function primeRequestFirmSettings(req: Request, settings: RequestFirmSettings): void {
  memo.set(req, Promise.resolve(settings));
}

/**
 * The signed-in user's firm settings for this request (read once, shared by the middlewares); a
 * request whose user came through deserializeUser already has them, read with its session.
 */
export function requestFirmSettings(req: Request, firmId: number): Promise<RequestFirmSettings> {
  let found = memo.get(req);
  if (!found) {
    found = readFirmSettings(firmId);
    memo.set(req, found);
  }
  return found;
}
