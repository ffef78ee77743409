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
 * Decimals the leg setup of a published file keeps: 1 µm for lengths in metres, 1 µrad for
 * angles, 10⁻⁶ of a second or a ratio. Finer digits are float noise (0.065 written as 0.06500000000000002): the
 * solver and the trials work far above that resolution, and the schema states it so readers need not guess.
 * The rig mapping keeps full precision: it is the character's own geometry, and a game binding it must walk
 * bit for bit as Treadle's trials did. The metrics come already rounded (engine/profile/suite-metrics.ts).
 */
export const PROFILE_DECIMALS = 6;

const SCALE = 10 ** PROFILE_DECIMALS;

/** Every number in a JSON value rounded to PROFILE_DECIMALS (integers and strings untouched; −0 becomes 0). */
export function roundProfileNumbers<T>(value: T): T {
  if (typeof value === 'number') return (Number.isInteger(value) ? value : Math.round(value * SCALE) / SCALE + 0) as T;
  if (Array.isArray(value)) return value.map(roundProfileNumbers) as T;
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, roundProfileNumbers(v)])) as T;
  }
  return value;
}

/**
 * The file's text: parsing rebuilds every object in the schema's key order, so the same profile always gives
 * the same bytes however its object was put together (and unknown keys are dropped); the leg setup's numbers
 * are rounded to PROFILE_DECIMALS.
 */
export function exportLegProfile(profile: unknown): string {
  const parsed = parseLegProfile(profile);
  const rounded = { ...parsed, legSetup: roundProfileNumbers(parsed.legSetup) };
  return `${JSON.stringify(rounded, null, 2)}\n`;
}

/** JSON Schema (draft 2020-12) of the leg profile file. */
export function legProfileJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(LegProfileSchema, { target: 'draft-2020-12', io: 'output', unrepresentable: 'throw' }) as Record<string, unknown>;
  const { $schema, ...rest } = generated;
  return {
    $schema,
    $id: LEG_PROFILE_SCHEMA_ID,
    title: 'Treadle leg profile',
    description: `A published, immutable version of one character's leg setup with its rig mapping by joint names and the metrics it earned on its suite. The numbers of legSetup carry at most ${PROFILE_DECIMALS} decimals (1 µm, 1 µrad): finer differences are not meaningful. The rig keeps the character's geometry at full precision.`,
    ...rest,
  };
}

/** The schema as the repository keeps it and the server serves it. */
export function legProfileJsonSchemaText(): string {
  return `${JSON.stringify(legProfileJsonSchema(), null, 2)}\n`;
}
