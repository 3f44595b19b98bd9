/**
 * Which answers are kept on the phone for no signal: the signed-in person, the crew's tasks and
 * field sheet, and everything of a landowner's own portal. Never a consultant's working data (large,
 * and on a desk with signal), never a staff preview of a client's portal.
 */
const ALWAYS = new Set(['auth', 'tasks', 'field', 'calendar-feeds']);

/** Whether a query (by its key) of a person of `role` is persisted. */
export function shouldPersistQuery(queryKey: readonly unknown[], role: string | null | undefined): boolean {
  const [head, second] = queryKey;
  if (typeof head !== 'string') return false;
  if (head === 'portal') return second !== 'preview';
  if (ALWAYS.has(head)) return role === 'crew' || role === 'client' || head === 'auth' || head === 'tasks' || head === 'field';
  return role === 'client';
}

const MINUTE = 60_000;

/** How old the shown data is, as a person says it: "just now", "12 minutes ago", "3 hours ago", "2 days ago". */
export function describeAge(updatedAt: number, now: number): string {
  const minutes = Math.max(0, Math.floor((now - updatedAt) / MINUTE));
  if (minutes < 1) return 'just now';
  if (minutes < 60) return `${minutes} ${minutes === 1 ? 'minute' : 'minutes'} ago`;
  const hours = Math.floor(minutes / 60);
  if (hours < 24) return `${hours} ${hours === 1 ? 'hour' : 'hours'} ago`;
  const days = Math.floor(hours / 24);
  return `${days} ${days === 1 ? 'day' : 'days'} ago`;
}
