// Error shape and form-parameter readers for the local payments fake.
// The hosted service answers errors as `{ error: { type, message, code?, param? } }` with an HTTP
// status the SDK maps to its error classes (400/404 invalid request, 401 authentication,
// 402 card, 400 + type idempotency_error idempotency). Parameters arrive form-encoded with
// bracket notation and are parsed by qs, so every scalar is a string here.

/** The `error` member of an error response, as the hosted service sends it. */
export interface FakeErrorBody {
  type: 'invalid_request_error' | 'idempotency_error' | 'card_error' | 'api_error';
  message: string;
  code?: string;
  param?: string;
  decline_code?: string;
  payment_intent?: unknown;
}

/** An API error with its HTTP status; the app's error middleware turns it into `{ error }`. */
export class FakeApiError extends Error {
  readonly statusCode: number;
  readonly body: FakeErrorBody;

  constructor(statusCode: number, body: FakeErrorBody) {
    super(body.message);
    this.name = 'FakeApiError';
    this.statusCode = statusCode;
    this.body = body;
  }
}

/** A 400 invalid_request_error, optionally naming the offending parameter and a stable code. */
export function invalidRequest(message: string, options: { param?: string; code?: string } = {}): FakeApiError {
  return new FakeApiError(400, { type: 'invalid_request_error', message, ...options });
}

/** A 404 resource_missing error worded like the hosted service ("No such customer: 'cus_1'"). */
export function resourceMissing(kind: string, id: string, param = 'id'): FakeApiError {
  return new FakeApiError(404, {
    type: 'invalid_request_error',
    code: 'resource_missing',
    param,
    message: `No such ${kind}: '${id}'`,
  });
}

export type Params = Record<string, unknown>;

/** Returns `value` as a plain parameter object, or an empty one when it is absent. */
export function asParams(value: unknown, name: string): Params {
  if (value === undefined || value === '') return {};
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalidRequest(`Invalid object: ${name} must be a hash (send it as ${name}[key]=value).`, { param: name });
  }
  return value as Params;
}

/** Rejects parameters the fake does not model, the way the hosted service rejects unknown ones. */
export function assertKnownParams(params: Params, known: readonly string[], prefix = ''): void {
  for (const key of Object.keys(params)) {
    if (!known.includes(key)) {
      const name = prefix ? `${prefix}[${key}]` : key;
      throw invalidRequest(
        `Received unknown parameter: ${name}. The local payments fake accepts here only: ${known.join(', ')}.`,
        { param: name },
      );
    }
  }
}

/** Reads an optional string parameter; `''` counts as absent. */
export function optionalString(params: Params, key: string, name = key, maxLength = 5000): string | null {
  const value = params[key];
  if (value === undefined || value === '') return null;
  if (typeof value !== 'string') throw invalidRequest(`Invalid string: ${name} must be a single value.`, { param: name });
  if (value.length > maxLength) {
    throw invalidRequest(`Invalid string: ${name} must be at most ${maxLength} characters.`, { param: name });
  }
  return value;
}

/** Reads a required string parameter. */
export function requiredString(params: Params, key: string, name = key, maxLength = 5000): string {
  const value = optionalString(params, key, name, maxLength);
  if (value === null) throw invalidRequest(`Missing required param: ${name}.`, { param: name });
  return value;
}

/** Reads an optional non-negative integer parameter sent as decimal digits. */
export function optionalInteger(params: Params, key: string, name = key): number | null {
  const value = params[key];
  if (value === undefined || value === '') return null;
  if (typeof value !== 'string' || !/^\d{1,15}$/.test(value)) {
    throw invalidRequest(`Invalid integer: ${String(value)} (${name} must be a whole number).`, { param: name });
  }
  return Number(value);
}

/** Reads a required positive integer parameter. */
export function requiredPositiveInteger(params: Params, key: string, name = key): number {
  const value = optionalInteger(params, key, name);
  if (value === null) throw invalidRequest(`Missing required param: ${name}.`, { param: name });
  if (value < 1) throw invalidRequest(`Invalid positive integer: ${name} must be at least 1.`, { param: name });
  return value;
}

/** Reads a three-letter currency code and lower-cases it, as the hosted service does. */
export function requiredCurrency(params: Params, key: string, name = key): string {
  const value = requiredString(params, key, name).toLowerCase();
  if (!/^[a-z]{3}$/.test(value)) {
    throw invalidRequest(`Invalid currency: ${value}. Use a three-letter ISO code such as usd.`, { param: name });
  }
  return value;
}

/** Reads an absolute http(s) URL parameter. */
export function optionalUrl(params: Params, key: string): string | null {
  const value = optionalString(params, key, key, 5000);
  if (value === null) return null;
  let parsed: URL;
  try {
    parsed = new URL(value);
  } catch {
    throw invalidRequest(`Not a valid URL: ${key} must be an absolute http(s) URL.`, { param: key });
  }
  if (parsed.protocol !== 'http:' && parsed.protocol !== 'https:') {
    throw invalidRequest(`Not a valid URL: ${key} must use http or https.`, { param: key });
  }
  return value;
}

// Limits of the hosted service's metadata (from memory): 50 keys, key 40 chars, value 500 chars.
const METADATA_MAX_KEYS = 50;
const METADATA_MAX_KEY_LENGTH = 40;
const METADATA_MAX_VALUE_LENGTH = 500;

/** Reads a metadata hash of string values; `''` or absence gives an empty hash. */
export function readMetadata(params: Params, key: string, name = key): Record<string, string> {
  const raw = asParams(params[key], name);
  const entries = Object.entries(raw);
  if (entries.length > METADATA_MAX_KEYS) {
    throw invalidRequest(`Invalid metadata: ${name} may have at most ${METADATA_MAX_KEYS} keys.`, { param: name });
  }
  const metadata: Record<string, string> = {};
  for (const [metaKey, value] of entries) {
    if (typeof value !== 'string') {
      throw invalidRequest(`Invalid metadata: ${name}[${metaKey}] must be a string.`, { param: `${name}[${metaKey}]` });
    }
    if (metaKey.length > METADATA_MAX_KEY_LENGTH) {
      throw invalidRequest(`Invalid metadata: key ${metaKey} is longer than ${METADATA_MAX_KEY_LENGTH} characters.`, {
        param: `${name}[${metaKey}]`,
      });
    }
    if (value.length > METADATA_MAX_VALUE_LENGTH) {
      throw invalidRequest(`Invalid metadata: ${name}[${metaKey}] is longer than ${METADATA_MAX_VALUE_LENGTH} characters.`, {
        param: `${name}[${metaKey}]`,
      });
    }
    if (value !== '') metadata[metaKey] = value;
  }
  return metadata;
}

/** Reads an array parameter; qs gives an object with numeric keys past its array limit, so both count. */
export function readArray(params: Params, key: string, name = key): unknown[] {
  const value = params[key];
  if (value === undefined || value === '') return [];
  if (Array.isArray(value)) return value;
  if (typeof value === 'object' && value !== null && Object.keys(value).every((k) => /^\d+$/.test(k))) {
    return Object.entries(value)
      .sort(([a], [b]) => Number(a) - Number(b))
      .map(([, item]) => item);
  }
  throw invalidRequest(`Invalid array: ${name} must be sent as ${name}[0]=…, ${name}[1]=….`, { param: name });
}

/** Reads the `expand` list (expand[]=a or expand[0]=a) and checks each entry against `allowed`. */
export function readExpand(params: Params, allowed: readonly string[]): string[] {
  const raw = readArray(params, 'expand');
  return raw.map((entry, index) => {
    if (typeof entry !== 'string' || !allowed.includes(entry)) {
      throw invalidRequest(
        `This property cannot be expanded (${String(entry)}). The local payments fake expands here only: ${allowed.join(', ') || 'nothing'}.`,
        { param: `expand[${index}]` },
      );
    }
    return entry;
  });
}

/** Serialises a value with sorted keys, so two parameter sets compare equal regardless of key order. */
export function stableStringify(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableStringify).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableStringify(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}
