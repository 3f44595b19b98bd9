/** Server validation answers (422 with `details[].path`) turned into messages per form field. */
import { ApiError } from './api-client';

export interface FieldProblem {
  path: string;
  message: string;
}

/** The field problems a 422 answer carries (empty for other errors). */
export function fieldProblems(error: unknown): FieldProblem[] {
  if (!(error instanceof ApiError) || !Array.isArray(error.details)) return [];
  return (error.details as unknown[]).filter((d): d is FieldProblem => typeof d === 'object' && d !== null && typeof (d as FieldProblem).path === 'string' && typeof (d as FieldProblem).message === 'string');
}

/**
 * The form field a server path belongs to: the path itself when the form has it, else its longest
 * known prefix ("grade.nPct" → "grade"), after dropping a leading "material." or "rate." that the
 * domain checks put in front. Null when no field matches.
 */
export function matchField(path: string, fields: readonly string[]): string | null {
  const cleaned = path.replace(/\[(\d+)\]/g, '.$1').replace(/^(material|rate)\./, '');
  const parts = cleaned.split('.');
  for (let n = parts.length; n > 0; n -= 1) {
    const candidate = parts.slice(0, n).join('.');
    if (fields.includes(candidate)) return candidate;
  }
  return null;
}

/** A sentence for a message that starts with a lower-case letter ("must be …" → "Must be …"). */
export const sentence = (text: string): string => (text ? text.charAt(0).toUpperCase() + text.slice(1) : text);
