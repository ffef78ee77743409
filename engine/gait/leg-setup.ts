/**
 * The leg setup: every tunable setting of one character's legs. This one
 * schema is shared by the server, the app's form and the exported profile.
 * Angles are radians, lengths metres, times seconds.
 */
import { z } from 'zod';
import { setupIssueSentence, valueAtPath, type IssueLike } from './setting-sentences';
import { DEFAULT_OPTIONS, SOLVER_METHODS, type SolverMethod, type SolverOptions } from '../ik/options';
import { dofCount } from '../ik/workspace';
import { GAIT_PATTERNS, PRESET_GAITS, defaultPatternFor, evenPhaseOffsets } from './patterns';
import type { Rig } from './rig';
import { fixedLengthLeg } from './walk-height';
import { DEFAULT_FROUDE, alexanderStride, speedForFroude } from './stride';

export const LEG_SETUP_VERSION = 1;

/**
 * Default joint speed limit, °/s: just under the 720 °/s snap threshold, so a
 * solve never pops, and well above the few hundred °/s a knee reaches in
 * walking (from memory, Winter's gait data), so a swing is not held back.
 */
export const DEFAULT_MAX_JOINT_SPEED = 700;

/**
 * How a leg setup stores each solver option (SolverOptions, engine/ik/options.ts,
 * where each is defined and defaulted): its schema, or null for an option a
 * setup does not carry. Keyed by the options interface, so an option added
 * there fails the type check until it is placed here; defaults and the map to
 * the engine (defaultSolverSettings, solverOptionsOf) are derived from this table.
 */
const SOLVER_OPTION_FIELDS = {
  method: z.enum(SOLVER_METHODS as unknown as [SolverMethod, ...SolverMethod[]]),
  maxIterations: z.number().int().min(1).max(1000),
  tolerance: z.number().positive().max(0.1).describe('m'),
  orientationTolerance: z.number().positive().max(1).describe('rad'),
  maxStepAngle: z.number().positive().max(Math.PI).describe('largest joint change per iteration, rad'),
  maxStepLength: z.number().positive().max(1).describe('largest slider change per iteration, m'),
  /** Task error clamp per iteration (Buss & Kim 2005), m; 0 = the engine's automatic clamp, null = off (the engine's Infinity). */
  clampDistance: z.number().min(0).max(10).nullable(),
  orientationWeight: z.number().min(0).max(10).describe('m per rad'),
  lambda: z.number().min(0).max(10).describe('DLS damping, m'),
  svdThreshold: z.number().min(0).max(1),
  gammaMax: z.number().positive().max(Math.PI).describe('SDLS largest joint change, rad'),
  adaptiveMode: z.enum(['manipulability', 'error']),
  manipulabilityThreshold: z.number().positive().max(10),
  lmBias: z.number().min(0).max(1),
  /** Per-DOF mobility comes from the rig's joints, not the setup. */
  weights: null,
  /** A pole point is a world position: a setup, which is the same for every course, offers only the pull to rest. */
  nullSpace: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('none') }),
    z.object({ kind: z.literal('rest'), gain: z.number().min(0).max(1) }),
  ]),
  minStep: z.number().min(0).max(0.1),
  resolveSaturated: z.boolean(),
  /** A switch for tests and benchmarks. */
  recordErrors: null,
  /** Each frame's solve starts from the walk's guess (warmStart below), never from a stored pose. */
  startPose: null,
} satisfies Record<keyof SolverOptions, z.ZodType | null>;

type StoredOptionKey = {
  [K in keyof typeof SOLVER_OPTION_FIELDS]: (typeof SOLVER_OPTION_FIELDS)[K] extends null ? never : K;
}[keyof typeof SOLVER_OPTION_FIELDS];

/** The solver options a leg setup stores, in the table's order. */
export const STORED_SOLVER_OPTIONS = Object.keys(SOLVER_OPTION_FIELDS).filter(
  (k) => SOLVER_OPTION_FIELDS[k as keyof SolverOptions] !== null,
) as StoredOptionKey[];

const storedOptionShape = Object.fromEntries(STORED_SOLVER_OPTIONS.map((k) => [k, SOLVER_OPTION_FIELDS[k]])) as {
  [K in StoredOptionKey]: (typeof SOLVER_OPTION_FIELDS)[K];
};

export const SolverSettingsSchema = z.object({
  ...storedOptionShape,
  /**
   * How a walk guesses each frame's starting pose before it solves: the last
   * pose, or the last pose carried on at its rate of change (the solver's own
   * start is options.startPose, always 'current' in a walk).
   */
  warmStart: z.enum(['previous', 'extrapolate']),
  /** Align the sole with the ground normal (needs an ankle: on by default only for legs with 6 or more DOFs). */
  footOrientation: z.boolean(),
  /**
   * Largest joint speed a frame's solve may ask for, °/s: a solve that would
   * flip a leg from one bend to another in one frame is spread over several.
   */
  maxJointSpeed: z.number().positive().max(100000).default(DEFAULT_MAX_JOINT_SPEED).describe('°/s'),
});

export const GaitSettingsSchema = z.object({
  pattern: z.enum(GAIT_PATTERNS),
  /** Touchdown time of each leg as a fraction of the cycle, in rig leg order; null = the pattern's. */
  phaseOffsets: z.array(z.number().min(0).max(1)).min(1).max(16).nullable(),
  dutyFactor: z.number().min(0.05).max(0.98),
  timing: z.discriminatedUnion('mode', [
    z.object({ mode: z.literal('speed'), speed: z.number().positive().max(20).describe('m/s') }),
    z.object({ mode: z.literal('cycle'), cycleTime: z.number().min(0.1).max(10).describe('s') }),
  ]),
  /** Stride length (one foot, one full cycle); null = Alexander (1976) from hip height and speed. */
  stride: z.number().min(0.01).max(10).nullable(),
  /** Swing clearance over the highest ground under the swing path, m. */
  stepHeight: z.number().min(0).max(1),
});

export const BodySettingsSchema = z.object({
  /** Added to the rig's neutral hip height, m. */
  heightOffset: z.number().min(-2).max(2),
  /** How much of the planted feet's height change the body follows, 0..1. */
  followHeight: z.number().min(0).max(1),
  followPitch: z.number().min(0).max(1),
  followRoll: z.number().min(0).max(1),
  /** 2 % settling time of the critically damped body filter, s. */
  settleTime: z.number().min(0.02).max(5),
  /** Body lowering per radian of ground slope, as a fraction of hip height. */
  slopeCrouch: z.number().min(0).max(2),
});

/** The foothold search (foothold.ts): radius as a share of the stride, and the weights of its cost. */
export const FootholdSettingsSchema = z.object({
  searchRadius: z.number().min(0).max(1).describe('candidate search radius as a share of the stride'),
  distanceWeight: z.number().min(0).max(100).describe('cost of a candidate at the search radius from the nominal spot'),
  slopeWeight: z.number().min(0).max(100).describe('cost per radian of ground slope'),
  roughnessWeight: z.number().min(0).max(1000).describe('cost per metre of mean height spread under the sole'),
  edgeWeight: z.number().min(0).max(1000).describe('cost per metre of height jump under the sole'),
  reachWeight: z.number().min(0).max(100).describe('cost of a candidate at the rejection limit of reach'),
});

/** Foothold defaults: our own choice (common practice, no source): one stair nosing under the sole's rim outweighs the whole search radius. */
export const DEFAULT_FOOTHOLDS: FootholdSettings = {
  searchRadius: 0.18,
  distanceWeight: 1,
  slopeWeight: 2,
  roughnessWeight: 20,
  edgeWeight: 40,
  reachWeight: 4,
};

export const JointLimitOverrideSchema = z
  .object({
    joint: z.string().min(1),
    /** DOF of the joint (0 for a hinge or slider; 0–1 for a universal joint). */
    dof: z.number().int().min(0).max(1).default(0),
    /** Radians for rotations, metres for sliders. */
    min: z.number(),
    max: z.number(),
  })
  .refine((l) => l.min <= l.max, { message: 'min must not exceed max', path: ['max'] });

export const LegOverrideSchema = z.object({
  leg: z.string().min(1),
  limits: z.array(JointLimitOverrideSchema).max(32).default([]),
  /** Solver settings for this leg only, over the setup's solver. */
  solver: SolverSettingsSchema.partial().optional(),
});

export const LegSetupSchema = z
  .object({
    version: z.literal(LEG_SETUP_VERSION),
    solver: SolverSettingsSchema,
    gait: GaitSettingsSchema,
    body: BodySettingsSchema,
    footholds: FootholdSettingsSchema.default(() => ({ ...DEFAULT_FOOTHOLDS })),
    legs: z.array(LegOverrideSchema).max(16).default([]),
  })
  .superRefine((s, ctx) => {
    if (s.gait.pattern === 'custom' && s.gait.phaseOffsets === null) {
      ctx.addIssue({ code: 'custom', path: ['gait', 'phaseOffsets'], message: 'the custom pattern needs phaseOffsets' });
    }
  });

export type SolverSettings = z.infer<typeof SolverSettingsSchema>;
export type GaitSettings = z.infer<typeof GaitSettingsSchema>;
export type BodySettings = z.infer<typeof BodySettingsSchema>;
export type FootholdSettings = z.infer<typeof FootholdSettingsSchema>;
export type LegOverride = z.infer<typeof LegOverrideSchema>;
export type LegSetup = z.infer<typeof LegSetupSchema>;
export type LegSetupInput = z.input<typeof LegSetupSchema>;

export class LegSetupError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LegSetupError';
  }
}

/** Legs with fewer DOFs cannot place the sole and also turn it to the ground. */
const MIN_DOFS_FOR_ORIENTATION = 6;

/** Body defaults: common practice, no source (a filter that settles in about a step). */
export const DEFAULT_BODY: BodySettings = {
  heightOffset: 0,
  followHeight: 1,
  followPitch: 1,
  followRoll: 1,
  settleTime: 0.3,
  slopeCrouch: 0.15,
};

/**
 * Position tolerance of a walking leg, m: half a millimetre is invisible at
 * game scale and a quarter of the finest stumble threshold (2 mm scuff); it
 * needs about a third fewer iterations than the IK engine's general 0.1 mm.
 */
export const TRIAL_TOLERANCE = 5e-4;

/**
 * Orientation of a walking sole: a degree and a bit of tilt is invisible
 * (1.1° over a 10 cm sole is 2 mm), and the orientation rows weigh 3 cm per
 * radian, so a sole that cannot lie flat (ankle at its limit) is left tilted
 * rather than bought with a twist of the hip. Common practice, no source.
 */
export const TRIAL_ORIENTATION_TOLERANCE = 0.02;
export const TRIAL_ORIENTATION_WEIGHT = 0.03;
/** Leg reach at which the orientation weight is TRIAL_ORIENTATION_WEIGHT; it scales with reach (a little over the preset biped's 1.07 m: its tuned rows are kept). */
export const ORIENTATION_WEIGHT_REACH = 1.1;

/** Default step height as a fraction of hip height (common practice, no source). */
export const DEFAULT_STEP_HEIGHT_RATIO = 0.1;
/**
 * ...and never less than this fraction of the shortest leg's reach: a sprawled leg (an insect's) stands far
 * lower than it is long, and a tenth of its hip height (1.8 cm for the hexapod) left a swing climbing a code
 * riser 1.8 cm over the nosing while the foot lagged its target by 4 cm (scuffs). Our own choice.
 */
export const DEFAULT_STEP_HEIGHT_REACH_RATIO = 0.05;

function defaultStepHeight(rig: Rig): number {
  let reach = Infinity;
  for (const l of rig.legs) if (l.chain.reach < reach) reach = l.chain.reach;
  const byHip = DEFAULT_STEP_HEIGHT_RATIO * rig.hipHeight;
  const byReach = Number.isFinite(reach) ? DEFAULT_STEP_HEIGHT_REACH_RATIO * reach : 0;
  return byHip > byReach ? byHip : byReach;
}

export function defaultSolverSettings(footOrientation: boolean): SolverSettings {
  const engine = DEFAULT_OPTIONS;
  const stored = Object.fromEntries(STORED_SOLVER_OPTIONS.map((k) => [k, engine[k]])) as Pick<SolverOptions, StoredOptionKey>;
  return {
    ...stored,
    tolerance: TRIAL_TOLERANCE,
    orientationTolerance: TRIAL_ORIENTATION_TOLERANCE,
    clampDistance: Number.isFinite(engine.clampDistance) ? engine.clampDistance : null,
    orientationWeight: TRIAL_ORIENTATION_WEIGHT,
    nullSpace: engine.nullSpace.kind === 'rest' ? { kind: 'rest', gain: engine.nullSpace.gain } : { kind: 'none' },
    warmStart: 'extrapolate',
    footOrientation,
    maxJointSpeed: DEFAULT_MAX_JOINT_SPEED,
  };
}

/** The defaults before they are fitted to the rig's size (defaultLegSetup does that). */
function baseLegSetup(rig: Rig): LegSetup {
  const pattern = defaultPatternFor(rig.legs.length);
  const preset = pattern === 'custom' ? null : PRESET_GAITS[pattern];
  const orient = rig.legs.every((l) => dofCount(l.chain) >= MIN_DOFS_FOR_ORIENTATION);
  return {
    version: LEG_SETUP_VERSION,
    solver: defaultSolverSettings(orient),
    gait: {
      pattern,
      phaseOffsets: preset ? null : evenPhaseOffsets(rig.legs.length),
      dutyFactor: preset ? preset.dutyFactor : 0.75,
      timing: { mode: 'speed', speed: speedForFroude(DEFAULT_FROUDE, rig.hipHeight) },
      stride: null,
      stepHeight: defaultStepHeight(rig),
    },
    body: { ...DEFAULT_BODY },
    footholds: { ...DEFAULT_FOOTHOLDS },
    legs: [],
  };
}

/** Parse unknown input (API body, form, profile); the error names every problem. */
export function parseLegSetup(input: unknown): LegSetup {
  const parsed = LegSetupSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  // One sentence per problem, naming the setting and the fix, with the setting's path for a programmer.
  const sentences = parsed.error.issues.map((i) => `${setupIssueSentence(i as IssueLike, valueAtPath(input, i.path))} (${i.path.map(String).join('.') || 'setup'})`);
  throw new LegSetupError(`invalid leg setup: ${sentences.join(' ')}`);
}

/** The setup's solver settings with a leg's own overrides applied. */
export function legSolverSettings(setup: LegSetup, legName: string): SolverSettings {
  const own = setup.legs.find((l) => l.leg === legName)?.solver;
  return own ? { ...setup.solver, ...own } : setup.solver;
}

/** The solver options the IK engine takes for these settings. */
export function solverOptionsOf(s: SolverSettings): Partial<SolverOptions> {
  const options: Partial<Record<keyof SolverOptions, unknown>> = {};
  for (const k of STORED_SOLVER_OPTIONS) options[k] = s[k];
  options.clampDistance = s.clampDistance ?? Infinity;
  options.startPose = 'current';
  return options as Partial<SolverOptions>;
}

/** Checks that need the rig: leg and joint names, number of phase offsets. Throws a LegSetupError. */
export function checkLegSetupForRig(setup: LegSetup, rig: Rig): void {
  const offsets = setup.gait.phaseOffsets;
  const pattern = setup.gait.pattern;
  if (offsets && offsets.length !== rig.legs.length) {
    throw new LegSetupError(`gait.phaseOffsets: rig ${rig.name} has ${rig.legs.length} legs, got ${offsets.length} offsets; give one offset per leg, or none to use the pattern's`);
  }
  if (!offsets && pattern !== 'custom' && PRESET_GAITS[pattern].legs !== rig.legs.length) {
    throw new LegSetupError(
      `gait.pattern: ${pattern} is for ${PRESET_GAITS[pattern].legs} legs, rig ${rig.name} has ${rig.legs.length}; pick a pattern for ${rig.legs.length} legs, or give one phase offset per leg`,
    );
  }
  setup.legs.forEach((o, i) => {
    const leg = rig.legs.find((l) => l.name === o.leg);
    if (!leg) throw new LegSetupError(`legs[${i}].leg: rig ${rig.name} has no leg named ${o.leg} (its legs: ${rig.legs.map((l) => l.name).join(', ')}); rename or remove this override`);
    o.limits.forEach((lim, k) => {
      const joint = leg.chain.joints.find((j) => j.name === lim.joint);
      const where = `legs[${i}].limits[${k}]`;
      if (!joint) throw new LegSetupError(`${where}.joint: leg ${o.leg} has no joint named ${lim.joint} (its joints: ${leg.chain.joints.map((j) => j.name).join(', ')}); rename or remove this limit`);
      if (joint.kind === 'ball') throw new LegSetupError(`${where}.joint: ${lim.joint} is a ball joint; only hinge, universal and slider limits can be overridden`);
      const dofs = joint.kind === 'universal' ? 2 : 1;
      if (lim.dof >= dofs) throw new LegSetupError(`${where}.dof: ${lim.joint} has ${dofs} DOF(s), got dof ${lim.dof}`);
    });
  });
}

/**
 * Largest joint speed the derived defaults plan a swing for, °/s: well under the default joint speed limit
 * (700 °/s), since a knee folds faster than the hip sweeps (common practice, no source).
 */
export const PLANNED_SWING_SPEED = 300;
/** Peak over mean speed of a minimum-jerk move (Flash & Hogan 1985): 15/8. */
const MIN_JERK_PEAK = 15 / 8;

/** How far a fixed-length leg's hip may drift from its length to the planted foot over a stance, m: the sole ends the stance about that far under the ground, and a swinging sole 2 mm under is a scuff. */
const FIXED_LENGTH_DRIFT = 0.001;

/**
 * Longest stance travel over which every fixed-length leg (walk-height.ts) keeps its planted foot within
 * FIXED_LENGTH_DRIFT of its length: with the hip over the neutral spot at full length, a foot s further along
 * the walk is ((dz + s)² − dz²) / 2L further from the hip, to first order. Infinity without such legs.
 */
function fixedLengthStance(rig: Rig): number {
  let travel = Infinity;
  for (const leg of rig.legs) {
    if (!fixedLengthLeg(leg.chain)) continue;
    const dz = Math.abs(leg.neutralFoot[1] - leg.hip[2]);
    // Half the travel, s, solves s² + 2·dz·s = 2·L·drift.
    const s = -dz + Math.sqrt(dz * dz + 2 * leg.chain.reach * FIXED_LENGTH_DRIFT);
    travel = Math.min(travel, 2 * s);
  }
  return travel;
}

/**
 * The defaults of a rig, scaled to its own size and proportions. Step height is a share of hip height, speed
 * a Froude number (dynamically similar walking), slowed where a small rig's swings would ask its joints for
 * more than PLANNED_SWING_SPEED (the joint speed limit is in °/s whatever the size, so a mouse-sized leg that
 * walked at the Froude speed would lag its targets and drag its toes).
 */
export function defaultLegSetup(rig: Rig): LegSetup {
  const setup = baseLegSetup(rig);
  const reach = Math.min(...rig.legs.map((l) => l.chain.reach));
  // Orientation rows weigh metres per radian: a big leg's sole would otherwise be turned by ever less (and
  // bought with a knee flip); below the reference the weight stays, as a smaller one leaves solves unconverged.
  setup.solver.orientationWeight = TRIAL_ORIENTATION_WEIGHT * Math.max(1, reach / ORIENTATION_WEIGHT_REACH);
  const g = setup.gait;
  if (g.timing.mode !== 'speed') return setup;
  let speed = g.timing.speed;
  let stride = alexanderStride(rig.hipHeight, speed);
  const cycle = stride / speed;
  const fixedStance = fixedLengthStance(rig);
  if (g.dutyFactor * stride > fixedStance) {
    // Same cadence, shorter steps: a leg that cannot fold keeps its foot on the ground only near its neutral spot.
    stride = fixedStance / g.dutyFactor;
    speed = stride / cycle;
    setup.gait.stride = stride;
    setup.gait.timing = { mode: 'speed', speed };
  }
  const sweep = (g.dutyFactor * stride) / reach;
  const peak = (MIN_JERK_PEAK * sweep * (180 / Math.PI)) / ((1 - g.dutyFactor) * cycle);
  // The peak joint speed goes with the walking speed (stride ∝ v^0.6 and cycle ∝ v^-0.4 under Alexander's relation).
  if (peak > PLANNED_SWING_SPEED) setup.gait.timing = { mode: 'speed', speed: (speed * PLANNED_SWING_SPEED) / peak };
  return setup;
}
