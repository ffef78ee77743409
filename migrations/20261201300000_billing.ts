import type { Knex } from 'knex';

/**
 * Each team's plan and its subscription as the payment service last told us. No row means the free plan.
 * Provider times (period end, subscription created) are kept in the provider's epoch seconds.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('team_billing', (t) => {
    t.integer('team_id').primary().references('teams.id').onDelete('CASCADE');
    t.string('plan', 16).notNullable().defaultTo('solo').checkIn(['solo', 'crew', 'studio']);
    t.string('status', 24).notNullable().defaultTo('free');
    t.string('customer_id', 64).unique();
    t.string('subscription_id', 64);
    t.string('subscription_item_id', 64);
    t.bigInteger('subscription_created');
    t.bigInteger('current_period_end');
    t.boolean('cancel_at_period_end').notNullable().defaultTo(false);
    t.bigInteger('updated_at').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('team_billing');
}
