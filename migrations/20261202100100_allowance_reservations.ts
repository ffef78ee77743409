import type { Knex } from 'knex';

/**
 * Monthly allowance held for a job from the moment it is accepted: it counts as used while the job is queued or
 * running, turns into recorded use (what the job actually ran) when it finishes, and counts for nothing once the
 * job failed or was cancelled.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('allowance_reservations', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('kind', 32).notNullable();
    t.string('month', 7).notNullable();
    t.integer('amount').notNullable();
    t.integer('job_id').nullable().references('jobs.id').onDelete('CASCADE');
    t.bigInteger('created_at').notNullable();
    t.bigInteger('settled_at').nullable();
    t.integer('used').nullable();
    t.index(['team_id', 'kind', 'month']);
    t.index(['job_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('allowance_reservations');
}
