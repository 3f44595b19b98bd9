/**
 * Tasks run in the geo worker threads (see geo-pool.ts): reading an uploaded geometry file into
 * the compact preview plus the full geometries as JSON text, and turning a GeoTIFF into a PNG. Both
 * answer plain data (errors too), because an Error loses its status crossing threads.
 */
import { randomUUID } from 'node:crypto';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { threadId } from 'node:worker_threads';
import { readGeoFile, isGeoFileError } from '../geo-files';
import { buildImportPreview } from '../geo-files/import-preview';
import { prepareOverlay } from '../imagery/overlay-image';
import { AppError } from '../../errors';
import type { Corners } from '../../models/overlay';
import type { ReadGeoFileOptions } from '../geo-files/types';

// A full collection after each task hands a large file's memory back at once, instead of whenever
// V8 next feels pressure (the thread lives on between uploads). It is scheduled when a task ends,
// so it runs in this thread after the answer has been posted — never in the middle of a read (a
// collection 50 ms into a 10 MB KML cost that read a fifth of its time).
setFlagsFromString('--expose-gc');
const collectGarbage = runInNewContext('gc') as (() => void) | undefined;
const collectSoon = () => setTimeout(() => collectGarbage?.(), 50).unref();

/** A failure a person can act on, carried across threads as data. */
export interface TaskFailure {
  ok: false;
  status: number;
  code: string;
  message: string;
  details?: unknown;
}

export interface ImportTask {
  filename: string;
  bytes: Uint8Array;
  options?: ReadGeoFileOptions;
}

export type ImportAnswer =
  | { ok: true; importId: string; format: string; featureCount: number; previewJson: string; geometriesJson: string; /** The thread that read the file (0 would be the main thread). */ threadId: number }
  | TaskFailure;

function failure(error: unknown): TaskFailure {
  if (isGeoFileError(error)) return { ok: false, status: error.status, code: error.code, message: error.message, details: error.details };
  if (error instanceof AppError) return { ok: false, status: error.status, code: error.code, message: error.message, details: error.details };
  throw error;
}

/** Read the file; answer the preview and the full geometries (one JSON array, in the preview's order) as text. */
export async function importGeoFile(task: ImportTask): Promise<ImportAnswer> {
  try {
    const result = await readGeoFile({ filename: task.filename, buffer: task.bytes }, task.options);
    const importId = randomUUID();
    const preview = buildImportPreview(result, importId);
    return {
      ok: true,
      importId,
      format: result.format,
      featureCount: preview.features.length,
      previewJson: JSON.stringify(preview),
      geometriesJson: JSON.stringify(result.features.slice(0, preview.features.length).map((f) => f.geometry)),
      threadId,
    };
  } catch (error) {
    return failure(error);
  } finally {
    collectSoon();
  }
}

export interface OverlayTask {
  bytes: Uint8Array;
  corners: Corners | null;
  /** A JPEG/PNG's world file text and the EPSG code of its coordinates. */
  worldFile?: { text: string; epsg: number } | null;
}

export type OverlayAnswer =
  | { ok: true; bytes: Uint8Array; contentType: 'image/png' | 'image/jpeg'; extension: 'png' | 'jpg'; corners: Corners }
  | TaskFailure;

/** Check and convert an overlay image (GeoTIFF → PNG with its corners; PNG/JPEG checked and kept). */
export async function prepareOverlayImage(task: OverlayTask): Promise<OverlayAnswer> {
  try {
    const prepared = await prepareOverlay(Buffer.from(task.bytes.buffer, task.bytes.byteOffset, task.bytes.byteLength), task.corners, task.worldFile ?? null);
    return { ok: true, bytes: new Uint8Array(prepared.bytes), contentType: prepared.contentType, extension: prepared.extension, corners: prepared.corners };
  } catch (error) {
    return failure(error);
  } finally {
    collectSoon();
  }
}
