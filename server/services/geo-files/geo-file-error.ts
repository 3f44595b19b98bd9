/** Typed errors for reading and writing geometry files, with an HTTP-ish status and a stable code. */

export type GeoFileErrorCode =
  | 'unsupported-file' // 415: not a format we read
  | 'unreadable-file' // 422: a format we read, but damaged or not valid
  | 'too-many-features' // 413: over the feature guard
  | 'too-large' // 413: an archive entry expands beyond the guard
  | 'too-many-vertices' // 413: more coordinate positions than one import may take
  | 'too-many-entries' // 413: an archive with more entries than one import may open
  | 'invalid-export' // 422: the plan handed to an exporter is not exportable
  | 'unknown-export-format'; // 400: an export format we do not offer

export type GeoFileErrorStatus = 400 | 413 | 415 | 422;

/** An import or export problem a person can act on; `status` maps straight to the HTTP answer. */
export class GeoFileError extends Error {
  readonly status: GeoFileErrorStatus;
  readonly code: GeoFileErrorCode;
  readonly details?: Record<string, unknown>;

  constructor(status: GeoFileErrorStatus, code: GeoFileErrorCode, message: string, details?: Record<string, unknown>) {
    super(message);
    this.name = 'GeoFileError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

/** 415: the file is not one of the formats Browseline reads. */
export function unsupportedFile(message: string, details?: Record<string, unknown>): GeoFileError {
  return new GeoFileError(415, 'unsupported-file', message, details);
}

/** 422: the file is of a supported format but cannot be read. */
export function unreadableFile(message: string, details?: Record<string, unknown>): GeoFileError {
  return new GeoFileError(422, 'unreadable-file', message, details);
}

/** 413: the file holds more features than one import may take. */
export function tooManyFeatures(found: number | string, maxFeatures: number): GeoFileError {
  return new GeoFileError(
    413,
    'too-many-features',
    `This file holds ${typeof found === 'number' ? found.toLocaleString('en-US') : found} features; one import can take at most ${maxFeatures.toLocaleString('en-US')}. ` +
      'Split the file, or remove the features you do not need, and upload again.',
    { maxFeatures },
  );
}

/** 413: the file holds more coordinate positions (vertices) than one import may take. */
export function tooManyVertices(maxVertices: number): GeoFileError {
  return new GeoFileError(
    413,
    'too-many-vertices',
    `This file holds more than ${maxVertices.toLocaleString('en-US')} vertices (corner and track points), the most one import can take. ` +
      'Simplify the shapes (a tolerance of a metre or two is plenty for a plan), or split the file, and upload again.',
    { maxVertices },
  );
}

/** True when the value is a GeoFileError (also across module copies). */
export function isGeoFileError(value: unknown): value is GeoFileError {
  return value instanceof GeoFileError || (value instanceof Error && value.name === 'GeoFileError' && 'status' in value);
}
