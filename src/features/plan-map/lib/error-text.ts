import { ApiError } from '../../../lib/api-client';

/** The first field message of a 422 answer, or the error's own message. */
export function errorText(err: unknown): string {
  if (err instanceof ApiError && Array.isArray(err.details) && err.details.length > 0) {
    const first = err.details[0] as { path?: string; message?: string };
    if (first.message) return `${err.message}: ${first.message}`;
  }
  return err instanceof Error ? err.message : 'Something went wrong. Please try again.';
}

/** Whether a key press lands in a text field (so map shortcuts stay out of the way). */
export function isTyping(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable);
}
