/** Errors with an HTTP status and a stable code; the error handler turns them into JSON answers. */

export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (message: string, details?: unknown) => new AppError(400, 'bad_request', message, details);
export const unauthorized = (message = 'Please sign in to continue.') => new AppError(401, 'unauthorized', message);
export const forbidden = (message = 'Your account does not have access to this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'That record') => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, details?: unknown) => new AppError(409, 'conflict', message, details);
export const payloadTooLarge = (message: string) => new AppError(413, 'payload_too_large', message);
export const unsupportedMedia = (message: string) => new AppError(415, 'unsupported_media_type', message);
export const unprocessable = (message: string, details?: unknown) => new AppError(422, 'unprocessable', message, details);
export const tooManyRequests = (message: string) => new AppError(429, 'too_many_requests', message);
export const serviceUnavailable = (message: string) => new AppError(503, 'service_unavailable', message);
