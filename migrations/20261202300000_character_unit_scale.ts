import type { Knex } from 'knex';

/**
 * The unit fix of a character: one uniform factor that brings the file's lengths to metres (0.01 for a file
 * authored in centimetres, 0.001 for millimetres, or a custom one). The uploaded file is kept as it came; the
 * factor is applied wherever the skeleton is read (trials, the 3D view, the profile's rig mapping, the runtime).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('characters', (t) => {
    t.double('unit_scale').notNullable().defaultTo(1);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('characters', (t) => {
    t.dropColumn('unit_scale');
  });
}
