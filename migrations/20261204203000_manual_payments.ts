import type { Knex } from 'knex';

/**
 * Money that does not come through the card checkout: the owner records a
 * cash or bank-transfer payment with the day it arrived and a reference. Every
 * payment that counts gets a receipt number, from one sequence, in the order
 * the money counted. A payment recorded by hand can be undone by the owner
 * with a note: it then no longer counts, its row and receipt number stay.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('payments', (t) => {
    t.string('method', 20).notNullable().defaultTo('card');
    t.string('reference', 100);
    t.date('received_on');
    t.integer('receipt_number').unique();
    t.integer('recorded_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('undone_at', { useTz: true });
    t.integer('undone_by').references('id').inTable('users').onDelete('SET NULL');
    t.text('undo_note');
  });
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_method_check CHECK (method IN ('card', 'cash', 'bank_transfer'))`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_manual_check CHECK (method = 'card' OR (received_on IS NOT NULL AND checkout_session_id IS NULL))`);
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_status_check`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_status_check CHECK (status IN ('pending', 'paid', 'held', 'overpaid', 'failed', 'expired', 'refunded', 'undone'))`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_undone_check CHECK (status <> 'undone' OR (method <> 'card' AND undone_at IS NOT NULL AND undo_note IS NOT NULL))`);
  await knex.raw(`CREATE SEQUENCE payment_receipt_numbers OWNED BY payments.receipt_number`);
  // Payments that counted before receipts were numbered get theirs in the order they were paid.
  await knex.raw(`
    UPDATE payments SET receipt_number = numbered.n
    FROM (SELECT id, nextval('payment_receipt_numbers') AS n FROM (SELECT id FROM payments WHERE status IN ('paid', 'refunded') AND paid_at IS NOT NULL ORDER BY paid_at, id) ordered) numbered
    WHERE payments.id = numbered.id`);
}

export async function down(knex: Knex): Promise<void> {
  // Payments recorded by hand have no place in the older table: they are removed (their money is the owner's own record).
  await knex('payments').whereNot('method', 'card').delete();
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_undone_check`);
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_status_check`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_status_check CHECK (status IN ('pending', 'paid', 'held', 'overpaid', 'failed', 'expired', 'refunded'))`);
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_manual_check`);
  await knex.raw(`ALTER TABLE payments DROP CONSTRAINT payments_method_check`);
  await knex.schema.alterTable('payments', (t) => {
    t.dropColumn('undo_note');
    t.dropColumn('undone_by');
    t.dropColumn('undone_at');
    t.dropColumn('recorded_by');
    t.dropColumn('receipt_number');
    t.dropColumn('received_on');
    t.dropColumn('reference');
    t.dropColumn('method');
  });
}
