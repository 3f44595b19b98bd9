/**
 * Removes stored files that no row points to: left behind when a request saved its file and then
 * lost its transaction (on another instance, after a crash, a repeated completion). Files younger
 * than the grace period are kept, because their row may still be on its way.
 */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { logger } from '../../logger';
import { storage } from './storage';

/** The folders Browseline writes and the tables whose storage_key points into them. */
export const SWEPT_FOLDERS = ['files/', 'photos/', 'overlays/', 'exports/', 'observation-photos/', 'observation-thumbs/'] as const;
const REFERENCES = `SELECT storage_key FROM shared_files UNION ALL SELECT storage_key FROM task_photos UNION ALL SELECT storage_key FROM overlays UNION ALL SELECT storage_key FROM camera_photos UNION ALL SELECT thumbnail_key FROM camera_photos WHERE thumbnail_key IS NOT NULL UNION ALL SELECT storage_key FROM firm_exports WHERE storage_key IS NOT NULL UNION ALL SELECT storage_key FROM observation_photos UNION ALL SELECT thumbnail_key FROM observation_photos WHERE thumbnail_key IS NOT NULL`;

/** Deletes unreferenced files older than graceMs; answers how many were looked at and the keys removed. */
export async function sweepOrphanFiles(options: { graceMs?: number; now?: Date } = {}): Promise<{ checked: number; removed: string[] }> {
  const graceMs = options.graceMs ?? 60 * 60 * 1000;
  const cutoff = (options.now ?? new Date()).getTime() - graceMs;
  const removed: string[] = [];
  let checkedCount = 0;
  const store = storage();
  for (const folder of SWEPT_FOLDERS) {
    const candidates: string[] = [];
    for await (const object of store.list(folder)) {
      checkedCount++;
      if (object.lastModified.getTime() <= cutoff) candidates.push(object.key);
    }
    if (candidates.length === 0) continue;
    // Ask the database after listing: a row written meanwhile still protects its file.
    const rows = await sequelize.query<{ storage_key: string }>(`SELECT storage_key FROM (${REFERENCES}) r WHERE storage_key = ANY($1)`, { bind: [candidates], type: QueryTypes.SELECT });
    const referenced = new Set(rows.map((r) => r.storage_key));
    for (const key of candidates) {
      if (referenced.has(key)) continue;
      await store.remove(key);
      removed.push(key);
    }
  }
  if (removed.length) logger.info({ removed: removed.length }, 'orphan files removed from storage');
  return { checked: checkedCount, removed };
}
