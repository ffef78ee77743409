/**
 * Writes assets/schema/leg-profile.schema.json from the zod schema (the text GET /api/schema/leg-profile.json
 * serves). Run after changing the profile schema: `npx tsx server/cli/leg-profile-schema.ts`;
 * tests/engine/profile-schema.test.ts fails while the file in the repository differs.
 */
import fs from 'node:fs';
import path from 'node:path';
import { legProfileJsonSchemaText } from '../../engine/profile/export';

export const LEG_PROFILE_SCHEMA_FILE = path.join(__dirname, '..', '..', 'assets', 'schema', 'leg-profile.schema.json');

if (require.main === module) {
  fs.mkdirSync(path.dirname(LEG_PROFILE_SCHEMA_FILE), { recursive: true });
  fs.writeFileSync(LEG_PROFILE_SCHEMA_FILE, legProfileJsonSchemaText());
  console.log(`wrote ${path.relative(process.cwd(), LEG_PROFILE_SCHEMA_FILE)}`);
}
