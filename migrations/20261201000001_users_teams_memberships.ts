import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('email', 254).notNullable().unique();
    t.string('name', 80).notNullable();
    t.string('password_hash').notNullable();
    // A session is valid only while it carries this number: "sign out everywhere" and password resets raise it.
    t.integer('session_generation').notNullable().defaultTo(0);
    t.bigInteger('created_at').notNullable();
  });
  await knex.schema.createTable('teams', (t) => {
    t.increments('id').primary();
    t.string('name', 80).notNullable();
    t.bigInteger('created_at').notNullable();
  });
  await knex.schema.createTable('memberships', (t) => {
    t.integer('team_id').notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('role', 16).notNullable().checkIn(['owner', 'designer', 'programmer', 'art_lead']);
    t.bigInteger('created_at').notNullable();
    t.primary(['team_id', 'user_id']);
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('memberships');
  await knex.schema.dropTable('teams');
  await knex.schema.dropTable('users');
}
