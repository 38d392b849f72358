import * as z from 'zod/mini';

/** A client record as the owner sees it. */
export const clientSchema = z.object({
  id: z.number(),
  name: z.string(),
  email: z.nullable(z.string()),
  phone: z.nullable(z.string()),
  address: z.nullable(z.string()),
  notes: z.nullable(z.string()),
  portfolioConsent: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** When the invitation to the client's page was last sent (null: never). */
  invitationSentAt: z.optional(z.nullable(z.string())),
  /** Sent with a single record only: never sent, sent and not used yet, or the client can sign in. */
  invitationState: z.optional(z.enum(['not_sent', 'sent', 'accepted'])),
});
export type Client = z.infer<typeof clientSchema>;
export type InvitationState = NonNullable<Client['invitationState']>;

/**
 * A row of the client list. The workroom receives only id and name;
 * contact details and dates arrive for the owner alone.
 */
export const clientRowSchema = z.object({
  id: z.number(),
  name: z.string(),
  email: z.optional(z.nullable(z.string())),
  phone: z.optional(z.nullable(z.string())),
  createdAt: z.optional(z.string()),
});
export type ClientRow = z.infer<typeof clientRowSchema>;

export const clientPageSchema = z.object({
  items: z.array(clientRowSchema),
  total: z.number(),
});
export type ClientPage = z.infer<typeof clientPageSchema>;

/** What the client form sends. Empty optional text is sent as null. */
export interface ClientDraft {
  name: string;
  email: string | null;
  phone: string | null;
  address: string | null;
  notes: string | null;
  portfolioConsent: boolean;
}

export type ClientSortField = 'name' | 'email' | 'createdAt';
export type SortDirection = 'asc' | 'desc';

export interface ClientQuery {
  page: number;
  pageSize: number;
  sort: ClientSortField;
  dir: SortDirection;
  q: string;
}

/** A client's history for the owner: commissions, the quotes sent on them, the payments that moved money. */
export const clientRecordSchema = z.object({
  commissions: z.array(z.object({ id: z.number(), title: z.string(), stage: z.string(), deadline: z.nullable(z.string()), createdAt: z.string() })),
  quotes: z.array(z.object({ id: z.number(), commissionId: z.number(), version: z.number(), status: z.string(), totalPence: z.nullable(z.number()), sentAt: z.nullable(z.string()), acceptedAt: z.nullable(z.string()) })),
  payments: z.array(
    z.object({
      id: z.number(),
      commissionId: z.number(),
      kind: z.string(),
      amountPence: z.number(),
      receivedPence: z.nullable(z.number()),
      status: z.string(),
      method: z.string(),
      reference: z.nullable(z.string()),
      paidAt: z.nullable(z.string()),
      receiptNumber: z.nullable(z.number()),
    }),
  ),
});
export type ClientRecord = z.infer<typeof clientRecordSchema>;
