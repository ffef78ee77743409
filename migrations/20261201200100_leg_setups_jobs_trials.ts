import type { Knex } from 'knex';

/**
 * Leg setups (versions per character, JSON of the engine's LegSetupSchema), background jobs (trials and
 * dial-ins run off the request thread) and the trials they store (metrics and the compact series).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('leg_setups', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('character_id').notNullable().references('characters.id').onDelete('CASCADE');
    // Counts per character from 1; never reused.
    t.integer('version').notNullable();
    // JSON of LegSetupSchema (engine/gait/leg-setup.ts).
    t.text('setup').notNullable();
    t.string('note', 200).notNullable().defaultTo('');
    // 'form' (saved by hand), 'dial-in' (an accepted dial-in), 'seed'.
    t.string('source', 16).notNullable().defaultTo('form');
    t.integer('created_by').notNullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.unique(['character_id', 'version']);
    t.index(['team_id']);
  });
  await knex.schema.createTable('jobs', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('kind', 16).notNullable().checkIn(['trial', 'dial-in']);
    t.string('status', 16).notNullable().checkIn(['queued', 'running', 'done', 'failed', 'cancelled']);
    t.integer('progress').notNullable().defaultTo(0);
    t.text('input').notNullable();
    t.text('result').nullable();
    t.text('error').nullable();
    t.integer('created_by').notNullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.bigInteger('started_at').nullable();
    t.bigInteger('finished_at').nullable();
    t.bigInteger('updated_at').notNullable();
    t.index(['status']);
    t.index(['team_id', 'status']);
  });
  await knex.schema.createTable('trials', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('character_id').notNullable().references('characters.id').onDelete('CASCADE');
    // The saved version run, or null when the trial ran an unsaved setup (kept in `setup` either way).
    t.integer('leg_setup_id').nullable().references('leg_setups.id').onDelete('SET NULL');
    t.text('setup').notNullable();
    // The course may be deleted later; its name and version stay with the trial.
    t.integer('course_id').nullable().references('courses.id').onDelete('SET NULL');
    t.string('course_name', 80).notNullable();
    t.integer('course_version').notNullable();
    t.integer('job_id').nullable().references('jobs.id').onDelete('SET NULL');
    // JSON of TrialMetricsSchema (engine/metrics/trial-metrics.ts) and of the leg names in rig order.
    t.text('metrics').notNullable();
    t.text('leg_names').notNullable();
    // JSON of SeriesEncodingSchema (engine/gait/series-encoding.ts).
    t.text('series').notNullable();
    t.float('footing_score').notNullable();
    t.integer('created_by').notNullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.index(['team_id', 'character_id']);
    t.index(['job_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('trials');
  await knex.schema.dropTable('jobs');
  await knex.schema.dropTable('leg_setups');
}
