import type { Knex } from 'knex';

const list = (values: readonly string[]) => values.map((v) => `'${v}'`).join(', ');

export const COMMISSION_KINDS = ['memory_quilt', 'cushion', 'wall_hanging', 'baby_quilt', 'other'] as const;
export const AGE_GROUPS = ['baby_under_1', 'child_under_3', 'child', 'adult'] as const;
const STAGES = ['enquiry', 'quoted', 'booked', 'garments_in', 'preparation', 'cutting', 'piecing', 'quilting', 'binding', 'ready', 'delivered', 'cancelled'];
const WORK_STAGES = STAGES.filter((s) => s !== 'cancelled');
const CUSTODY = ['announced', 'received', 'washed', 'stored', 'moved', 'cut', 'returned', 'withdrawn', 'correction'];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('commissions', (t) => {
    t.increments('id').primary();
    t.integer('client_id').notNullable().references('id').inTable('clients').onDelete('RESTRICT');
    t.string('title', 200).notNullable();
    t.string('kind', 20).notNullable();
    t.string('recipient', 200);
    t.string('age_group', 20).notNullable().defaultTo('adult');
    t.string('occasion', 200);
    t.string('size_preset', 60);
    // Exact lengths in millimetres (numeric keeps every digit of an inch fraction).
    t.decimal('width_mm', null);
    t.decimal('length_mm', null);
    t.date('deadline');
    t.integer('budget_pence');
    t.text('notes');
    t.string('stage', 20).notNullable().defaultTo('enquiry');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['client_id']);
    t.index(['stage', 'deadline']);
  });
  await knex.raw(`ALTER TABLE commissions ADD CONSTRAINT commissions_kind_check CHECK (kind IN (${list(COMMISSION_KINDS)}))`);
  await knex.raw(`ALTER TABLE commissions ADD CONSTRAINT commissions_age_check CHECK (age_group IN (${list(AGE_GROUPS)}))`);
  await knex.raw(`ALTER TABLE commissions ADD CONSTRAINT commissions_stage_check CHECK (stage IN (${list(STAGES)}))`);
  await knex.raw('ALTER TABLE commissions ADD CONSTRAINT commissions_size_check CHECK ((width_mm IS NULL OR width_mm > 0) AND (length_mm IS NULL OR length_mm > 0))');

  await knex.schema.createTable('stage_moves', (t) => {
    t.increments('id').primary();
    t.integer('commission_id').notNullable().references('id').inTable('commissions').onDelete('CASCADE');
    t.string('from_stage', 20);
    t.string('to_stage', 20).notNullable();
    t.text('note');
    t.integer('moved_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('moved_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['commission_id', 'moved_at']);
  });

  await knex.schema.createTable('hours_logged', (t) => {
    t.increments('id').primary();
    t.integer('commission_id').notNullable().references('id').inTable('commissions').onDelete('CASCADE');
    t.string('stage', 20).notNullable();
    t.decimal('hours', 6, 2).notNullable();
    t.date('worked_on').notNullable();
    t.text('note');
    t.integer('user_id').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['commission_id']);
  });
  await knex.raw(`ALTER TABLE hours_logged ADD CONSTRAINT hours_stage_check CHECK (stage IN (${list(WORK_STAGES)}))`);
  await knex.raw('ALTER TABLE hours_logged ADD CONSTRAINT hours_positive_check CHECK (hours > 0 AND hours <= 24)');

  await knex.schema.createTable('garments', (t) => {
    t.increments('id').primary();
    t.integer('commission_id').notNullable().references('id').inTable('commissions').onDelete('RESTRICT');
    t.string('description', 300).notNullable();
    t.string('whose', 200);
    t.text('story');
    t.string('fibre', 20).notNullable().defaultTo('cotton');
    t.string('construction', 10).notNullable().defaultTo('woven');
    t.string('colour', 100);
    t.string('print', 20).notNullable().defaultTo('plain');
    t.text('condition');
    t.jsonb('features').notNullable().defaultTo('[]');
    t.string('prewash', 20).notNullable().defaultTo('not_washed');
    t.string('colour_run', 20).notNullable().defaultTo('untested');
    t.text('returns_to_client');
    t.integer('created_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['commission_id']);
  });

  await knex.schema.createTable('custody_events', (t) => {
    t.increments('id').primary();
    t.integer('garment_id').notNullable().references('id').inTable('garments').onDelete('RESTRICT');
    t.string('kind', 20).notNullable();
    t.string('place', 60);
    t.string('return_method', 20);
    t.string('tracking_ref', 60);
    t.text('note');
    t.integer('corrects_event_id').references('id').inTable('custody_events');
    t.integer('user_id').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['garment_id', 'at']);
  });
  await knex.raw(`ALTER TABLE custody_events ADD CONSTRAINT custody_kind_check CHECK (kind IN (${list(CUSTODY)}))`);
  // Custody is append-only: the database itself refuses to change or remove an event.
  await knex.raw(`
    CREATE FUNCTION custody_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'custody events are append-only: record a correction instead' USING ERRCODE = 'P0001';
    END $$`);
  await knex.raw(`CREATE TRIGGER custody_events_no_change BEFORE UPDATE OR DELETE ON custody_events
    FOR EACH ROW EXECUTE FUNCTION custody_events_append_only()`);

  await knex.schema.createTable('panels', (t) => {
    t.increments('id').primary();
    t.integer('garment_id').notNullable().references('id').inTable('garments').onDelete('CASCADE');
    t.string('name', 60).notNullable();
    t.decimal('width_mm', null).notNullable();
    t.decimal('height_mm', null).notNullable();
    t.string('grain', 12).notNullable().defaultTo('vertical');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['garment_id']);
  });
  await knex.raw('ALTER TABLE panels ADD CONSTRAINT panels_size_check CHECK (width_mm > 0 AND height_mm > 0)');

  await knex.schema.createTable('photos', (t) => {
    t.increments('id').primary();
    t.integer('commission_id').notNullable().references('id').inTable('commissions').onDelete('RESTRICT');
    t.integer('garment_id').references('id').inTable('garments').onDelete('RESTRICT');
    t.string('kind', 12).notNullable();
    t.string('file_name', 80).notNullable().unique();
    t.string('thumb_name', 80).notNullable().unique();
    t.string('original_name', 255);
    t.string('mime', 40).notNullable();
    t.integer('width').notNullable();
    t.integer('height').notNullable();
    t.integer('bytes').notNullable();
    t.string('caption', 500);
    t.integer('uploaded_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['commission_id']);
    t.index(['garment_id']);
  });

  await knex.schema.createTable('stock_fabrics', (t) => {
    t.increments('id').primary();
    t.string('name', 200).notNullable();
    t.string('colour', 100);
    t.string('fibre', 20).notNullable().defaultTo('cotton');
    t.decimal('width_mm', null).notNullable();
    t.decimal('length_mm', null).notNullable();
    t.integer('cost_pence');
    t.string('cost_unit', 6).notNullable().defaultTo('metre');
    t.string('supplier', 300);
    t.text('notes');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('stock_fabrics');
  await knex.schema.dropTable('photos');
  await knex.schema.dropTable('panels');
  await knex.raw('DROP TRIGGER custody_events_no_change ON custody_events');
  await knex.schema.dropTable('custody_events');
  await knex.raw('DROP FUNCTION custody_events_append_only()');
  await knex.schema.dropTable('garments');
  await knex.schema.dropTable('hours_logged');
  await knex.schema.dropTable('stage_moves');
  await knex.schema.dropTable('commissions');
}
