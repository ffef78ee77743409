import type { Knex } from 'knex';

/** Monthly allowances used (dial-in candidates, profile publishes), one row per team, kind and UTC month "YYYY-MM". */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('plan_usage', (t) => {
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('kind', 32).notNullable();
    t.string('month', 7).notNullable();
    t.integer('used').notNullable().defaultTo(0);
    t.primary(['team_id', 'kind', 'month']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('plan_usage');
}
