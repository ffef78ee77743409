import type { Knex } from 'knex';

/**
 * Leg profiles (one per character), their published versions, and read-only API tokens.
 *
 * A published version is what game builds pin and check against, so the database refuses to change it:
 * a trigger aborts every UPDATE, and every DELETE too — deleting version 3 would silently turn a build's
 * "latest" back into version 2 and break builds pinned to 3. Characters with published profiles therefore
 * cannot be deleted either (the foreign keys do not cascade). Retiring a studio's data is a deliberate
 * maintenance step that drops these triggers first.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('profiles', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id');
    t.integer('character_id').notNullable().references('characters.id');
    t.bigInteger('created_at').notNullable();
    t.unique(['character_id']);
    t.index(['team_id']);
  });
  await knex.schema.createTable('profile_versions', (t) => {
    t.increments('id').primary();
    t.integer('profile_id').notNullable().references('profiles.id');
    t.integer('team_id').notNullable().references('teams.id');
    t.integer('version').notNullable();
    // The exported file exactly as served (stable key order); its sha256 is the ETag.
    t.text('document').notNullable();
    t.string('sha256', 64).notNullable();
    t.string('character_sha256', 64).notNullable();
    t.integer('suite_id').nullable();
    t.integer('leg_setup_id').nullable();
    t.float('footing_score').notNullable();
    t.text('notes').notNullable();
    t.integer('author_id').notNullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.unique(['profile_id', 'version']);
    t.index(['team_id']);
  });
  await knex.raw(`
    CREATE TRIGGER profile_versions_no_update BEFORE UPDATE ON profile_versions
    BEGIN SELECT RAISE(ABORT, 'profile versions are immutable: publish a new version instead'); END`);
  await knex.raw(`
    CREATE TRIGGER profile_versions_no_delete BEFORE DELETE ON profile_versions
    BEGIN SELECT RAISE(ABORT, 'profile versions are immutable: game builds may pin this version'); END`);

  await knex.schema.createTable('api_tokens', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('name', 60).notNullable();
    // SHA-256 of the token; the token itself is shown once and never stored.
    t.string('hash', 64).notNullable().unique();
    t.integer('created_by').notNullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.bigInteger('last_used_at').nullable();
    t.bigInteger('revoked_at').nullable();
    t.index(['team_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('api_tokens');
  await knex.raw('DROP TRIGGER IF EXISTS profile_versions_no_delete');
  await knex.raw('DROP TRIGGER IF EXISTS profile_versions_no_update');
  await knex.schema.dropTable('profile_versions');
  await knex.schema.dropTable('profiles');
}
