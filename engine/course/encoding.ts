/**
 * Compact course encoding (version 1): the grid with heights quantized to
 * whole millimetres above a base, stored as little-endian uint16 in base64.
 * Decoding validates everything and says what is wrong.
 */
import { z } from 'zod';
import { base64DecodedLength, base64ToBytes, bytesToBase64 } from './base64';
import { CourseError, checkGrid, heightRange, type Heightfield } from './heightfield';
import { COURSE_LIMITS } from './limits';
import { parseOrThrow } from './parse';
import { WalkPathSchema, walkPathOutside } from './walk-path';

export const COURSE_FORMAT = 'treadle-course';
export const COURSE_ENCODING_VERSION = 1;
/** Quanta per metre (division by 1000 gives the nearest double to each millimetre). */
const PER_M = Math.round(1 / COURSE_LIMITS.quantum);
const maxMm = COURSE_LIMITS.maxAbsHeight * PER_M;

export const CourseEncodingSchema = z
  .object({
    format: z.literal(COURSE_FORMAT, { error: `format must be "${COURSE_FORMAT}"` }),
    version: z.literal(COURSE_ENCODING_VERSION, {
      error: (iss) => `unsupported version ${String(iss.input)} (this build reads version ${COURSE_ENCODING_VERSION})`,
    }),
    cols: z.number().int().min(COURSE_LIMITS.minCols).max(COURSE_LIMITS.maxCols),
    rows: z.number().int().min(COURSE_LIMITS.minRows).max(COURSE_LIMITS.maxRows),
    cellSize: z.number().min(COURSE_LIMITS.minCellSize).max(COURSE_LIMITS.maxCellSize),
    /** Height of code 0, whole millimetres. */
    baseMm: z.number().int().min(-maxMm).max(maxMm),
    /** rows × cols uint16 little-endian: millimetres above baseMm, row-major. */
    heights: z.string().regex(/^[A-Za-z0-9+/]*={0,2}$/, 'heights must be base64 (A–Z, a–z, 0–9, +, /, = padding)'),
    /** The line the body walks; absent: straight ahead along +Z at x = 0 (every course saved before paths). */
    walkPath: WalkPathSchema.optional(),
  })
  .superRefine((e, ctx) => {
    if (e.cols * e.rows > COURSE_LIMITS.maxCells) {
      ctx.addIssue({ code: 'custom', path: ['rows'], message: `cols × rows must be at most ${COURSE_LIMITS.maxCells}, got ${e.cols * e.rows}` });
      return;
    }
    const expected = e.cols * e.rows * 2;
    const got = base64DecodedLength(e.heights);
    if (got !== expected) {
      ctx.addIssue({
        code: 'custom',
        path: ['heights'],
        message: `heights must hold rows × cols × 2 = ${expected} bytes, got ${got < 0 ? 'a length that is not a multiple of 4' : `${got} bytes`}`,
      });
    }
    if (e.walkPath) {
      for (const [i, message] of walkPathOutside(e.walkPath, (e.cols - 1) * e.cellSize, (e.rows - 1) * e.cellSize)) {
        ctx.addIssue({ code: 'custom', path: ['walkPath', 'points', i], message });
      }
    }
  });

export type CourseEncoding = z.infer<typeof CourseEncodingSchema>;

export function encodeCourse(hf: Heightfield): CourseEncoding {
  checkGrid(hf.cols, hf.rows, hf.cellSize);
  const { min, max } = heightRange(hf);
  if (!Number.isFinite(min) || !Number.isFinite(max) || Math.abs(min) > COURSE_LIMITS.maxAbsHeight || Math.abs(max) > COURSE_LIMITS.maxAbsHeight) {
    throw new CourseError(`course heights must be finite and within ±${COURSE_LIMITS.maxAbsHeight} m, got [${min}, ${max}]`);
  }
  const baseMm = Math.round(min * PER_M);
  const n = hf.cols * hf.rows;
  const bytes = new Uint8Array(n * 2);
  for (let i = 0; i < n; i++) {
    let code = Math.round(hf.heights[i] * PER_M) - baseMm;
    code = code < 0 ? 0 : code > 65535 ? 65535 : code;
    bytes[2 * i] = code & 255;
    bytes[2 * i + 1] = code >> 8;
  }
  const encoding: CourseEncoding = {
    format: COURSE_FORMAT,
    version: COURSE_ENCODING_VERSION,
    cols: hf.cols,
    rows: hf.rows,
    cellSize: hf.cellSize,
    baseMm,
    heights: bytesToBase64(bytes),
  };
  if (hf.walkPath) encoding.walkPath = hf.walkPath;
  return encoding;
}

/** Decode and validate; throws a CourseError whose message lists every problem found. */
export function decodeCourse(input: unknown): Heightfield {
  const e = parseOrThrow(CourseEncodingSchema, input, 'course encoding', (m) => new CourseError(m));
  let bytes: Uint8Array;
  try {
    bytes = base64ToBytes(e.heights);
  } catch (err) {
    throw new CourseError(`invalid course encoding: heights: ${(err as Error).message}`);
  }
  const n = e.cols * e.rows;
  const heights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const mm = e.baseMm + (bytes[2 * i] | (bytes[2 * i + 1] << 8));
    if (mm > maxMm) {
      throw new CourseError(
        `invalid course encoding: heights: sample ${i} (row ${Math.floor(i / e.cols)}, col ${i % e.cols}) is ${mm / PER_M} m, above the bound ${COURSE_LIMITS.maxAbsHeight} m`,
      );
    }
    heights[i] = mm / PER_M;
  }
  const hf: Heightfield = { cols: e.cols, rows: e.rows, cellSize: e.cellSize, heights };
  if (e.walkPath) hf.walkPath = e.walkPath;
  return hf;
}

/** The encoding as a JSON string (what the server stores and the app downloads). */
export function courseToJson(hf: Heightfield): string {
  return JSON.stringify(encodeCourse(hf));
}

export function courseFromJson(json: string): Heightfield {
  let data: unknown;
  try {
    data = JSON.parse(json);
  } catch (err) {
    throw new CourseError(`invalid course encoding: not JSON (${(err as Error).message})`);
  }
  return decodeCourse(data);
}
