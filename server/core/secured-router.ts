import { Router, type RequestHandler } from 'express';
import { AppError } from './app-error';
import { ROUTE_POLICY, type RouteKey } from './route-policy';
import type { Caller } from './roles';

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

/** The role of whoever made the request. */
export function callerOf(req: Express.Request): Caller {
  return req.user?.role ?? 'anonymous';
}

/**
 * The signed-in user of a request on a route the table admits only signed in
 * (the route's own guard has already let them through). Asking on a route
 * open to anonymous callers answers 401 rather than reading nobody.
 */
export function signedInUser(req: Express.Request): Express.User {
  if (!req.user) throw new AppError(401, 'unauthenticated', 'Please sign in to do this.');
  return req.user;
}

/** Middleware that lets only the given callers through (401 for nobody, 403 for a wrong role). */
export function allowOnly(callers: readonly Caller[]): RequestHandler {
  return (req, _res, next) => {
    const caller = callerOf(req);
    if (callers.includes(caller)) return next();
    if (caller === 'anonymous') return next(new AppError(401, 'unauthenticated', 'Please sign in to do this.'));
    next(new AppError(403, 'forbidden', 'Your sign-in does not allow this.'));
  };
}

/** Every route registered through a secured router, as "METHOD /path". */
export const registeredRoutes = new Set<string>();

/**
 * An express Router (mounted at the app's root) whose routes take their
 * allowed roles from ROUTE_POLICY.
 * Registering a route that the policy does not name throws at start-up.
 */
export function securedRouter(base: string) {
  const router = Router();
  const add = (method: Method, path: string, handlers: RequestHandler[]) => {
    const fullPath = `${base}${path === '/' ? '' : path}`;
    const key = `${method} ${fullPath}`;
    const callers = (ROUTE_POLICY as Record<string, readonly Caller[]>)[key];
    if (!callers) throw new Error(`Route ${key} has no entry in ROUTE_POLICY.`);
    registeredRoutes.add(key);
    const verb = method.toLowerCase() as 'get' | 'post' | 'patch' | 'put' | 'delete';
    router[verb](fullPath, allowOnly(callers), ...handlers);
  };
  return {
    router,
    base,
    get: (path: string, ...h: RequestHandler[]) => add('GET', path, h),
    post: (path: string, ...h: RequestHandler[]) => add('POST', path, h),
    patch: (path: string, ...h: RequestHandler[]) => add('PATCH', path, h),
    put: (path: string, ...h: RequestHandler[]) => add('PUT', path, h),
    delete: (path: string, ...h: RequestHandler[]) => add('DELETE', path, h),
  };
}

/** Throws when the policy names a route no router registered (a stale or mistyped entry). */
export function assertPolicyCovered(): void {
  const missing = (Object.keys(ROUTE_POLICY) as RouteKey[]).filter((k) => !registeredRoutes.has(k));
  if (missing.length) throw new Error(`ROUTE_POLICY names routes that are not registered: ${missing.join(', ')}`);
}
