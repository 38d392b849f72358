import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // The studio's own settings: one row.
  await knex.schema.createTable('studio_settings', (t) => {
    t.integer('id').primary().defaultTo(1);
    t.string('studio_name', 200).notNullable().defaultTo('My quilt studio');
    t.string('maker_name', 200).notNullable().defaultTo('');
    t.text('address').notNullable().defaultTo('');
    t.string('email', 254);
    t.integer('hourly_rate_pence').notNullable().defaultTo(2500);
    t.boolean('vat_registered').notNullable().defaultTo(false);
    t.string('vat_rate', 4).notNullable().defaultTo('20');
    t.string('vat_mode', 10).notNullable().defaultTo('line');
    t.string('vat_number', 20);
    t.decimal('deposit_percent', 5, 2).notNullable().defaultTo(30);
    t.integer('validity_days').notNullable().defaultTo(30);
    t.text('payment_terms').notNullable().defaultTo('A deposit secures your place in the workroom diary; the balance is due before delivery.');
    t.jsonb('block_minutes').notNullable().defaultTo('{}');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`ALTER TABLE studio_settings ADD CONSTRAINT studio_settings_one_row CHECK (id = 1)`);
  await knex.raw(`ALTER TABLE studio_settings ADD CONSTRAINT studio_settings_vat_check CHECK (vat_rate IN ('20', '5', '0') AND vat_mode IN ('line', 'invoice'))`);
  await knex('studio_settings').insert({ id: 1 });

  await knex.schema.createTable('quotes', (t) => {
    t.increments('id').primary();
    t.integer('commission_id').notNullable().references('id').inTable('commissions').onDelete('RESTRICT');
    t.integer('version').notNullable();
    t.string('status', 12).notNullable().defaultTo('draft');
    t.text('intro');
    t.date('valid_until');
    t.decimal('deposit_percent', 5, 2).notNullable();
    t.string('vat_rate', 4);
    t.string('vat_mode', 10).notNullable();
    // Totals frozen when the quote is sent.
    t.integer('net_pence');
    t.integer('vat_pence');
    t.integer('total_pence');
    t.integer('deposit_pence');
    t.jsonb('studio_snapshot');
    t.timestamp('sent_at', { useTz: true });
    t.timestamp('accepted_at', { useTz: true });
    t.string('accepted_name', 200);
    t.timestamp('declined_at', { useTz: true });
    t.text('decline_note');
    t.integer('created_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['commission_id', 'version']);
  });
  await knex.raw(`ALTER TABLE quotes ADD CONSTRAINT quotes_status_check CHECK (status IN ('draft', 'sent', 'accepted', 'declined', 'superseded'))`);

  await knex.schema.createTable('quote_lines', (t) => {
    t.increments('id').primary();
    t.integer('quote_id').notNullable().references('id').inTable('quotes').onDelete('CASCADE');
    t.integer('position').notNullable();
    t.string('kind', 12).notNullable();
    t.string('description', 300).notNullable();
    t.decimal('quantity', 12, 4).notNullable();
    t.string('unit', 20).notNullable().defaultTo('item');
    t.decimal('unit_price_pence', 14, 4).notNullable();
    t.string('stage', 20);
    t.index(['quote_id']);
  });
  await knex.raw(`ALTER TABLE quote_lines ADD CONSTRAINT quote_lines_kind_check CHECK (kind IN ('material', 'labour', 'extra', 'discount'))`);
  // A quote that has been sent is frozen: its lines cannot change.
  await knex.raw(`
    CREATE FUNCTION quote_lines_frozen() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE s text;
    BEGIN
      SELECT status INTO s FROM quotes WHERE id = COALESCE(NEW.quote_id, OLD.quote_id);
      IF s IS DISTINCT FROM 'draft' THEN
        RAISE EXCEPTION 'quote lines are frozen once the quote is sent' USING ERRCODE = 'P0001';
      END IF;
      RETURN COALESCE(NEW, OLD);
    END $$`);
  await knex.raw(`CREATE TRIGGER quote_lines_frozen BEFORE INSERT OR UPDATE OR DELETE ON quote_lines FOR EACH ROW EXECUTE FUNCTION quote_lines_frozen()`);

  await knex.schema.createTable('outbox_mails', (t) => {
    t.increments('id').primary();
    t.string('kind', 30).notNullable();
    t.string('to_address', 254).notNullable();
    t.string('subject', 300).notNullable();
    t.text('text_body').notNullable();
    t.text('html_body').notNullable();
    t.jsonb('attachments').notNullable().defaultTo('[]');
    t.integer('commission_id').references('id').inTable('commissions').onDelete('SET NULL');
    t.string('status', 10).notNullable().defaultTo('pending');
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('last_error');
    t.string('message_id', 200);
    t.timestamp('sent_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['status', 'next_attempt_at']);
  });

  await knex.schema.createTable('payments', (t) => {
    t.increments('id').primary();
    t.integer('commission_id').notNullable().references('id').inTable('commissions').onDelete('RESTRICT');
    t.integer('quote_id').notNullable().references('id').inTable('quotes').onDelete('RESTRICT');
    t.string('kind', 10).notNullable();
    t.integer('amount_pence').notNullable();
    t.string('status', 12).notNullable().defaultTo('pending');
    t.string('checkout_session_id', 200).unique();
    t.string('payment_intent_id', 200);
    t.string('refund_id', 200);
    t.timestamp('paid_at', { useTz: true });
    t.timestamp('refunded_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['commission_id']);
  });
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_kind_check CHECK (kind IN ('deposit', 'balance'))`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_status_check CHECK (status IN ('pending', 'paid', 'failed', 'expired', 'refunded'))`);
  await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_amount_check CHECK (amount_pence > 0)`);
  // One paid deposit and one paid balance per commission at most.
  await knex.raw(`CREATE UNIQUE INDEX payments_one_paid_per_kind ON payments (commission_id, kind) WHERE status = 'paid'`);

  await knex.schema.createTable('webhook_events', (t) => {
    t.string('id', 200).primary();
    t.string('type', 100).notNullable();
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('webhook_events');
  await knex.schema.dropTable('payments');
  await knex.schema.dropTable('outbox_mails');
  await knex.raw('DROP TRIGGER quote_lines_frozen ON quote_lines');
  await knex.schema.dropTable('quote_lines');
  await knex.raw('DROP FUNCTION quote_lines_frozen()');
  await knex.schema.dropTable('quotes');
  await knex.schema.dropTable('studio_settings');
}
