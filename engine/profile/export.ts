/** The profile as a file: stable key order (the schema's), and the JSON Schema generated from the same zod schema. */
import { z } from 'zod';
import { parseOrThrow } from '../course/parse';
import { LEG_PROFILE_SCHEMA_ID, LegProfileSchema, type LegProfile } from './schema';

export class LegProfileError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LegProfileError';
  }
}

/** Validates unknown input as a leg profile; the error names every problem and where it is. */
export function parseLegProfile(input: unknown): LegProfile {
  return parseOrThrow(LegProfileSchema, input, 'leg profile', (m) => new LegProfileError(m));
}

/**
 * The file's text: parsing rebuilds every object in the schema's key order, so the same profile always gives
 * the same bytes however its object was put together (and unknown keys are dropped).
 */
export function exportLegProfile(profile: unknown): string {
  return `${JSON.stringify(parseLegProfile(profile), null, 2)}\n`;
}

/** JSON Schema (draft 2020-12) of the leg profile file. */
export function legProfileJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(LegProfileSchema, { target: 'draft-2020-12', io: 'output', unrepresentable: 'throw' }) as Record<string, unknown>;
  const { $schema, ...rest } = generated;
  return {
    $schema,
    $id: LEG_PROFILE_SCHEMA_ID,
    title: 'Treadle leg profile',
    description: 'A published, immutable version of one character\'s leg setup with its rig mapping by joint names and the metrics it earned on its suite.',
    ...rest,
  };
}

/** The schema as the repository keeps it and the server serves it. */
export function legProfileJsonSchemaText(): string {
  return `${JSON.stringify(legProfileJsonSchema(), null, 2)}\n`;
}
