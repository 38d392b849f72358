import type { Model, QueryBuilder } from 'objection';
import type { Role } from './roles';

const ALL: readonly Role[] = ['owner', 'workroom', 'client'];
const STUDIO: readonly Role[] = ['owner', 'workroom'];
const OWNER: readonly Role[] = ['owner'];
/** The owner, and a client on its own records (which records is the services' rule). */
const OWNER_CLIENT: readonly Role[] = ['owner', 'client'];
/** Stored for the server's own use; never sent. */
const NOBODY: readonly Role[] = [];

/**
 * Who may do what with one field. `see`: it is in the JSON that role gets.
 * `search` (the free-text `q=`), `filter` and `sort`: the list queries may use
 * it for that role; a use the role may not make is left out (a search matches
 * nothing on it, a filter is not applied, a sort falls back to the default),
 * so it can never change what the role gets.
 */
export interface FieldRule {
  see: readonly Role[];
  search?: readonly Role[];
  filter?: readonly Role[];
  sort?: readonly Role[];
}

export interface ModelFields {
  /** The table its columns come from (a field that is not a column is worked out by the service). */
  table: string;
  fields: Record<string, FieldRule>;
}

/**
 * The one place that says which role sees which field of each model the API
 * sends, and may search, filter or sort by it. The serialisers keep only the
 * fields declared visible (an undeclared field is never sent), the list
 * queries search, filter and sort only by declared fields, and the field
 * access suite checks every GET route against this table. Every column of a
 * declared table must be declared here.
 */
export const FIELD_POLICY = {
  client: {
    table: 'clients',
    fields: {
      id: { see: ALL },
      name: { see: ALL, search: ALL, sort: ALL },
      email: { see: OWNER_CLIENT, search: OWNER_CLIENT, sort: OWNER_CLIENT },
      phone: { see: OWNER_CLIENT, search: OWNER_CLIENT },
      address: { see: OWNER_CLIENT },
      /** The studio's own notes about the client. */
      notes: { see: OWNER },
      portfolioConsent: { see: OWNER_CLIENT },
      /** The invitation to the client's page: the owner's business, never the workroom's. */
      invitationSentAt: { see: OWNER },
      // Worked out by the service: not_sent, sent or accepted.
      invitationState: { see: OWNER },
      createdAt: { see: OWNER_CLIENT, sort: OWNER_CLIENT },
      updatedAt: { see: OWNER_CLIENT },
    },
  },
  commission: {
    table: 'commissions',
    fields: {
      id: { see: ALL },
      clientId: { see: ALL, filter: ALL },
      title: { see: ALL, search: ALL, sort: ALL },
      kind: { see: ALL },
      recipient: { see: ALL },
      ageGroup: { see: ALL },
      occasion: { see: ALL },
      sizePreset: { see: ALL },
      widthMm: { see: ALL },
      lengthMm: { see: ALL },
      deadline: { see: ALL, filter: ALL, sort: ALL },
      /** Money: never the workroom. */
      budgetPence: { see: OWNER_CLIENT },
      /** The studio's working notes. */
      notes: { see: STUDIO },
      stage: { see: ALL, filter: ALL, sort: ALL },
      createdAt: { see: ALL, sort: ALL },
      updatedAt: { see: ALL },
      // Worked out by the service.
      client: { see: ALL },
      daysLeft: { see: ALL },
      overdue: { see: ALL },
      cautions: { see: ALL },
      garments: { see: ALL },
      progressPhotos: { see: ALL },
      stageHistory: { see: ALL },
      hours: { see: STUDIO },
      /** Quoted against logged hours and the labour margin: money, so the owner only. */
      hoursCompared: { see: OWNER },
      nextStages: { see: STUDIO },
      /** Every other stage, allowed or refused with the reason. */
      stageOptions: { see: STUDIO },
      facts: { see: ALL },
    },
  },
  garment: {
    table: 'garments',
    fields: {
      id: { see: ALL },
      commissionId: { see: ALL },
      description: { see: ALL },
      whose: { see: ALL },
      story: { see: ALL },
      fibre: { see: ALL },
      construction: { see: ALL },
      colour: { see: ALL },
      print: { see: ALL },
      features: { see: ALL },
      condition: { see: STUDIO },
      prewash: { see: STUDIO },
      colourRun: { see: STUDIO },
      returnsToClient: { see: STUDIO },
      createdBy: { see: NOBODY },
      createdAt: { see: ALL },
      updatedAt: { see: STUDIO },
      // Worked out by the service.
      status: { see: ALL },
      received: { see: ALL },
      washed: { see: ALL },
      place: { see: STUDIO },
      removeForSafety: { see: ALL },
      events: { see: ALL },
      panels: { see: STUDIO },
      photos: { see: ALL },
    },
  },
  quote: {
    table: 'quotes',
    fields: {
      id: { see: OWNER_CLIENT },
      commissionId: { see: OWNER_CLIENT },
      version: { see: OWNER_CLIENT },
      status: { see: OWNER_CLIENT },
      intro: { see: OWNER_CLIENT },
      validUntil: { see: OWNER_CLIENT },
      depositPercent: { see: OWNER_CLIENT },
      vatRate: { see: OWNER_CLIENT },
      vatMode: { see: OWNER_CLIENT },
      // The frozen totals are sent inside `totals`.
      netPence: { see: OWNER_CLIENT },
      vatPence: { see: OWNER_CLIENT },
      totalPence: { see: OWNER_CLIENT },
      depositPence: { see: OWNER_CLIENT },
      studioSnapshot: { see: NOBODY },
      sentAt: { see: OWNER_CLIENT },
      acceptedAt: { see: OWNER_CLIENT },
      acceptedName: { see: OWNER_CLIENT },
      declinedAt: { see: OWNER_CLIENT },
      declineNote: { see: OWNER_CLIENT },
      createdBy: { see: NOBODY },
      createdAt: { see: OWNER_CLIENT },
      updatedAt: { see: NOBODY },
      // Worked out by the service.
      expired: { see: OWNER_CLIENT },
      lines: { see: OWNER_CLIENT },
      totals: { see: OWNER_CLIENT },
    },
  },
  /** Money: the owner, and the client on its own commissions; never the workroom. */
  payment: {
    table: 'payments',
    fields: {
      id: { see: OWNER_CLIENT },
      commissionId: { see: OWNER_CLIENT },
      quoteId: { see: OWNER_CLIENT },
      kind: { see: OWNER_CLIENT },
      amountPence: { see: OWNER_CLIENT },
      receivedPence: { see: OWNER_CLIENT },
      status: { see: OWNER_CLIENT },
      // The card provider's own ids.
      checkoutSessionId: { see: NOBODY },
      paymentIntentId: { see: NOBODY },
      refundId: { see: NOBODY },
      refundReason: { see: OWNER_CLIENT },
      paidAt: { see: OWNER_CLIENT },
      refundedAt: { see: OWNER_CLIENT },
      createdAt: { see: OWNER_CLIENT },
      method: { see: OWNER_CLIENT },
      /** Printed on the receipt. */
      reference: { see: OWNER_CLIENT },
      receivedOn: { see: OWNER_CLIENT },
      receiptNumber: { see: OWNER_CLIENT },
      recordedBy: { see: NOBODY },
      undoneAt: { see: OWNER_CLIENT },
      undoneBy: { see: NOBODY },
      /** The studio's own reason for taking a payment back. */
      undoNote: { see: OWNER },
    },
  },
  quoteLine: {
    table: 'quote_lines',
    fields: {
      id: { see: OWNER_CLIENT },
      quoteId: { see: OWNER_CLIENT },
      position: { see: OWNER_CLIENT },
      kind: { see: OWNER_CLIENT },
      description: { see: OWNER_CLIENT },
      quantity: { see: OWNER_CLIENT },
      unit: { see: OWNER_CLIENT },
      unitPricePence: { see: OWNER_CLIENT },
      stage: { see: OWNER_CLIENT },
      // Worked out by the service.
      netPence: { see: OWNER_CLIENT },
      vatPence: { see: OWNER_CLIENT },
    },
  },
  user: {
    table: 'users',
    fields: {
      // Reached by the owner (the list of sign-ins) and by each user for itself.
      id: { see: ALL },
      email: { see: ALL },
      name: { see: ALL },
      role: { see: ALL },
      clientId: { see: ALL },
      passwordHash: { see: NOBODY },
      passwordChangedAt: { see: NOBODY },
      awaitingPassword: { see: NOBODY },
      createdAt: { see: NOBODY },
      updatedAt: { see: NOBODY },
    },
  },
  stock: {
    table: 'stock_fabrics',
    fields: {
      id: { see: ALL },
      /** A client reads the names of studio fabrics in its design, and their fibres on its care card. */
      name: { see: ALL, sort: STUDIO },
      colour: { see: STUDIO },
      fibre: { see: ALL },
      widthMm: { see: STUDIO },
      lengthMm: { see: STUDIO },
      /** What it cost and where from: the owner only. */
      costPence: { see: OWNER },
      costUnit: { see: OWNER },
      supplier: { see: OWNER },
      notes: { see: STUDIO },
      createdAt: { see: STUDIO },
      updatedAt: { see: STUDIO },
    },
  },
  designVersion: {
    table: 'design_versions',
    fields: {
      id: { see: STUDIO },
      commissionId: { see: NOBODY },
      version: { see: ALL },
      body: { see: ALL },
      /** A client gets the drawing's part of it, never the cutting. */
      derived: { see: ALL },
      plan: { see: STUDIO },
      /** The owner's note on the version. */
      note: { see: STUDIO },
      createdBy: { see: NOBODY },
      createdAt: { see: STUDIO },
      sharedAt: { see: ALL },
      clientResponse: { see: ALL },
      clientNote: { see: ALL },
      respondedAt: { see: ALL },
    },
  },
  studioSettings: {
    table: 'studio_settings',
    fields: {
      id: { see: OWNER },
      studioName: { see: OWNER },
      makerName: { see: OWNER },
      address: { see: OWNER },
      email: { see: OWNER },
      hourlyRatePence: { see: OWNER },
      vatRegistered: { see: OWNER },
      vatRate: { see: OWNER },
      vatMode: { see: OWNER },
      vatNumber: { see: OWNER },
      depositPercent: { see: OWNER },
      validityDays: { see: OWNER },
      paymentTerms: { see: OWNER },
      blockMinutes: { see: OWNER },
      remindQuoteExpiry: { see: OWNER },
      remindBalanceDue: { see: OWNER },
      remindGarmentsLate: { see: OWNER },
      garmentsLateDays: { see: OWNER },
      /** Only the hash of the feed's secret is kept, and it never leaves the server. */
      calendarFeedHash: { see: NOBODY },
      calendarFeedMadeAt: { see: OWNER },
      /** The order dates are typed in: every signed-in form needs it (GET /api/settings/locale). */
      locale: { see: ALL },
      updatedAt: { see: OWNER },
    },
  },
  /** The record of reminders mailed: the server's own, never sent. */
  reminderSent: {
    table: 'reminders_sent',
    fields: {
      id: { see: NOBODY },
      kind: { see: NOBODY },
      subjectId: { see: NOBODY },
      dueOn: { see: NOBODY },
      outboxMailId: { see: NOBODY },
      createdAt: { see: NOBODY },
    },
  },
} as const satisfies Record<string, ModelFields>;

export type ModelName = keyof typeof FIELD_POLICY;
type FieldOf<M extends ModelName> = keyof (typeof FIELD_POLICY)[M]['fields'] & string;
export type FieldUse = keyof FieldRule;

function rule(model: ModelName, field: string): FieldRule | undefined {
  return (FIELD_POLICY[model].fields as Record<string, FieldRule>)[field];
}

/** Whether the role may make this use of the field (undeclared fields: never). */
export function mayUse(model: ModelName, role: Role, use: FieldUse, field: string): boolean {
  return rule(model, field)?.[use]?.includes(role) ?? false;
}

/** The declared fields of a model that the role may make this use of. */
export function fieldsFor<M extends ModelName>(model: M, role: Role, use: FieldUse): FieldOf<M>[] {
  return Object.keys(FIELD_POLICY[model].fields).filter((f) => mayUse(model, role, use, f)) as FieldOf<M>[];
}

/**
 * A model's view for a role: only the fields declared visible to it. Fields
 * the view does not carry stay absent; an undeclared field is dropped.
 */
export function present<T extends object>(model: ModelName, role: Role, view: T): Partial<T> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(view)) {
    if (value !== undefined && mayUse(model, role, 'see', key)) out[key] = value;
  }
  return out as Partial<T>;
}

const likeOf = (text: string) => `%${text.replace(/[\\%_]/g, (c) => '\\' + c)}%`;

/**
 * Narrows a query to rows where any field the role may search, of the models
 * given with the alias their table has in the query, contains the text
 * (case-insensitive). With no such field nothing matches.
 */
export function whereMatches<M extends Model>(query: QueryBuilder<M, M[]>, models: ReadonlyArray<readonly [ModelName, string]>, role: Role, text: string): void {
  const like = likeOf(text);
  const columns = models.flatMap(([model, alias]) => fieldsFor(model, role, 'search').map((f) => `${alias}.${f}`));
  query.where((q) => {
    if (columns.length === 0) q.whereRaw('false');
    for (const column of columns) q.orWhereILike(column, like);
  });
}

/** The sort asked for when the role may sort by that field, otherwise the default. */
export function sortFor<S extends string>(model: ModelName, role: Role, asked: S, fallback: S): S {
  return mayUse(model, role, 'sort', asked) ? asked : fallback;
}
