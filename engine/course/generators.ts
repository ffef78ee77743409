/**
 * Course generators: a course is a sequence of segments laid end to end along
 * +Z, each starting at the height where the previous one ended.
 * One segment gives a plain course (flat, ramp, stairs, rubble, curb, trench);
 * several give a mixed course.
 */
import { z } from 'zod';
import { createNoise2D, type NoiseFunction2D } from 'simplex-noise';
import { mulberry32 } from '../math/random';
import { CourseError, clampHeight, columnX, createHeightfield, type Heightfield } from './heightfield';
import { COURSE_LIMITS } from './limits';
import { parseOrThrow } from './parse';
import { WalkPathSchema, walkPathOutside } from './walk-path';

const length = z.number().min(0.05).max(1000).describe('segment length along the walk, m');

export const FlatSegmentSchema = z.object({ kind: z.literal('flat'), length });
export const RampSegmentSchema = z.object({
  kind: z.literal('ramp'),
  length,
  /** Positive climbs. */
  angleDeg: z.number().min(-45).max(45),
});
export const StairsSegmentSchema = z.object({
  kind: z.literal('stairs'),
  steps: z.number().int().min(1).max(500),
  riser: z.number().min(0.005).max(0.5).describe('rise per step, m'),
  tread: z.number().min(0.05).max(3).describe('run per step, m'),
  direction: z.enum(['up', 'down']).default('up'),
});
export const RubbleSegmentSchema = z.object({
  kind: z.literal('rubble'),
  length,
  amplitude: z.number().min(0).max(2).describe('largest height above or below the base, m'),
  featureSize: z.number().min(0.02).max(20).describe('typical lump size, m'),
  seed: z.number().int().min(0).max(0xffffffff),
  octaves: z.number().int().min(1).max(6).default(3),
});
export const CurbSegmentSchema = z.object({
  kind: z.literal('curb'),
  length,
  /** Step at mid-segment; negative steps down. */
  height: z.number().min(-1).max(1),
});
export const TrenchSegmentSchema = z.object({
  kind: z.literal('trench'),
  length,
  /** Trench across the whole course, centred in the segment. */
  width: z.number().min(0.01).max(100),
  depth: z.number().min(0).max(20),
});

export const CourseSegmentSchema = z
  .discriminatedUnion('kind', [
    FlatSegmentSchema,
    RampSegmentSchema,
    StairsSegmentSchema,
    RubbleSegmentSchema,
    CurbSegmentSchema,
    TrenchSegmentSchema,
  ])
  .superRefine((s, ctx) => {
    if (s.kind === 'trench' && s.width > s.length) {
      ctx.addIssue({ code: 'custom', message: `trench width ${s.width} m is longer than its segment (${s.length} m)`, path: ['width'] });
    }
  });

export const CourseSpecSchema = z.object({
  width: z.number().min(0.2).max(50).default(2).describe('lateral width, m'),
  cellSize: z.number().min(COURSE_LIMITS.minCellSize).max(COURSE_LIMITS.maxCellSize).default(0.05),
  segments: z.array(CourseSegmentSchema).min(1).max(256),
  /** The line the body walks (walk-path.ts); absent: straight ahead along +Z at x = 0. */
  walkPath: WalkPathSchema.optional(),
});

export type CourseSegment = z.infer<typeof CourseSegmentSchema>;
export type CourseSpec = z.infer<typeof CourseSpecSchema>;
export type CourseSpecInput = z.input<typeof CourseSpecSchema>;
export type CourseSegmentInput = z.input<typeof CourseSegmentSchema>;

/** IBC 2021 §1011.5.2: riser at most 7 in (178 mm), tread at least 11 in (279 mm). */
export const CODE_STAIRS = { riser: 0.178, tread: 0.279 } as const;

export function segmentLength(s: CourseSegment): number {
  return s.kind === 'stairs' ? s.steps * s.tread : s.length;
}

/** Height change from the start of a segment to its end. */
export function segmentRise(s: CourseSegment): number {
  switch (s.kind) {
    case 'flat':
    case 'rubble':
    case 'trench':
      return 0;
    case 'ramp':
      return Math.tan((s.angleDeg * Math.PI) / 180) * s.length;
    case 'stairs':
      return (s.direction === 'up' ? 1 : -1) * s.steps * s.riser;
    case 'curb':
      return s.height;
  }
}

function smoothstep(t: number): number {
  const c = t < 0 ? 0 : t > 1 ? 1 : t;
  return c * c * (3 - 2 * c);
}

/** Sum of octaves scaled so the result stays within [−1, 1]. */
function fractal(noise: NoiseFunction2D, x: number, z: number, octaves: number): number {
  let sum = 0;
  let norm = 0;
  let amp = 1;
  let freq = 1;
  for (let o = 0; o < octaves; o++) {
    sum += amp * noise(x * freq, z * freq);
    norm += amp;
    amp *= 0.5;
    freq *= 2;
  }
  return sum / norm;
}

/** Height of segment s at (x, local z) above its start height. */
function segmentHeight(s: CourseSegment, noise: NoiseFunction2D | null, x: number, zl: number): number {
  switch (s.kind) {
    case 'flat':
      return 0;
    case 'ramp':
      return Math.tan((s.angleDeg * Math.PI) / 180) * zl;
    case 'stairs': {
      const k = Math.min(s.steps, Math.floor(zl / s.tread) + 1);
      return (s.direction === 'up' ? 1 : -1) * k * s.riser;
    }
    case 'rubble': {
      // Fade in and out so the rubble meets its neighbours without a step.
      const fade = Math.min(s.featureSize, s.length / 4);
      const w = smoothstep(Math.min(zl, s.length - zl) / fade);
      return w * s.amplitude * fractal(noise!, x / s.featureSize, zl / s.featureSize, s.octaves);
    }
    case 'curb':
      return zl >= s.length / 2 ? s.height : 0;
    case 'trench': {
      const start = (s.length - s.width) / 2;
      return zl >= start && zl < start + s.width ? -s.depth : 0;
    }
  }
}

/** Build the heightfield of a course spec; bad specs throw a CourseError naming the problem. */
export function generateCourse(input: CourseSpecInput): Heightfield {
  const spec = parseOrThrow(CourseSpecSchema, input, 'course spec', (m) => new CourseError(m));
  const segs = spec.segments;
  const starts = new Float64Array(segs.length + 1);
  const bases = new Float64Array(segs.length + 1);
  for (let i = 0; i < segs.length; i++) {
    starts[i + 1] = starts[i] + segmentLength(segs[i]);
    bases[i + 1] = bases[i] + segmentRise(segs[i]);
    const s = segs[i];
    const lump = s.kind === 'rubble' ? s.amplitude : s.kind === 'trench' ? s.depth : 0;
    const peak = Math.max(Math.abs(bases[i]), Math.abs(bases[i + 1])) + lump;
    if (peak > COURSE_LIMITS.maxAbsHeight) {
      throw new CourseError(
        `segment ${i} (${s.kind}) leaves the height bound ±${COURSE_LIMITS.maxAbsHeight} m (reaches ${peak.toFixed(3)} m from the start height)`,
      );
    }
  }
  const total = starts[segs.length];
  const hf = createHeightfield(spec.width, total, spec.cellSize);
  const noises = segs.map((s) => (s.kind === 'rubble' ? createNoise2D(mulberry32(s.seed).next) : null));
  let seg = 0;
  for (let r = 0; r < hf.rows; r++) {
    const z = r * hf.cellSize;
    while (seg < segs.length - 1 && z >= starts[seg + 1]) seg++;
    const s = segs[seg];
    const zl = Math.min(z - starts[seg], segmentLength(s));
    const rowBase = r * hf.cols;
    for (let c = 0; c < hf.cols; c++) {
      hf.heights[rowBase + c] = clampHeight(bases[seg] + segmentHeight(s, noises[seg], columnX(hf, c), zl));
    }
  }
  if (spec.walkPath) {
    const off = walkPathOutside(spec.walkPath, (hf.cols - 1) * hf.cellSize, (hf.rows - 1) * hf.cellSize);
    if (off.length) throw new CourseError(`invalid course spec:\n✖ ${off[0][1]}\n  → at walkPath.points[${off[0][0]}]`);
    hf.walkPath = spec.walkPath;
  }
  return hf;
}

/** Options shared by the single-kind generators below. */
export interface PlainCourseOptions {
  width?: number;
  cellSize?: number;
  /** Flat run before and after the feature, m. */
  leadIn?: number;
  leadOut?: number;
}

function plain(feature: CourseSegmentInput, o: PlainCourseOptions): CourseSpecInput {
  const segments: CourseSegmentInput[] = [];
  if ((o.leadIn ?? 0) > 0) segments.push({ kind: 'flat', length: o.leadIn! });
  segments.push(feature);
  if ((o.leadOut ?? 0) > 0) segments.push({ kind: 'flat', length: o.leadOut! });
  return { width: o.width, cellSize: o.cellSize, segments };
}

export function flatCourse(lengthM: number, o: PlainCourseOptions = {}): Heightfield {
  return generateCourse(plain({ kind: 'flat', length: lengthM }, o));
}

export function rampCourse(lengthM: number, angleDeg: number, o: PlainCourseOptions = {}): Heightfield {
  return generateCourse(plain({ kind: 'ramp', length: lengthM, angleDeg }, o));
}

export function stairsCourse(
  steps: number,
  riser: number,
  tread: number,
  direction: 'up' | 'down' = 'up',
  o: PlainCourseOptions = {},
): Heightfield {
  return generateCourse(plain({ kind: 'stairs', steps, riser, tread, direction }, o));
}

/** Stairs at the IBC 2021 §1011.5.2 limits (178 mm riser, 279 mm tread). */
export function codeStairsCourse(steps: number, direction: 'up' | 'down' = 'up', o: PlainCourseOptions = {}): Heightfield {
  return stairsCourse(steps, CODE_STAIRS.riser, CODE_STAIRS.tread, direction, { cellSize: 0.02, ...o });
}

export function rubbleCourse(
  lengthM: number,
  amplitude: number,
  featureSize: number,
  seed: number,
  o: PlainCourseOptions = {},
): Heightfield {
  return generateCourse(plain({ kind: 'rubble', length: lengthM, amplitude, featureSize, seed }, o));
}

export function curbCourse(lengthM: number, height: number, o: PlainCourseOptions = {}): Heightfield {
  return generateCourse(plain({ kind: 'curb', length: lengthM, height }, o));
}

export function trenchCourse(lengthM: number, width: number, depth: number, o: PlainCourseOptions = {}): Heightfield {
  return generateCourse(plain({ kind: 'trench', length: lengthM, width, depth }, o));
}

/** A mixed course: the given segments in order. */
export function mixedCourse(segments: CourseSegmentInput[], o: Omit<PlainCourseOptions, 'leadIn' | 'leadOut'> = {}): Heightfield {
  return generateCourse({ width: o.width, cellSize: o.cellSize, segments });
}
