/**
 * Route access declarations. Every /api route is registered through `defineRoutes`, which forces a
 * declaration: `'public'` or the roles allowed. The declaration both authenticates (401 without a
 * session) and authorizes the role (403); firm ownership is checked by the policies in the handler.
 */
import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import express from 'express';
import type { Role } from '../../shared/schemas/auth';
import { forbidden, unauthorized } from '../errors';

export type Access = 'public' | 'signed-in' | readonly Role[];

export interface RouteRecord {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  access: Access;
}

/** Every route declared through defineRoutes, for the authorization test. */
export const routeRegistry: RouteRecord[] = [];

/** Middleware that enforces an access declaration. */
export function requireAccess(access: Access): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (access === 'public') return next();
    if (!req.user) return next(unauthorized());
    if (access === 'signed-in') return next();
    if (!access.includes(req.user.role)) return next(forbidden());
    next();
  };
}

type Method = RouteRecord['method'];
type Adder = (path: string, access: Access, ...handlers: RequestHandler[]) => void;

/** A router whose every route must declare its access; `base` is its mount path under /api. */
export function defineRoutes(base: string): { router: Router } & Record<Method, Adder> {
  const router = express.Router();
  const make =
    (method: Method): Adder =>
    (path, access, ...handlers) => {
      const full = `${base}${path === '/' ? '' : path}` || '/';
      if (!routeRegistry.some((r) => r.method === method && r.path === full)) {
        routeRegistry.push({ method, path: full, access });
      }
      router[method](path, requireAccess(access), ...handlers);
    };
  return { router, get: make('get'), post: make('post'), put: make('put'), patch: make('patch'), delete: make('delete') };
}

export const STAFF: readonly Role[] = ['owner', 'consultant'];
export const OWNER: readonly Role[] = ['owner'];
export const ALL_ROLES: readonly Role[] = ['owner', 'consultant', 'crew', 'client'];
