import type { Caller } from './roles';

const EVERYONE: readonly Caller[] = ['anonymous', 'owner', 'workroom', 'client'];
const SIGNED_IN: readonly Caller[] = ['owner', 'workroom', 'client'];
const OWNER: readonly Caller[] = ['owner'];

/**
 * The one place that says who may call each API route. Routers are built with
 * `securedRouter`, which refuses to register a route missing from this table,
 * and the access tests enumerate it. Record-level rules (a client sees only its
 * own records) are enforced in the services on top of this.
 */
export const ROUTE_POLICY = {
  'GET /api/health': EVERYONE,

  'GET /api/auth/me': EVERYONE,
  'POST /api/auth/sign-in': EVERYONE,
  'POST /api/auth/sign-out': EVERYONE,

  'GET /api/clients': SIGNED_IN,
  'POST /api/clients': OWNER,
  'GET /api/clients/:id': SIGNED_IN,
  'PATCH /api/clients/:id': OWNER,
  'DELETE /api/clients/:id': OWNER,

  'GET /api/users': OWNER,
  'POST /api/users': OWNER,
  'POST /api/users/:id/password': OWNER,
} as const satisfies Record<string, readonly Caller[]>;

export type RouteKey = keyof typeof ROUTE_POLICY;
