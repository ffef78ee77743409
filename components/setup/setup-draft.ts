/**
 * The leg setup form's draft: every setting as the text in its field, turned back into a candidate setup
 * that the one LegSetupSchema validates (so the form and the server give the same field messages).
 */
import { LegSetupSchema, type LegSetup } from '../../engine/gait/leg-setup';
import { fieldMessages } from '../../schemas/errors';

export interface NumberField {
  path: string;
  label: string;
  unit?: string;
  /** Blank means null (the engine's automatic choice). */
  nullable?: string;
  integer?: boolean;
}

export const SOLVER_FIELDS: NumberField[] = [
  { path: 'solver.maxIterations', label: 'Iteration budget', integer: true },
  { path: 'solver.tolerance', label: 'Position tolerance', unit: 'm' },
  { path: 'solver.lambda', label: 'DLS damping λ', unit: 'm' },
  { path: 'solver.maxStepAngle', label: 'Largest joint change per iteration', unit: 'rad' },
  { path: 'solver.maxStepLength', label: 'Largest slider change per iteration', unit: 'm' },
  { path: 'solver.clampDistance', label: 'Task error clamp', unit: 'm', nullable: 'blank = off, 0 = automatic' },
  { path: 'solver.orientationTolerance', label: 'Orientation tolerance', unit: 'rad' },
  { path: 'solver.orientationWeight', label: 'Orientation weight', unit: 'm/rad' },
  { path: 'solver.svdThreshold', label: 'SVD threshold' },
  { path: 'solver.gammaMax', label: 'SDLS largest joint change γmax', unit: 'rad' },
  { path: 'solver.manipulabilityThreshold', label: 'Manipulability threshold (adaptive)' },
  { path: 'solver.lmBias', label: 'Levenberg–Marquardt bias (adaptive)' },
  { path: 'solver.minStep', label: 'Smallest useful step', unit: 'rad' },
];

export const GAIT_FIELDS: NumberField[] = [
  { path: 'gait.dutyFactor', label: 'Duty factor (share of the cycle in stance)' },
  { path: 'gait.stride', label: 'Stride', unit: 'm', nullable: 'blank = from hip height and speed (Alexander 1976)' },
  { path: 'gait.stepHeight', label: 'Step height', unit: 'm' },
];

export const BODY_FIELDS: NumberField[] = [
  { path: 'body.heightOffset', label: 'Height offset', unit: 'm' },
  { path: 'body.followHeight', label: 'Follows the feet’s height (0–1)' },
  { path: 'body.followPitch', label: 'Follows pitch (0–1)' },
  { path: 'body.followRoll', label: 'Follows roll (0–1)' },
  { path: 'body.settleTime', label: 'Settling time (2 %)', unit: 's' },
  { path: 'body.slopeCrouch', label: 'Crouch per radian of slope' },
];

const ALL_NUMBERS = [...SOLVER_FIELDS, ...GAIT_FIELDS, ...BODY_FIELDS];

export type Draft = Record<string, string>;

function get(o: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((v, k) => (v as Record<string, unknown> | undefined)?.[k], o);
}
function put(o: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split('.');
  let at = o;
  for (const k of keys.slice(0, -1)) at = (at[k] ??= {}) as Record<string, unknown>;
  at[keys[keys.length - 1]] = value;
}

/** Shown to 6 significant digits (engine defaults such as a speed from the Froude number carry 16). */
const numberText = (v: unknown) => (v === null || v === undefined ? '' : typeof v === 'number' ? String(parseFloat(v.toPrecision(6))) : String(v));

export function draftOf(s: LegSetup): Draft {
  const d: Draft = {};
  for (const f of ALL_NUMBERS) d[f.path] = numberText(get(s, f.path));
  d['solver.method'] = s.solver.method;
  d['solver.adaptiveMode'] = s.solver.adaptiveMode;
  d['solver.warmStart'] = s.solver.warmStart;
  d['solver.resolveSaturated'] = String(s.solver.resolveSaturated);
  d['solver.footOrientation'] = String(s.solver.footOrientation);
  d['solver.nullSpace.kind'] = s.solver.nullSpace.kind;
  d['solver.nullSpace.gain'] = s.solver.nullSpace.kind === 'rest' ? String(s.solver.nullSpace.gain) : '0.1';
  d['gait.pattern'] = s.gait.pattern;
  d['gait.phaseOffsets'] = s.gait.phaseOffsets ? s.gait.phaseOffsets.join(', ') : '';
  d['gait.timing.mode'] = s.gait.timing.mode;
  d['gait.timing.value'] = numberText(s.gait.timing.mode === 'speed' ? s.gait.timing.speed : s.gait.timing.cycleTime);
  d.legs = JSON.stringify(s.legs);
  return d;
}

const toNumber = (t: string) => (t.trim() === '' ? NaN : Number(t.trim()));

/** The setup the draft describes (not yet validated). */
export function candidateOf(d: Draft): unknown {
  const o: Record<string, unknown> = { version: 1 };
  for (const f of ALL_NUMBERS) put(o, f.path, f.nullable && d[f.path].trim() === '' ? null : toNumber(d[f.path]));
  put(o, 'solver.method', d['solver.method']);
  put(o, 'solver.adaptiveMode', d['solver.adaptiveMode']);
  put(o, 'solver.warmStart', d['solver.warmStart']);
  put(o, 'solver.resolveSaturated', d['solver.resolveSaturated'] === 'true');
  put(o, 'solver.footOrientation', d['solver.footOrientation'] === 'true');
  put(o, 'solver.nullSpace', d['solver.nullSpace.kind'] === 'rest' ? { kind: 'rest', gain: toNumber(d['solver.nullSpace.gain']) } : { kind: 'none' });
  put(o, 'gait.pattern', d['gait.pattern']);
  put(o, 'gait.phaseOffsets', d['gait.phaseOffsets'].trim() === '' ? null : d['gait.phaseOffsets'].split(',').map(toNumber));
  const value = toNumber(d['gait.timing.value']);
  put(o, 'gait.timing', d['gait.timing.mode'] === 'speed' ? { mode: 'speed', speed: value } : { mode: 'cycle', cycleTime: value });
  try {
    o.legs = JSON.parse(d.legs || '[]');
  } catch {
    o.legs = 'not JSON';
  }
  return o;
}

/** The valid setup, or the field messages (keyed by path, e.g. "gait.dutyFactor"). */
export function checkDraft(d: Draft): { setup: LegSetup; errors: null } | { setup: null; errors: Record<string, string> } {
  const r = LegSetupSchema.safeParse(candidateOf(d));
  if (r.success) return { setup: r.data, errors: null };
  const errors = fieldMessages(r.error.issues);
  // Timing errors land on the one value field.
  for (const k of Object.keys(errors)) if (k.startsWith('gait.timing.') && k !== 'gait.timing.value') errors['gait.timing.value'] ??= errors[k];
  return { setup: null, errors };
}
