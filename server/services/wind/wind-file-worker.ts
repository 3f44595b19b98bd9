/** Parses a wind file and sums its rose; runs in a worker thread for large files (see wind-file-reader.ts). */
import { parentPort, workerData } from 'node:worker_threads';
import { filterObservations, parseWindFile, windRose, WindFileError, type WindFilter } from '../../../shared/domain/wind-record';

export type WindFileAnswer =
  | { ok: true; format: 'csv' | 'isd-lite'; rose: ReturnType<typeof windRose>['rose']; hours: number; calmHours: number; skipped: number; readRows: number }
  | { ok: false; message: string; usage: boolean };

/** The rose of a wind file's observations within the filter; a usage error names what is wrong with the file. */
export function roseFromWindText(text: string, filter: WindFilter): WindFileAnswer {
  try {
    const parsed = parseWindFile(text);
    const kept = filterObservations(parsed.observations, filter);
    if (kept.length === 0) {
      return { ok: false, usage: true, message: `None of the file's ${parsed.observations.length} usable hours falls in the chosen months and hours: choose other months or “all” hours.` };
    }
    const { rose, hours, calmHours } = windRose(kept);
    return { ok: true, format: parsed.format, rose, hours, calmHours, skipped: parsed.skipped, readRows: parsed.observations.length };
  } catch (error) {
    if (error instanceof WindFileError) return { ok: false, usage: true, message: error.message };
    return { ok: false, usage: false, message: error instanceof Error ? error.message : String(error) };
  }
}

if (parentPort && workerData && (workerData as { kind?: string }).kind === 'wind-file') {
  const { text, filter } = workerData as { text: string; filter: WindFilter };
  parentPort.postMessage(roseFromWindText(text, filter));
}
