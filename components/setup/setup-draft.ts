/**
 * The leg setup form's draft: every setting as the text in its field, turned back into a candidate setup
 * that the one LegSetupSchema validates (so the form and the server give the same field messages).
 */
import { LegSetupSchema, type LegSetup } from '../../engine/gait/leg-setup';
import type { SolverMethod } from '../../engine/ik/options';
import { fieldMessages } from '../../schemas/errors';
import { SETTING_NAMES, setupIssueSentence, valueAtPath, type IssueLike, type NamedSetting, type SettingName } from '../../engine/gait/setting-sentences';

export interface NumberField {
  path: string;
  label: string;
  unit?: string;
  /** Blank means null (the engine's automatic choice). */
  nullable?: string;
  integer?: boolean;
  /** An angle: typed in degrees, stored in radians (the leg setup's unit). */
  degrees?: boolean;
  /** Only these solver methods read it (every method when absent). */
  methods?: readonly SolverMethod[];
  /** Read only when the sole is turned to the ground. */
  orientation?: boolean;
  /** Carried through the form unchanged but not shown. */
  hidden?: boolean;
}

/** A field as the lists below give it: its label and unit come from the setting's name (SETTING_NAMES). */
type FieldSpec = Omit<NumberField, 'path' | 'label' | 'unit'> & {
  path: NamedSetting;
  /** What the number means, said after the label in brackets. */
  gloss?: string;
};

/**
 * Labelled under its section's heading (Solver, Gait, Body, Footholds), a field does not repeat the heading: "Body
 * settling time" is "Settling time" under Body, "Foothold edge weight" "Edge weight" under Footholds. A setting
 * typed in degrees shows ° instead of its stored radians.
 */
function named(spec: FieldSpec): NumberField {
  const { gloss, ...field } = spec;
  const name: SettingName = SETTING_NAMES[spec.path];
  const heading = spec.path.split('.')[0].replace(/s$/, '');
  const short = name.label.replace(new RegExp(`^${heading}s? `, 'i'), '');
  const label = short.charAt(0).toUpperCase() + short.slice(1);
  return { ...field, label: gloss ? `${label} (${gloss})` : label, unit: spec.degrees ? '°' : name.unit };
}
const namedFields = (specs: FieldSpec[]) => specs.map(named);

/** A form label for a setting that is not a plain number field (a choice, a list, the timing value): its listed name under its heading, with its unit. */
export function settingLabel(path: NamedSetting, gloss?: string): string {
  const { label, unit } = named({ path, gloss });
  return unit ? `${label} (${unit})` : label;
}

const JACOBIAN: readonly SolverMethod[] = ['dls', 'sdls', 'transpose', 'pseudoinverse', 'adaptive'];

/** Which methods read which setting: engine/ik/solve.ts (methodStep, jacobianIteration) and engine/ik/ccd.ts. */
export const SOLVER_FIELDS: NumberField[] = namedFields([
  { path: 'solver.maxIterations', integer: true },
  { path: 'solver.tolerance' },
  { path: 'solver.lambda', methods: ['dls', 'adaptive'] },
  { path: 'solver.gammaMax', degrees: true, methods: ['sdls'] },
  { path: 'solver.svdThreshold', methods: ['pseudoinverse'] },
  { path: 'solver.manipulabilityThreshold', methods: ['adaptive'] },
  { path: 'solver.lmBias', methods: ['adaptive'] },
  { path: 'solver.maxStepAngle', degrees: true },
  { path: 'solver.maxStepLength' },
  // Read by the walk around every method's solve (a flip of the knee is spread over frames).
  { path: 'solver.maxJointSpeed' },
  { path: 'solver.clampDistance', nullable: 'blank = off, 0 = automatic', methods: JACOBIAN },
  { path: 'solver.orientationTolerance', degrees: true, orientation: true },
  { path: 'solver.orientationWeight', orientation: true },
  // The engine's stall detector (a step this small ends the solve): kept in the setup, not offered in the form.
  { path: 'solver.minStep', degrees: true, hidden: true },
]);

/** The fields the chosen method reads (and the orientation ones only when the sole is turned). */
export function solverFieldsFor(method: string, orientation: boolean): NumberField[] {
  return SOLVER_FIELDS.filter((f) => !f.hidden && (!f.methods || f.methods.includes(method as SolverMethod)) && (!f.orientation || orientation));
}

/** Whether the chosen method reads the Jacobian-only switches (null-space bias, re-solve at limits). */
export const isJacobianMethod = (method: string) => JACOBIAN.includes(method as SolverMethod);

export const GAIT_FIELDS: NumberField[] = namedFields([
  { path: 'gait.dutyFactor', gloss: 'share of the cycle in stance' },
  { path: 'gait.stride', nullable: 'blank = from hip height and speed (Alexander 1976)' },
  { path: 'gait.stepHeight' },
]);

export const BODY_FIELDS: NumberField[] = namedFields([
  { path: 'body.heightOffset' },
  { path: 'body.followHeight', gloss: '0–1' },
  { path: 'body.followPitch', gloss: '0–1' },
  { path: 'body.followRoll', gloss: '0–1' },
  { path: 'body.settleTime', gloss: '2 %' },
  { path: 'body.slopeCrouch' },
]);

/** The foothold search's radius and the weights of its cost (engine/gait/foothold.ts): shown folded away, as few need them. */
export const FOOTHOLD_FIELDS: NumberField[] = namedFields([
  { path: 'footholds.searchRadius', gloss: 'share of the stride' },
  { path: 'footholds.distanceWeight', gloss: 'cost at the search radius' },
  { path: 'footholds.slopeWeight', gloss: 'cost per radian of slope' },
  { path: 'footholds.roughnessWeight', gloss: 'cost per m of height spread' },
  { path: 'footholds.edgeWeight', gloss: 'cost per m of height jump' },
  { path: 'footholds.reachWeight', gloss: 'cost at the reach limit' },
]);

const ALL_NUMBERS = [...SOLVER_FIELDS, ...GAIT_FIELDS, ...BODY_FIELDS, ...FOOTHOLD_FIELDS];

/**
 * Draft key of the setup the form was filled from, as JSON. The candidate starts from it, so a setting the form
 * has no field for (one added to the schema before the form offers it) is saved as it was, never reset to its
 * default. (A leg's own solver settings ride in the legs' JSON: limit-rows.ts keeps them.)
 */
const LOADED = 'loaded';

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

export const DEG_PER_RAD = 180 / Math.PI;

/**
 * Shown rounded to 3 significant digits (integers whole) (engine defaults such as a speed from the Froude number carry 16).
 * The exact value is kept beside it under "exact:<path>", and used again while the field still shows its
 * rounding, so loading a version and saving it unchanged does not move it.
 */
export function roundedText(v: number): string {
  if (Number.isInteger(v)) return String(v);
  const x = parseFloat(v.toPrecision(3));
  const text = String(x);
  // Never "5.73e-8" in a field: write the zeros out.
  return text.includes('e') ? x.toFixed(Math.min(20, Math.ceil(-Math.log10(Math.abs(x))) + 2)) : text;
}

function setNumber(d: Draft, path: string, v: unknown, scale = 1) {
  if (v === null || v === undefined) {
    d[path] = '';
    return;
  }
  if (typeof v !== 'number') {
    d[path] = String(v);
    return;
  }
  d[path] = roundedText(v * scale);
  d[`exact:${path}`] = String(v);
}

export function draftOf(s: LegSetup): Draft {
  const d: Draft = {};
  for (const f of ALL_NUMBERS) setNumber(d, f.path, get(s, f.path), f.degrees ? DEG_PER_RAD : 1);
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
  setNumber(d, 'gait.timing.value', s.gait.timing.mode === 'speed' ? s.gait.timing.speed : s.gait.timing.cycleTime);
  d.legs = JSON.stringify(s.legs);
  d[LOADED] = JSON.stringify(s);
  return d;
}

const toNumber = (t: string) => (t.trim() === '' ? NaN : Number(t.trim()));

/** The stored number: the exact one it was loaded with while the field still shows that rounding, else what was typed (over `scale`). */
function numberOf(d: Draft, path: string, scale = 1): number {
  const exact = d[`exact:${path}`];
  if (exact !== undefined && d[path] === roundedText(Number(exact) * scale)) return Number(exact);
  return toNumber(d[path]) / scale;
}

/** The setup the draft describes (not yet validated). */
export function candidateOf(d: Draft): unknown {
  const o: Record<string, unknown> = { ...loadedOf(d), version: 1 };
  for (const f of ALL_NUMBERS) put(o, f.path, f.nullable && d[f.path].trim() === '' ? null : numberOf(d, f.path, f.degrees ? DEG_PER_RAD : 1));
  put(o, 'solver.method', d['solver.method']);
  put(o, 'solver.adaptiveMode', d['solver.adaptiveMode']);
  put(o, 'solver.warmStart', d['solver.warmStart']);
  put(o, 'solver.resolveSaturated', d['solver.resolveSaturated'] === 'true');
  put(o, 'solver.footOrientation', d['solver.footOrientation'] === 'true');
  put(o, 'solver.nullSpace', d['solver.nullSpace.kind'] === 'rest' ? { kind: 'rest', gain: toNumber(d['solver.nullSpace.gain']) } : { kind: 'none' });
  put(o, 'gait.pattern', d['gait.pattern']);
  put(o, 'gait.phaseOffsets', d['gait.phaseOffsets'].trim() === '' ? null : d['gait.phaseOffsets'].split(',').map(toNumber));
  const value = numberOf(d, 'gait.timing.value');
  put(o, 'gait.timing', d['gait.timing.mode'] === 'speed' ? { mode: 'speed', speed: value } : { mode: 'cycle', cycleTime: value });
  try {
    o.legs = JSON.parse(d.legs || '[]');
  } catch {
    o.legs = 'not JSON';
  }
  return o;
}

function loadedOf(d: Draft): Record<string, unknown> {
  try {
    const loaded: unknown = JSON.parse(d[LOADED] ?? '{}');
    return loaded && typeof loaded === 'object' && !Array.isArray(loaded) ? (loaded as Record<string, unknown>) : {};
  } catch {
    return {};
  }
}

/** The valid setup, or the field messages (keyed by path, e.g. "gait.dutyFactor"). */
export function checkDraft(d: Draft): { setup: LegSetup; errors: null } | { setup: null; errors: Record<string, string> } {
  const candidate = candidateOf(d);
  const r = LegSetupSchema.safeParse(candidate);
  if (r.success) return { setup: r.data, errors: null };
  // A length or count over its limit says so in words with its value (and, far over, asks about centimetres); angles are said in degrees below.
  const inDegreesPaths = new Set(ALL_NUMBERS.filter((f) => f.degrees).map((f) => f.path));
  const errors = fieldMessages(
    r.error.issues.map((i) =>
      (i.code === 'too_big' || i.code === 'too_small') && !inDegreesPaths.has(i.path.join('.'))
        ? { ...i, message: setupIssueSentence(i as IssueLike, valueAtPath(candidate, i.path)) }
        : i,
    ),
  );
  for (const f of ALL_NUMBERS) if (f.degrees && errors[f.path]) errors[f.path] = inDegrees(errors[f.path]);
  // Timing errors land on the one value field.
  for (const k of Object.keys(errors)) if (k.startsWith('gait.timing.') && k !== 'gait.timing.value') errors['gait.timing.value'] ??= errors[k];
  return { setup: null, errors };
}

/** The schema's bounds are radians; a field typed in degrees says them in degrees ("at most 180°"). */
export function inDegrees(message: string): string {
  const m = /(<=|>=|<|>)\s*(-?[\d.]+(?:e[-+]?\d+)?)/i.exec(message);
  if (!m) return message;
  const deg = roundedText(Number(m[2]) * DEG_PER_RAD);
  const words: Record<string, string> = { '<=': `Use at most ${deg}°.`, '<': `Use less than ${deg}°.`, '>=': `Use at least ${deg}°.`, '>': `Use more than ${deg}°.` };
  return words[m[1]];
}
