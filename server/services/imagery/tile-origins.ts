/**
 * The origins of the firms' imagery tile services, which the content security policy must allow.
 * A small cache of database state, refreshed after a settings change and every minute (so several
 * server instances converge without sharing memory).
 */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { logger } from '../../logger';

let origins: string[] = [];
let loadedAt = 0;

/** The tile origins currently allowed. */
export function allowedTileOrigins(): string[] {
  if (Date.now() - loadedAt > 60_000) void refreshTileOrigins();
  return origins;
}

/** Reloads the tile origins from the firms' settings. */
export async function refreshTileOrigins(): Promise<void> {
  loadedAt = Date.now();
  try {
    const rows = await sequelize.query<{ url: string | null }>(`SELECT settings->>'tileUrlTemplate' AS url FROM firms WHERE settings ? 'tileUrlTemplate'`, { type: QueryTypes.SELECT });
    const next = new Set<string>();
    for (const { url } of rows) {
      if (!url) continue;
      try {
        next.add(new URL(url.replace(/\{[a-z]\}/g, '0')).origin);
      } catch {
        /* ignore a malformed stored value */
      }
    }
    origins = [...next];
  } catch (err) {
    logger.warn({ err: (err as Error).message }, 'could not load tile origins');
  }
}
