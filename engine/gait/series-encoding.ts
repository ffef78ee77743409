/**
 * Compact storage of a trial's series (version 1): each array as base64 of
 * its little-endian bytes (Float32, Uint8 or Uint16), validated on decode.
 * The solved joint angles (engine/gait/joint-angles.ts) travel as the
 * optional `jointDofs` with fields `jointAngles` (Int16) and `bodyFrame`
 * (Float32, 7 per sample); series stored before them read without them.
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
const MAX_JOINT_DOFS = 16 * 24;
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
    jointDofs: z.number().int().min(1).max(MAX_JOINT_DOFS).optional(),
    fields: z.object({
      ...(Object.fromEntries(FIELDS.map(([name]) => [name, base64])) as Record<string, typeof base64>),
      jointAngles: base64.optional(),
      bodyFrame: base64.optional(),
    }),
  })
  .superRefine((e, ctx) => {
    for (const [name, kind, per] of FIELDS) {
      const expected = e.length * (per === 0 ? 1 : per * e.legs) * BYTES[kind];
      const got = base64DecodedLength((e.fields as Record<string, string>)[name]);
      if (got !== expected) {
        ctx.addIssue({ code: 'custom', path: ['fields', name], message: `${name} must hold ${expected} bytes, got ${got < 0 ? 'malformed base64' : got}` });
      }
    }
    if (e.jointDofs === undefined) return;
    for (const [name, expected] of [
      ['jointAngles', e.length * e.jointDofs * 2],
      ['bodyFrame', e.length * 7 * 4],
    ] as const) {
      const field = e.fields[name];
      const got = field === undefined ? -2 : base64DecodedLength(field);
      if (got !== expected) {
        ctx.addIssue({ code: 'custom', path: ['fields', name], message: `${name} must hold ${expected} bytes, got ${got === -2 ? 'none' : got < 0 ? 'malformed base64' : got}` });
      }
    }
  });

export type SeriesEncoding = z.infer<typeof SeriesEncodingSchema>;

function int16Bytes(a: Int16Array): Uint8Array {
  const bytes = new Uint8Array(a.length * 2);
  const view = new DataView(bytes.buffer);
  for (let i = 0; i < a.length; i++) view.setInt16(2 * i, a[i], true);
  return bytes;
}

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
  const base = { format: SERIES_FORMAT, version: SERIES_ENCODING_VERSION, rate: s.rate, legs: s.legs, length: s.length } as const;
  if (!s.jointDofs) return { ...base, fields };
  fields.jointAngles = bytesToBase64(int16Bytes(s.jointAngles.subarray(0, s.length * s.jointDofs)));
  fields.bodyFrame = bytesToBase64(toBytes('f32', s.bodyFrame, s.length * 7));
  return { ...base, jointDofs: s.jointDofs, fields };
}

export function decodeSeries(input: unknown): TrialSeries {
  const e = parseOrThrow(SeriesEncodingSchema, input, 'series encoding');
  const out: Record<string, unknown> = { rate: e.rate, legs: e.legs, length: e.length };
  for (const [name, kind, per] of FIELDS) {
    const bytes = base64ToBytes((e.fields as Record<string, string>)[name]);
    const n = e.length * (per === 0 ? 1 : per * e.legs);
    const view = new DataView(bytes.buffer);
    const a = kind === 'f32' ? new Float32Array(n) : kind === 'u16' ? new Uint16Array(n) : new Uint8Array(n);
    for (let i = 0; i < n; i++) a[i] = kind === 'f32' ? view.getFloat32(4 * i, true) : kind === 'u16' ? view.getUint16(2 * i, true) : bytes[i];
    out[name] = a;
  }
  out.jointDofs = e.jointDofs ?? 0;
  out.jointAngles = new Int16Array(0);
  out.bodyFrame = new Float32Array(0);
  if (e.jointDofs && e.fields.jointAngles && e.fields.bodyFrame) {
    const angles = base64ToBytes(e.fields.jointAngles);
    const av = new DataView(angles.buffer, angles.byteOffset, angles.byteLength);
    const ja = new Int16Array(angles.byteLength / 2);
    for (let i = 0; i < ja.length; i++) ja[i] = av.getInt16(2 * i, true);
    const frame = base64ToBytes(e.fields.bodyFrame);
    const fv = new DataView(frame.buffer, frame.byteOffset, frame.byteLength);
    const bf = new Float32Array(frame.byteLength / 4);
    for (let i = 0; i < bf.length; i++) bf[i] = fv.getFloat32(4 * i, true);
    out.jointAngles = ja;
    out.bodyFrame = bf;
  }
  return out as unknown as TrialSeries;
}
