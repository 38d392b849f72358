import { PRINTOUTS, printoutRoute } from '@keepstitch/shared';
import type { Caller } from './roles';

const EVERYONE: readonly Caller[] = ['anonymous', 'owner', 'workroom', 'client'];
const SIGNED_IN: readonly Caller[] = ['owner', 'workroom', 'client'];
const OWNER: readonly Caller[] = ['owner'];
const STUDIO: readonly Caller[] = ['owner', 'workroom'];
/** Money: the owner and the client it concerns; never the workroom. */
const CLIENT_OR_OWNER: readonly Caller[] = ['owner', 'client'];
const CLIENT: readonly Caller[] = ['client'];
/** Each printout's PDF with who may print it, from the printouts' registry. */
const PRINTOUT_PDFS = Object.fromEntries(PRINTOUTS.map((p) => [printoutRoute(p), p.roles])) as Record<ReturnType<typeof printoutRoute>, readonly Caller[]>;

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
  'POST /api/auth/password': SIGNED_IN,
  // One-time links to choose a password (invitations and "forgot password").
  'POST /api/auth/forgot-password': EVERYONE,
  'POST /api/auth/set-password': EVERYONE,

  'GET /api/clients': SIGNED_IN,
  'POST /api/clients': OWNER,
  'GET /api/clients/:id': SIGNED_IN,
  // A client's commissions, quotes and payments: money, so the owner's.
  'GET /api/clients/:id/record': OWNER,
  'PATCH /api/clients/:id': OWNER,
  'DELETE /api/clients/:id': OWNER,
  'POST /api/clients/:id/invitation': OWNER,

  'GET /api/users': OWNER,
  'POST /api/users': OWNER,
  'POST /api/users/:id/password': OWNER,

  // Commissions: a client sees only its own (checked in the services).
  'GET /api/commissions': SIGNED_IN,
  'POST /api/commissions': OWNER,
  'GET /api/commissions/:id': SIGNED_IN,
  'PATCH /api/commissions/:id': OWNER,
  'POST /api/commissions/:id/stage': STUDIO,
  'POST /api/commissions/:id/hours': STUDIO,
  'POST /api/commissions/:id/photos': STUDIO,
  'POST /api/commissions/:id/garments': SIGNED_IN,

  // Designs: the owner designs; the workroom reads designs and printouts (no prices in them);
  // a client sees only a shared drawing of its own commission and answers it.
  'GET /api/commissions/:id/design': STUDIO,
  'GET /api/commissions/:id/design/versions/:version': STUDIO,
  'POST /api/commissions/:id/design': OWNER,
  'POST /api/commissions/:id/design/preview': OWNER,
  'POST /api/commissions/:id/design/share': OWNER,
  'GET /api/commissions/:id/design/shared': SIGNED_IN,
  'POST /api/commissions/:id/design/response': CLIENT,
  'GET /api/commissions/:id/care-card': SIGNED_IN,
  // The printouts' PDFs: cut list, sewing order and templates for the studio, the care card for the client too.
  ...PRINTOUT_PDFS,

  'GET /api/garments/:id': SIGNED_IN,
  'PATCH /api/garments/:id': STUDIO,
  'POST /api/garments/:id/events': STUDIO,
  'POST /api/garments/:id/panels': STUDIO,
  'POST /api/garments/:id/photos': SIGNED_IN,
  'PATCH /api/panels/:id': STUDIO,
  'DELETE /api/panels/:id': STUDIO,

  'GET /api/photos/:id/image': SIGNED_IN,
  'GET /api/photos/:id/thumb': SIGNED_IN,

  'GET /api/stock': STUDIO,
  'POST /api/stock': OWNER,
  'PATCH /api/stock/:id': OWNER,
  'DELETE /api/stock/:id': OWNER,

  'GET /api/settings': OWNER,
  'PATCH /api/settings': OWNER,
  'POST /api/settings/calendar-feed': OWNER,
  'DELETE /api/settings/calendar-feed': OWNER,

  // What is due: the workroom's overview has no money in it (left out by the service).
  'GET /api/overview': STUDIO,
  // The calendar feed of deadlines: calendar apps cannot sign in, so the secret in its address is the key.
  'GET /api/calendar/:secret': EVERYONE,
  'GET /api/settings/locale': SIGNED_IN,

  // Quotes: clients see their own once sent (drafts never).
  'GET /api/commissions/:id/quotes': CLIENT_OR_OWNER,
  'POST /api/commissions/:id/quotes': OWNER,
  'GET /api/commissions/:id/quote-suggestion': OWNER,
  'GET /api/quotes/:id': CLIENT_OR_OWNER,
  'PUT /api/quotes/:id': OWNER,
  'GET /api/quotes/:id/pdf': CLIENT_OR_OWNER,
  'POST /api/quotes/:id/send': OWNER,
  'POST /api/quotes/:id/accept': CLIENT,
  'POST /api/quotes/:id/decline': CLIENT,

  // Payments: checkout for the client; the provider's webhook carries its own signature.
  'POST /api/quotes/:id/deposit-checkout': CLIENT,
  'POST /api/commissions/:id/balance-checkout': CLIENT,
  'GET /api/commissions/:id/payments': CLIENT_OR_OWNER,
  'POST /api/commissions/:id/refund-deposit': OWNER,
  'POST /api/commissions/:id/payments/:paymentId/accept': OWNER,
  'POST /api/commissions/:id/payments/:paymentId/refund': OWNER,
  'POST /api/commissions/:id/payments/manual': OWNER,
  'POST /api/commissions/:id/payments/:paymentId/undo': OWNER,
  'GET /api/commissions/:id/payments/:paymentId/receipt': CLIENT_OR_OWNER,
  'GET /api/commissions/:id/invoice': CLIENT_OR_OWNER,
  'POST /api/payments/webhook': EVERYONE,

  'GET /api/mail/outbox': OWNER,
  'POST /api/mail/outbox/:id/retry': OWNER,
  'GET /api/mail/sent': OWNER,
  'GET /api/mail/sent/:id/attachments/:n': OWNER,
} as const satisfies Record<string, readonly Caller[]>;

export type RouteKey = keyof typeof ROUTE_POLICY;
