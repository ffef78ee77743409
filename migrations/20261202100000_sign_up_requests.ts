import type { Knex } from 'knex';

/** A sign-up waits here until its address is confirmed by the link mailed to it; then the account is made. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sign_up_requests', (t) => {
    t.increments('id').primary();
    t.string('email', 254).notNullable();
    t.string('name', 80).notNullable();
    t.string('team_name', 80).notNullable();
    t.string('password_hash', 100).notNullable();
    // Only the SHA-256 of the link's token is kept, so a copy of the database confirms nothing.
    t.string('token_hash', 64).notNullable().unique();
    t.bigInteger('created_at').notNullable();
    t.bigInteger('expires_at').notNullable();
    t.bigInteger('used_at');
    t.index(['email']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sign_up_requests');
}
