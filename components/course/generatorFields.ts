/**
 * The generator form's model: each segment kind with its engine parameters (engine/course/generators.ts), as
 * strings while typed, turned into a recipe the shared schema checks.
 */
import { CODE_STAIRS, segmentLength, type CourseSegment } from '../../engine/course/generators';
import type { CourseGenerator, CourseGeneratorInput } from '../../schemas/courses';

export type SegmentKind = CourseSegment['kind'];

export interface ParamField {
  key: string;
  label: string;
  unit?: string;
  /** Choices instead of a number. */
  choices?: readonly { value: string; label: string }[];
}

export const KIND_LABELS: Record<SegmentKind, string> = {
  flat: 'Flat',
  ramp: 'Ramp',
  stairs: 'Stairs',
  rubble: 'Rubble',
  curb: 'Curb',
  trench: 'Trench',
};

export const KIND_FIELDS: Record<SegmentKind, readonly ParamField[]> = {
  flat: [{ key: 'length', label: 'Length', unit: 'm' }],
  ramp: [
    { key: 'length', label: 'Length', unit: 'm' },
    { key: 'angleDeg', label: 'Slope (climbs if positive)', unit: '°' },
  ],
  stairs: [
    { key: 'steps', label: 'Steps' },
    { key: 'riser', label: 'Riser', unit: 'm' },
    { key: 'tread', label: 'Tread', unit: 'm' },
    { key: 'direction', label: 'Direction', choices: [{ value: 'up', label: 'Up' }, { value: 'down', label: 'Down' }] },
  ],
  rubble: [
    { key: 'length', label: 'Length', unit: 'm' },
    { key: 'amplitude', label: 'Amplitude', unit: 'm' },
    { key: 'featureSize', label: 'Lump size', unit: 'm' },
    { key: 'seed', label: 'Seed' },
    { key: 'octaves', label: 'Octaves' },
  ],
  curb: [
    { key: 'length', label: 'Length', unit: 'm' },
    { key: 'height', label: 'Step height (down if negative)', unit: 'm' },
  ],
  trench: [
    { key: 'length', label: 'Length', unit: 'm' },
    { key: 'width', label: 'Trench width', unit: 'm' },
    { key: 'depth', label: 'Depth', unit: 'm' },
  ],
};

export const KIND_DEFAULTS: Record<SegmentKind, Record<string, string>> = {
  flat: { length: '1.5' },
  ramp: { length: '4', angleDeg: '10' },
  // IBC 2021 §1011.5.2 limits: 178 mm riser, 279 mm tread.
  stairs: { steps: '5', riser: String(CODE_STAIRS.riser), tread: String(CODE_STAIRS.tread), direction: 'up' },
  rubble: { length: '6', amplitude: '0.06', featureSize: '0.35', seed: '1', octaves: '3' },
  curb: { length: '1', height: '0.12' },
  trench: { length: '1.6', width: '0.45', depth: '0.25' },
};

export interface SegmentDraft {
  kind: SegmentKind;
  values: Record<string, string>;
}

export interface GeneratorDraft {
  name: string;
  width: string;
  cellSize: string;
  segments: SegmentDraft[];
}

export const initialDraft = (): GeneratorDraft => ({
  name: '',
  width: '2',
  cellSize: '0.04',
  segments: [
    { kind: 'flat', values: { ...KIND_DEFAULTS.flat } },
    { kind: 'stairs', values: { ...KIND_DEFAULTS.stairs } },
    { kind: 'flat', values: { ...KIND_DEFAULTS.flat } },
  ],
});

/** A typed number, or undefined when the box is empty or not a number (the schema then names the field). */
function num(s: string | undefined): number | undefined {
  if (s === undefined || s.trim() === '') return undefined;
  const n = Number(s.replace(',', '.'));
  return Number.isFinite(n) ? n : undefined;
}

export function recipeOf(d: GeneratorDraft): CourseGeneratorInput {
  return {
    width: num(d.width) as number,
    cellSize: num(d.cellSize) as number,
    segments: d.segments.map((s) => {
      const seg: Record<string, unknown> = { kind: s.kind };
      for (const f of KIND_FIELDS[s.kind]) seg[f.key] = f.choices ? s.values[f.key] : num(s.values[f.key]);
      return seg as CourseGeneratorInput['segments'][number];
    }),
  };
}

/** zod's bound messages in the words of a form ("Too big: expected number to be <=0.5" → "Use at most 0.5."). */
function plainBound(message: string): string {
  const bound = /^Too (big|small): expected number to be ([<>])=?(-?[\d.e+-]+)$/.exec(message);
  if (bound) return `Use ${bound[2] === '<' ? 'at most' : 'at least'} ${bound[3]}.`;
  if (/expected number, received (undefined|NaN)/.test(message)) return 'Enter a number.';
  if (/expected int, received number/.test(message)) return 'Enter a whole number.';
  return message;
}

/** Server and schema messages on "generator.…" keys, as the form's own keys ("segments.1.riser", "width"). */
export function formFieldErrors(fields: Record<string, string>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, message] of Object.entries(fields)) {
    const local = key === 'generator' ? '_' : key.startsWith('generator.') ? key.slice('generator.'.length) : key;
    if (!(local in out)) out[local] = plainBound(message);
  }
  return out;
}

/** "flat 2 m, stairs 5 × 178 mm up, flat 2 m" */
export function recipeLine(g: CourseGenerator): string {
  return g.segments
    .map((s) => {
      if (s.kind === 'stairs') return `stairs ${s.steps} × ${Math.round(s.riser * 1000)} mm ${s.direction}`;
      if (s.kind === 'ramp') return `ramp ${s.length} m at ${s.angleDeg}°`;
      return `${s.kind} ${segmentLength(s)} m`;
    })
    .join(', ');
}
