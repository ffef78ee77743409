/**
 * Compact storage of a trial's series (version 1): each array as base64 of
 * its little-endian bytes (Float32, Uint8 or Uint16), validated on decode.
 */
import { z } from 'zod';
import { base64DecodedLength, base64ToBytes, bytesToBase64 } from '../course/base64';
import { parseOrThrow } from '../course/parse';
import type { TrialSeries } from './series';

export const SERIES_FORMAT = 'treadle-series';
export const SERIES_ENCODING_VERSION = 1;

type Kind = 'f32' | 'u8' | 'u16';
/** Field, element type, values per sample per leg (0 = one per sample). */
const FIELDS: readonly [keyof TrialSeries, Kind, number][] = [
  ['target', 'f32', 3],
  ['foot', 'f32', 3],
  ['contact', 'u8', 1],
  ['jointSpeed', 'f32', 1],
  ['iterations', 'u16', 1],
  ['error', 'f32', 1],
  ['bodyHeight', 'f32', 0],
  ['bodyPitch', 'f32', 0],
  ['bodyRoll', 'f32', 0],
  ['bodyZ', 'f32', 0],
];
const BYTES: Record<Kind, number> = { f32: 4, u8: 1, u16: 2 };
const MAX_SAMPLES = 600 * 1000;

const base64 = z.string().regex(/^[A-Za-z0-9+/]*={0,2}$/, 'must be base64');

export const SeriesEncodingSchema = z
  .object({
    format: z.literal(SERIES_FORMAT, { error: `format must be "${SERIES_FORMAT}"` }),
    version: z.literal(SERIES_ENCODING_VERSION, {
      error: (iss) => `unsupported version ${String(iss.input)} (this build reads version ${SERIES_ENCODING_VERSION})`,
    }),
    rate: z.number().positive().max(1000),
    legs: z.number().int().min(1).max(16),
    length: z.number().int().min(0).max(MAX_SAMPLES),
    fields: z.object(Object.fromEntries(FIELDS.map(([name]) => [name, base64])) as Record<string, typeof base64>),
  })
  .superRefine((e, ctx) => {
    for (const [name, kind, per] of FIELDS) {
      const expected = e.length * (per === 0 ? 1 : per * e.legs) * BYTES[kind];
      const got = base64DecodedLength(e.fields[name]);
      if (got !== expected) {
        ctx.addIssue({ code: 'custom', path: ['fields', name], message: `${name} must hold ${expected} bytes, got ${got < 0 ? 'malformed base64' : got}` });
      }
    }
  });

export type SeriesEncoding = z.infer<typeof SeriesEncodingSchema>;

function toBytes(kind: Kind, a: ArrayLike<number>, n: number): Uint8Array {
  const bytes = new Uint8Array(n * BYTES[kind]);
  const view = new DataView(bytes.buffer);
  for (let i = 0; i < n; i++) {
    if (kind === 'f32') view.setFloat32(4 * i, a[i], true);
    else if (kind === 'u16') view.setUint16(2 * i, a[i], true);
    else bytes[i] = a[i];
  }
  return bytes;
}

export function encodeSeries(s: TrialSeries): SeriesEncoding {
  const fields: Record<string, string> = {};
  for (const [name, kind, per] of FIELDS) {
    const n = s.length * (per === 0 ? 1 : per * s.legs);
    fields[name] = bytesToBase64(toBytes(kind, s[name] as ArrayLike<number>, n));
  }
  return { format: SERIES_FORMAT, version: SERIES_ENCODING_VERSION, rate: s.rate, legs: s.legs, length: s.length, fields };
}

export function decodeSeries(input: unknown): TrialSeries {
  const e = parseOrThrow(SeriesEncodingSchema, input, 'series encoding');
  const out: Record<string, unknown> = { rate: e.rate, legs: e.legs, length: e.length };
  for (const [name, kind, per] of FIELDS) {
    const bytes = base64ToBytes(e.fields[name]);
    const n = e.length * (per === 0 ? 1 : per * e.legs);
    const view = new DataView(bytes.buffer);
    const a = kind === 'f32' ? new Float32Array(n) : kind === 'u16' ? new Uint16Array(n) : new Uint8Array(n);
    for (let i = 0; i < n; i++) a[i] = kind === 'f32' ? view.getFloat32(4 * i, true) : kind === 'u16' ? view.getUint16(2 * i, true) : bytes[i];
    out[name] = a;
  }
  return out as unknown as TrialSeries;
}
