import type { Knex } from 'knex';

/** Webhook events already handled, by the provider's event id, so a second delivery changes nothing. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('billing_events', (t) => {
    t.string('id', 64).primary();
    t.string('type', 64).notNullable();
    t.integer('team_id').references('teams.id').onDelete('SET NULL');
    /** What handling it did: applied, or why it was set aside. */
    t.string('outcome', 32).notNullable();
    t.bigInteger('received_at').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('billing_events');
}
