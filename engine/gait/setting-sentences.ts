/**
 * Sentences for leg setup settings: each names the setting as the form shows it, its value and limit, and the
 * fix. Used by the schema's own parse errors, the server's refusals at submission and the form's field messages.
 */
import type { Rig } from './rig';

export interface SettingName {
  /** The setting's name on its own, as sentences, refusals and failed jobs say it. */
  label: string;
  /** The unit the leg setup stores it in. */
  unit?: string;
}

/**
 * Names of the settings: the one list. The leg setup form (components/setup/setup-draft.ts) labels its fields
 * with these and the dial-in's tunable settings (schemas/dial-ins.ts) take their names from here, so a field,
 * a tuner row and a sentence about a setting always name it the same way.
 */
export const SETTING_NAMES = {
  'solver.method': { label: 'Solver method' },
  'solver.maxIterations': { label: 'Iteration budget' },
  'solver.tolerance': { label: 'Position tolerance', unit: 'm' },
  'solver.orientationTolerance': { label: 'Orientation tolerance', unit: 'rad' },
  'solver.maxStepAngle': { label: 'Largest joint change per iteration', unit: 'rad' },
  'solver.maxStepLength': { label: 'Largest slider change per iteration', unit: 'm' },
  'solver.clampDistance': { label: 'Task error clamp', unit: 'm' },
  'solver.orientationWeight': { label: 'Orientation weight', unit: 'm/rad' },
  'solver.lambda': { label: 'DLS damping λ', unit: 'm' },
  'solver.gammaMax': { label: 'SDLS largest joint change γmax', unit: 'rad' },
  'solver.svdThreshold': { label: 'Singular values dropped below' },
  'solver.manipulabilityThreshold': { label: 'Manipulability threshold' },
  'solver.lmBias': { label: 'Levenberg–Marquardt bias' },
  'solver.minStep': { label: 'Smallest useful step', unit: 'rad' },
  'solver.maxJointSpeed': { label: 'Joint speed limit', unit: '°/s' },
  'gait.pattern': { label: 'Gait pattern' },
  'gait.phaseOffsets': { label: 'Phase offsets' },
  'gait.dutyFactor': { label: 'Duty factor' },
  'gait.timing.speed': { label: 'Walking speed', unit: 'm/s' },
  'gait.timing.cycleTime': { label: 'Cycle time', unit: 's' },
  'gait.stride': { label: 'Stride', unit: 'm' },
  'gait.stepHeight': { label: 'Step height', unit: 'm' },
  'body.heightOffset': { label: 'Body height offset', unit: 'm' },
  'body.followHeight': { label: 'Body follows the feet’s height' },
  'body.followPitch': { label: 'Body follows pitch' },
  'body.followRoll': { label: 'Body follows roll' },
  'body.settleTime': { label: 'Body settling time', unit: 's' },
  'body.slopeCrouch': { label: 'Crouch per radian of slope' },
  'footholds.searchRadius': { label: 'Foothold search radius' },
  'footholds.distanceWeight': { label: 'Foothold distance weight' },
  'footholds.slopeWeight': { label: 'Foothold slope weight' },
  'footholds.roughnessWeight': { label: 'Foothold roughness weight' },
  'footholds.edgeWeight': { label: 'Foothold edge weight' },
  'footholds.reachWeight': { label: 'Foothold reach weight' },
} satisfies Record<string, SettingName>;

/** A setting the list above names. */
export type NamedSetting = keyof typeof SETTING_NAMES;

/** A rig standing higher than this at the hips is almost surely authored in centimetres (or millimetres). */
const TALL_HIPS = 5;
/** A length this many times over its limit reads as a unit slip (common practice, no source). */
const UNIT_SLIP = 5;

export function nameOf(path: string): SettingName {
  const known: SettingName | undefined = SETTING_NAMES[path as NamedSetting];
  if (known) return known;
  const last = path.split('.').filter((p) => !/^\d+$/.test(p)).pop() ?? 'setting';
  const words = last.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
  return { label: words.charAt(0).toUpperCase() + words.slice(1) };
}

const show = (v: number) => String(Number(v.toPrecision(3)));
const withUnit = (v: number, unit?: string) => (unit ? `${show(v)} ${unit}` : show(v));

export interface IssueLike {
  code?: string;
  path: readonly PropertyKey[];
  message: string;
  maximum?: unknown;
  minimum?: unknown;
  inclusive?: boolean;
  input?: unknown;
  expected?: unknown;
}

/**
 * One sentence for one zod issue of a leg setup. `value` is the value found at the path when the issue does
 * not carry it; `rig` (when known) lets a length far over its limit ask whether the character is in centimetres.
 */
export function setupIssueSentence(issue: IssueLike, value?: unknown, rig?: Rig | null): string {
  const path = issue.path.map(String).join('.');
  const { label, unit } = nameOf(path);
  const v = typeof issue.input === 'number' ? issue.input : typeof value === 'number' ? value : undefined;
  if (issue.code === 'too_big' && (typeof issue.maximum === 'number' || typeof issue.maximum === 'bigint')) {
    const max = Number(issue.maximum);
    const over = v === undefined ? `${label} is above its ${withUnit(max, unit)} limit` : `${label} ${withUnit(v, unit)} is above the ${withUnit(max, unit)} limit`;
    const metres = unit === 'm' || unit === 'm/s';
    const tall = rig ? rig.hipHeight > TALL_HIPS : v !== undefined && v > UNIT_SLIP * max;
    if (metres && tall) {
      const hips = rig ? ` (its hips stand ${show(rig.hipHeight)} m up)` : '';
      return `${over}; is the character in centimetres${hips}? Apply the unit fix on the character's page (scale 0.01), or set ${label} to at most ${withUnit(max, unit)}.`;
    }
    return `${over}; set it to at most ${withUnit(max, unit)}.`;
  }
  if (issue.code === 'too_small' && (typeof issue.minimum === 'number' || typeof issue.minimum === 'bigint')) {
    const min = Number(issue.minimum);
    const atLeast = issue.inclusive === false ? 'above' : 'at least';
    const what = v === undefined ? label : `${label} ${withUnit(v, unit)}`;
    return `${what} is below the ${withUnit(min, unit)} limit; set it to ${atLeast} ${withUnit(min, unit)}.`;
  }
  if (issue.code === 'invalid_type') return `${label} is missing or not ${issue.expected === 'number' ? 'a number' : `a ${String(issue.expected ?? 'value')}`}; enter one in the leg setup form.`;
  if (issue.code === 'invalid_value' || issue.code === 'invalid_enum_value') return `${label} is not one of the choices the leg setup form offers; pick one there.`;
  if (issue.code === 'not_multiple_of' || /integer|int/i.test(issue.message)) return `${label} must be a whole number; enter one in the leg setup form.`;
  return `${label}: ${issue.message.replace(/\.$/, '')}.`;
}

/** The value at a path of unknown input, when there is one. */
export function valueAtPath(input: unknown, path: readonly PropertyKey[]): unknown {
  let v: unknown = input;
  for (const k of path) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<PropertyKey, unknown>)[k as string];
  }
  return v;
}
