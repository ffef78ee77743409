import type { Knex } from 'knex';

/** Uploaded characters: one row per team and file (the file itself lives content-addressed under the data folder). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('characters', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('name', 60).notNullable();
    t.string('file_name', 255).notNullable();
    t.string('format', 8).notNullable().checkIn(['glb', 'gltf']);
    t.string('sha256', 64).notNullable();
    t.integer('byte_size').notNullable();
    t.integer('joint_count').notNullable();
    t.integer('leg_count').notNullable();
    // JSON: the imported skeleton (joints with rest transforms), the legs as detected, the legs in use, the import report.
    t.text('skeleton_json').notNullable();
    t.text('detected_legs_json').notNullable();
    t.text('legs_json').notNullable();
    t.boolean('legs_edited').notNullable().defaultTo(false);
    t.text('report_json').notNullable();
    t.integer('uploaded_by').notNullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.bigInteger('updated_at').notNullable();
    t.unique(['team_id', 'sha256']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('characters');
}
