import type { Knex } from 'knex';

/**
 * Courses (a heightfield per row, stored as the engine's course encoding) and suites (ordered sets of courses).
 * `version` counts saves: an edit based on an older version is refused so no one's work is overwritten silently.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('courses', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('name', 80).notNullable();
    // JSON of CourseEncodingSchema (engine/course/encoding.ts).
    t.text('encoding').notNullable();
    // JSON of the generator recipe (engine CourseSpecSchema) the course was made from, or null.
    t.text('generator').nullable();
    t.integer('version').notNullable().defaultTo(1);
    // Grid figures kept beside the encoding so lists need not decode it.
    t.integer('cols').notNullable();
    t.integer('rows').notNullable();
    t.float('cell_size').notNullable();
    t.float('min_height').notNullable();
    t.float('max_height').notNullable();
    t.integer('created_by').notNullable().references('users.id');
    t.integer('updated_by').nullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.bigInteger('updated_at').notNullable();
    t.index(['team_id']);
  });
  await knex.schema.createTable('suites', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('name', 80).notNullable();
    t.integer('created_by').notNullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.bigInteger('updated_at').notNullable();
    t.index(['team_id']);
  });
  await knex.schema.createTable('suite_courses', (t) => {
    t.integer('suite_id').notNullable().references('suites.id').onDelete('CASCADE');
    t.integer('course_id').notNullable().references('courses.id');
    t.integer('position').notNullable();
    t.primary(['suite_id', 'position']);
    t.index(['course_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('suite_courses');
  await knex.schema.dropTable('suites');
  await knex.schema.dropTable('courses');
}
