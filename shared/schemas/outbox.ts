/** Mail the outbox could not deliver yet, as the owner sees it (never the body: it may hold a sign-in link). */
export interface UndeliveredMailDto {
  id: number;
  kind: string;
  to: string;
  subject: string;
  /** 'failed': given up after the 3-day retry window; 'retrying': still being tried. */
  status: 'failed' | 'retrying';
  attempts: number;
  lastError: string | null;
  queuedAt: string;
  nextAttemptAt: string | null;
}
