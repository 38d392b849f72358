import type { Knex } from 'knex';

/**
 * Payments the owner has to look at: one whose amount differs from what was
 * asked is held for review, and one that arrives for something already paid
 * is recorded as an overpayment and refunded. A held payment counts as the
 * one payment of its kind, so nothing else of that kind can be marked paid
 * beside it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('payments', (t) => {
    // What the provider says was paid; it counts instead of amount_pence (what was asked) once set.
    t.integer('received_pence');
    // Why a refunded payment went back: 'cancelled', 'overpaid' or 'amount_mismatch'.
    t.string('refund_reason', 20);
  });
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_status_check`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_status_check CHECK (status IN ('pending', 'paid', 'held', 'overpaid', 'failed', 'expired', 'refunded'))`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_refund_reason_check CHECK (refund_reason IS NULL OR refund_reason IN ('cancelled', 'overpaid', 'amount_mismatch'))`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_received_check CHECK (received_pence IS NULL OR received_pence >= 0)`);
  await knex.raw(`DROP INDEX payments_one_paid_per_kind`);
  await knex.raw(`CREATE UNIQUE INDEX payments_one_paid_per_kind ON payments (commission_id, kind) WHERE status IN ('paid', 'held')`);
  // Finding a commission's open checkout of a kind.
  await knex.raw(`CREATE INDEX payments_open_checkouts ON payments (commission_id, kind) WHERE status = 'pending'`);
}

export async function down(knex: Knex): Promise<void> {
  // Held and overpaid payments have no place in the older states: they are settled first, not guessed at.
  const open = await knex('payments').whereIn('status', ['held', 'overpaid']).pluck('id');
  if (open.length > 0) throw new Error(`Payments ${open.join(', ')} are held or overpaid: accept or refund them before rolling back.`);
  await knex.raw(`DROP INDEX payments_open_checkouts`);
  await knex.raw(`DROP INDEX payments_one_paid_per_kind`);
  await knex.raw(`CREATE UNIQUE INDEX payments_one_paid_per_kind ON payments (commission_id, kind) WHERE status = 'paid'`);
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_received_check`);
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_refund_reason_check`);
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_status_check`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_status_check CHECK (status IN ('pending', 'paid', 'failed', 'expired', 'refunded'))`);
  await knex.schema.alterTable('payments', (t) => {
    t.dropColumn('refund_reason');
    t.dropColumn('received_pence');
  });
}
