/**
 * The leg profile file and its JSON Schema. References: JSON Schema draft 2020-12 (json-schema.org), checked with
 * ajv's 2020-12 validator (npm `ajv`, the reference JavaScript implementation); date-time as RFC 3339 §5.6.
 */
import fs from 'node:fs';
import Ajv2020 from 'ajv/dist/2020';
import { wicket, burrow, skitter } from '../../seeds/characters';
import { LEG_PROFILE_SCHEMA_FILE } from '../../server/cli/leg-profile-schema';
import { exportLegProfile, legProfileJsonSchema, legProfileJsonSchemaText, LegProfileError, parseLegProfile } from '../../engine/profile/export';
import { LEG_PROFILE_SCHEMA_ID, type LegProfile } from '../../engine/profile/schema';
import { demoCharacter, profileOf } from './profile/fixtures';

// RFC 3339 §5.6 date-time (upper-case T and Z as zod writes them).
const RFC3339 = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?(Z|[+-]\d{2}:\d{2})$/;

function validator() {
  const ajv = new Ajv2020({ strict: true, allErrors: true });
  ajv.addFormat('date-time', RFC3339);
  return ajv.compile(legProfileJsonSchema());
}

let profiles: LegProfile[];
beforeAll(async () => {
  profiles = [];
  for (const design of [wicket, burrow, skitter]) profiles.push(profileOf(await demoCharacter(design)));
});

/** The same object with every key order reversed, recursively. */
function reversed(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(reversed);
  if (v && typeof v === 'object') return Object.fromEntries(Object.entries(v).reverse().map(([k, x]) => [k, reversed(x)]));
  return v;
}

describe('the leg profile JSON Schema', () => {
  it('is draft 2020-12 with the profile schema id', () => {
    const schema = legProfileJsonSchema();
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.$id).toBe(LEG_PROFILE_SCHEMA_ID);
  });

  it('is kept in the repository as generated (run server/cli/leg-profile-schema.ts after changing the schema)', () => {
    expect(fs.readFileSync(LEG_PROFILE_SCHEMA_FILE, 'utf8')).toBe(legProfileJsonSchemaText());
  });

  it('accepts every exported demo profile', () => {
    const validate = validator();
    for (const p of profiles) {
      const file = JSON.parse(exportLegProfile(p));
      const ok = validate(file);
      expect(validate.errors ?? []).toEqual([]);
      expect(ok).toBe(true);
    }
  });

  it('refuses what the zod schema refuses', () => {
    const validate = validator();
    const bad = [
      { ...profiles[0], version: 0 },
      { ...profiles[0], schema: 'something-else' },
      { ...profiles[0], character: { name: 'Wicket', sha256: 'XYZ' } },
      { ...profiles[0], publishedAt: 'yesterday' },
      { ...profiles[0], legSetup: { ...profiles[0].legSetup, solver: { ...profiles[0].legSetup.solver, method: 'guess' } } },
    ];
    for (const b of bad) {
      expect(validate(b)).toBe(false);
      expect(() => parseLegProfile(b)).toThrow(LegProfileError);
    }
  });
});

describe('the exported file', () => {
  it('has a stable key order whatever order the object was built in, and drops unknown keys', () => {
    const p = profiles[1];
    const text = exportLegProfile(p);
    expect(exportLegProfile(reversed(p))).toBe(text);
    expect(exportLegProfile({ ...p, extra: 1 })).toBe(text);
    expect(Object.keys(JSON.parse(text)).slice(0, 3)).toEqual(['schema', 'profileId', 'version']);
  });

  it('carries the schema id and version, and the rig mapping by joint names', () => {
    const file = JSON.parse(exportLegProfile(profiles[0]));
    expect(file.schema).toBe(LEG_PROFILE_SCHEMA_ID);
    expect(file.version).toBe(1);
    const names = file.rig.legs.flatMap((l: { joints: { joint: string }[]; end: string }) => [...l.joints.map((j) => j.joint), l.end]);
    expect(names).toEqual(expect.arrayContaining(['thigh_L', 'shin_L', 'thigh_R']));
    expect(names.every((n: unknown) => typeof n === 'string')).toBe(true);
  });

  it('names the field of a bad profile', () => {
    expect(() => parseLegProfile({ ...profiles[0], notes: 5 })).toThrow(/notes/);
  });
});
