/**
 * Clean shutdown: on SIGTERM the health check answers 503 at once (the load balancer stops sending
 * work), requests in flight finish within a limit, keep-alive connections are told to close, and
 * only then do the pools close.
 */
import type { Server } from 'node:http';
import type { NextFunction, Request, Response } from 'express';

let draining = false;

/** True once shutdown has begun. */
export const isDraining = (): boolean => draining;

/** Marks this instance as shutting down (health answers 503 from now on). */
export function beginDraining(): void {
  draining = true;
}

/** Back to serving (tests only). */
export function endDraining(): void {
  draining = false;
}

/** While draining, every answer asks its client to close the connection, so keep-alive sockets end. */
export function closeConnectionsWhileDraining(_req: Request, res: Response, next: NextFunction): void {
  if (draining) res.setHeader('Connection', 'close');
  next();
}

/**
 * Stops accepting connections and waits for the requests in flight; after graceMs the remaining
 * connections are cut. Answers whether the limit was reached.
 */
export function closeServerGracefully(server: Server, graceMs: number): Promise<{ timedOut: boolean }> {
  return new Promise((resolve) => {
    let timedOut = false;
    const timer = setTimeout(() => {
      timedOut = true;
      server.closeAllConnections();
    }, graceMs);
    timer.unref();
    server.close(() => {
      clearTimeout(timer);
      resolve({ timedOut });
    });
    server.closeIdleConnections();
  });
}
