import type { Knex } from 'knex';

/** The team's invoices as the payment service reported them (amounts in minor units, times in epoch seconds). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('billing_invoices', (t) => {
    t.string('id', 64).primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('number', 64);
    t.string('status', 24).notNullable();
    t.string('description', 200).notNullable();
    t.integer('total').notNullable();
    t.integer('amount_paid').notNullable();
    t.string('currency', 8).notNullable();
    t.bigInteger('created').notNullable();
    t.bigInteger('period_start').notNullable();
    t.bigInteger('period_end').notNullable();
    t.index(['team_id', 'created']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('billing_invoices');
}
