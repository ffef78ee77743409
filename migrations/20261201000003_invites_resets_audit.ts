import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invites', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.string('email', 254).notNullable();
    t.string('role', 16).notNullable().checkIn(['owner', 'designer', 'programmer', 'art_lead']);
    // Only the SHA-256 of the link's token is kept, so a copy of the database opens no invite.
    t.string('token_hash', 64).notNullable().unique();
    t.integer('invited_by').notNullable().references('users.id');
    t.bigInteger('created_at').notNullable();
    t.bigInteger('expires_at').notNullable();
    t.bigInteger('accepted_at');
    t.bigInteger('revoked_at');
    t.index(['team_id']);
  });
  await knex.schema.createTable('password_resets', (t) => {
    t.increments('id').primary();
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.bigInteger('created_at').notNullable();
    t.bigInteger('expires_at').notNullable();
    t.bigInteger('used_at');
  });
  await knex.schema.createTable('audit_log', (t) => {
    t.increments('id').primary();
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('actor_user_id').references('users.id').onDelete('SET NULL');
    t.string('action', 48).notNullable();
    t.string('subject', 254).notNullable();
    t.text('detail').notNullable().defaultTo('');
    t.bigInteger('created_at').notNullable();
    t.index(['team_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_log');
  await knex.schema.dropTable('password_resets');
  await knex.schema.dropTable('invites');
}
