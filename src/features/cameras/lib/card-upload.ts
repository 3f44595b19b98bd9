/**
 * Sending a camera card: every file is hashed (SHA-256) first, the server is asked which hashes it
 * has, and only the others are sent, a few at a time, with progress. A run cut short (signal lost,
 * tab closed) is simply started again: what arrived is known by its hash and skipped.
 */
import type { CardUploadResult } from '../../../../shared/schemas/cameras';

/** Photos per request: small batches keep a lost connection from costing much. */
export const CARD_BATCH_SIZE = 5;

export interface CardUploadProgress {
  total: number;
  /** Files already on the server before this run (skipped by hash). */
  alreadyThere: number;
  sent: number;
  added: number;
  skipped: number;
  messages: string[];
}

export interface CardUploadDeps<F> {
  hash(file: F): Promise<string>;
  known(hashes: string[]): Promise<string[]>;
  send(files: F[]): Promise<CardUploadResult>;
}

/** Runs one upload of a card; `onProgress` is called after each step. Throws on the first failed request (run again to resume). */
export async function uploadCard<F>(files: readonly F[], deps: CardUploadDeps<F>, onProgress: (p: CardUploadProgress) => void, batchSize = CARD_BATCH_SIZE): Promise<CardUploadProgress> {
  const progress: CardUploadProgress = { total: files.length, alreadyThere: 0, sent: 0, added: 0, skipped: 0, messages: [] };
  const hashes: string[] = [];
  for (const f of files) hashes.push(await deps.hash(f));
  const known = new Set<string>();
  for (let i = 0; i < hashes.length; i += 2000) for (const h of await deps.known(hashes.slice(i, i + 2000))) known.add(h);
  const seen = new Set<string>();
  const todo = files.filter((_, i) => {
    const h = hashes[i];
    if (known.has(h) || seen.has(h)) return false;
    seen.add(h);
    return true;
  });
  progress.alreadyThere = files.length - todo.length;
  onProgress({ ...progress });
  for (let i = 0; i < todo.length; i += batchSize) {
    const batch = todo.slice(i, i + batchSize);
    const result = await deps.send(batch);
    progress.sent += batch.length;
    progress.added += result.added;
    progress.skipped += result.skipped;
    progress.messages.push(...result.skips.map((s) => s.message), ...result.flagged.map((f) => f.message));
    onProgress({ ...progress, messages: [...progress.messages] });
  }
  return progress;
}

/** SHA-256 of a browser File as lower-case hex (Web Crypto). */
export async function sha256OfFile(file: Blob): Promise<string> {
  const digest = await crypto.subtle.digest('SHA-256', await file.arrayBuffer());
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, '0')).join('');
}
