/**
 * Preset legs built in code (tests, benchmarks, demo characters).
 *
 * Every preset is expressed in its root (hip socket) frame: +Y up, +Z forward
 * (glTF convention), the leg hanging along −Y (the insect leg sticks out along
 * +X). The presets are symmetric about the sagittal plane except for limits
 * and sideways offsets; `mirrorChain` gives the other side.
 */
import type { ChainJoint, LegChain } from './types';

type V3 = [number, number, number];
type Q4 = [number, number, number, number];

const ID: Q4 = [0, 0, 0, 1];
const X: V3 = [1, 0, 0];
const Y: V3 = [0, 1, 0];
const Z: V3 = [0, 0, 1];

function len(v: readonly number[]): number {
  return Math.sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2]);
}

function finish(chain: Omit<LegChain, 'reach'>): LegChain {
  // Reach: sum of offsets after the first joint plus the sole offset (sliders at max extension).
  let reach = 0;
  for (let i = 1; i < chain.joints.length; i++) reach += len(chain.joints[i].offset);
  for (const j of chain.joints) {
    if (j.kind === 'slider') {
      const lim = j.limits?.[0];
      reach += lim ? Math.max(Math.abs(lim.min), Math.abs(lim.max)) : 0;
    }
  }
  reach += len(chain.sole);
  return { ...chain, reach };
}

export interface HumanLegProportions {
  /** Hip to knee, metres. */
  thigh: number;
  /** Knee to ankle, metres. */
  shin: number;
  /** Ankle height above the sole, metres. */
  ankleHeight: number;
  /** Sole point forward of the ankle, metres. */
  soleForward: number;
  /** Toe tip forward of the ankle, metres. */
  toe: number;
  /** Uniform scale applied to all lengths. */
  scale: number;
}

export const HUMAN_DEFAULTS: HumanLegProportions = {
  thigh: 0.45,
  shin: 0.43,
  ankleHeight: 0.08,
  soleForward: 0.05,
  toe: 0.18,
  scale: 1,
};

/** Human leg: hip ball, knee hinge (flexes backward, +X axis), ankle universal (X flexion, Z inversion) + sole. */
export function humanLeg(p: Partial<HumanLegProportions> = {}): LegChain {
  const q = { ...HUMAN_DEFAULTS, ...p };
  const s = q.scale;
  const joints: ChainJoint[] = [
    {
      name: 'hip',
      kind: 'ball',
      offset: [0, 0, 0],
      rest: [...ID],
      axes: [],
      ball: { twistAxis: [0, -1, 0], swing: 1.9, twistMin: -0.7, twistMax: 0.7 },
      weights: [1, 1, 1],
    },
    {
      name: 'knee',
      kind: 'hinge',
      offset: [0, -q.thigh * s, 0],
      rest: [...ID],
      axes: [[...X]],
      limits: [{ min: 0, max: 2.5 }],
      restValues: [0.15],
    },
    {
      name: 'ankle',
      kind: 'universal',
      offset: [0, -q.shin * s, 0],
      rest: [...ID],
      axes: [[...X], [...Z]],
      limits: [
        { min: -0.9, max: 0.6 },
        { min: -0.45, max: 0.45 },
      ],
      restValues: [-0.15, 0],
      weights: [0.5, 0.5],
    },
  ];
  return finish({
    name: 'human',
    kind: 'human',
    joints,
    sole: [0, -q.ankleHeight * s, q.soleForward * s],
    soleNormal: [0, 1, 0],
    toe: { offset: [0, -q.ankleHeight * s, q.toe * s] },
    knee: 1,
    kneeDirection: [0, 0, 1],
  });
}

export interface DigitigradeLegProportions {
  femur: number;
  tibia: number;
  metatarsus: number;
  /** Toe (phalanx) segment from the toe joint to the sole point. */
  paw: number;
  scale: number;
}

export const DIGITIGRADE_DEFAULTS: DigitigradeLegProportions = {
  femur: 0.22,
  tibia: 0.25,
  metatarsus: 0.14,
  paw: 0.05,
  scale: 1,
};

/**
 * Digitigrade hind leg (dog / bird): hip universal (X flexion, Z abduction),
 * stifle hinge, hock hinge, toe hinge; zig-zag at rest (stifle forward, hock back).
 */
export function digitigradeLeg(p: Partial<DigitigradeLegProportions> = {}): LegChain {
  const q = { ...DIGITIGRADE_DEFAULTS, ...p };
  const s = q.scale;
  const joints: ChainJoint[] = [
    {
      name: 'hip',
      kind: 'universal',
      offset: [0, 0, 0],
      rest: [...ID],
      axes: [[...X], [...Z]],
      limits: [
        { min: -1.6, max: 0.8 },
        { min: -0.5, max: 0.5 },
      ],
      restValues: [-0.6, 0],
    },
    {
      name: 'stifle',
      kind: 'hinge',
      offset: [0, -q.femur * s, 0],
      rest: [...ID],
      axes: [[...X]],
      limits: [{ min: 0.1, max: 2.4 }],
      restValues: [1.3],
    },
    {
      name: 'hock',
      kind: 'hinge',
      offset: [0, -q.tibia * s, 0],
      rest: [...ID],
      axes: [[...X]],
      limits: [{ min: -2.4, max: -0.1 }],
      restValues: [-1.1],
    },
    {
      name: 'toe',
      kind: 'hinge',
      offset: [0, -q.metatarsus * s, 0],
      rest: [...ID],
      axes: [[...X]],
      limits: [{ min: -0.5, max: 1.4 }],
      restValues: [0.4],
      weights: [0.3],
    },
  ];
  return finish({
    name: 'digitigrade',
    kind: 'digitigrade',
    joints,
    sole: [0, -q.paw * s, 0],
    soleNormal: [0, 1, 0],
    toe: { offset: [0, -q.paw * s, 0.03 * s] },
    knee: 1,
    kneeDirection: [0, 0, 1],
  });
}

export interface InsectLegProportions {
  coxa: number;
  femur: number;
  tibia: number;
  scale: number;
}

export const INSECT_DEFAULTS: InsectLegProportions = { coxa: 0.05, femur: 0.12, tibia: 0.16, scale: 1 };

/**
 * Insect leg sticking out along +X: coxa hinge (yaw about Y), femur hinge and
 * tibia hinge (about −Z: positive lifts the segment); femur raised, tibia down at rest.
 */
export function insectLeg(p: Partial<InsectLegProportions> = {}): LegChain {
  const q = { ...INSECT_DEFAULTS, ...p };
  const s = q.scale;
  const joints: ChainJoint[] = [
    {
      name: 'coxa',
      kind: 'hinge',
      offset: [0, 0, 0],
      rest: [...ID],
      axes: [[...Y]],
      limits: [{ min: -0.9, max: 0.9 }],
    },
    {
      name: 'femur',
      kind: 'hinge',
      offset: [q.coxa * s, 0, 0],
      rest: [...ID],
      axes: [[...Z]],
      limits: [{ min: -0.8, max: 1.4 }],
      restValues: [0.6],
    },
    {
      name: 'tibia',
      kind: 'hinge',
      offset: [q.femur * s, 0, 0],
      rest: [...ID],
      axes: [[...Z]],
      limits: [{ min: -2.6, max: -0.1 }],
      restValues: [-1.9],
    },
  ];
  return finish({
    name: 'insect',
    kind: 'insect',
    joints,
    sole: [q.tibia * s, 0, 0],
    soleNormal: [0, 1, 0],
    knee: 2,
    kneeDirection: [0, 1, 0],
  });
}

export interface PistonLegProportions {
  thigh: number;
  /** Fixed part of the lower leg, knee to the piston's zero position. */
  shin: number;
  /** Piston stroke (slider range 0..stroke), metres. */
  stroke: number;
  /** Foot pad height below the ankle. */
  pad: number;
  scale: number;
}

export const PISTON_DEFAULTS: PistonLegProportions = { thigh: 0.5, shin: 0.3, stroke: 0.3, pad: 0.06, scale: 1 };

/** Mech leg: hip universal (X, Z), knee hinge, telescopic shin (slider along −Y), ankle hinge + pad. */
export function pistonLeg(p: Partial<PistonLegProportions> = {}): LegChain {
  const q = { ...PISTON_DEFAULTS, ...p };
  const s = q.scale;
  const joints: ChainJoint[] = [
    {
      name: 'hip',
      kind: 'universal',
      offset: [0, 0, 0],
      rest: [...ID],
      axes: [[...X], [...Z]],
      limits: [
        { min: -1.4, max: 0.9 },
        { min: -0.4, max: 0.4 },
      ],
      restValues: [-0.2, 0],
    },
    {
      name: 'knee',
      kind: 'hinge',
      offset: [0, -q.thigh * s, 0],
      rest: [...ID],
      axes: [[...X]],
      limits: [{ min: 0, max: 2.0 }],
      restValues: [0.4],
    },
    {
      name: 'piston',
      kind: 'slider',
      offset: [0, -q.shin * s, 0],
      rest: [...ID],
      axes: [[0, -1, 0]],
      limits: [{ min: 0, max: q.stroke * s }],
      restValues: [0.5 * q.stroke * s],
    },
    {
      name: 'ankle',
      kind: 'hinge',
      offset: [0, 0, 0],
      rest: [...ID],
      axes: [[...X]],
      limits: [{ min: -0.8, max: 0.8 }],
      restValues: [-0.2],
      weights: [0.5],
    },
  ];
  return finish({
    name: 'piston',
    kind: 'piston',
    joints,
    sole: [0, -q.pad * s, 0.04 * s],
    soleNormal: [0, 1, 0],
    toe: { offset: [0, -q.pad * s, 0.15 * s] },
    knee: 1,
    kneeDirection: [0, 0, 1],
  });
}

export type PresetName = 'human' | 'digitigrade' | 'insect' | 'piston';

export const PRESET_NAMES: readonly PresetName[] = ['human', 'digitigrade', 'insect', 'piston'];

/** Build a preset leg by name with a uniform scale (1 = default proportions). */
export function presetLeg(name: PresetName, scale = 1): LegChain {
  switch (name) {
    case 'human':
      return humanLeg({ scale });
    case 'digitigrade':
      return digitigradeLeg({ scale });
    case 'insect':
      return insectLeg({ scale });
    case 'piston':
      return pistonLeg({ scale });
    default:
      throw new Error(`unknown preset leg: ${String(name)}`);
  }
}

/**
 * Mirror a chain through the root's YZ plane (x → −x): gives the left leg from
 * a right one. Rotation axes map to (ax, −ay, −az) with the same angles, so
 * hinge/universal limits stay; a ball's twist range flips sign; rest
 * quaternions map to (qx, −qy, −qz, qw).
 */
export function mirrorChain(chain: LegChain, name = `${chain.name}-mirrored`): LegChain {
  const mp = (v: readonly number[]): V3 => [-v[0], v[1], v[2]];
  const ma = (v: readonly number[]): V3 => [v[0], -v[1], -v[2]];
  const joints: ChainJoint[] = chain.joints.map((j) => ({
    ...j,
    offset: mp(j.offset),
    rest: [j.rest[0], -j.rest[1], -j.rest[2], j.rest[3]] as Q4,
    // Slider axes are directions (polar vectors): mirror like positions.
    axes: j.axes.map((a) => (j.kind === 'slider' ? mp(a) : ma(a))),
    limits: j.limits?.map((l) => ({ ...l })),
    ball: j.ball
      ? { twistAxis: mp(j.ball.twistAxis), swing: j.ball.swing, twistMin: -j.ball.twistMax, twistMax: -j.ball.twistMin }
      : undefined,
    weights: j.weights ? [...j.weights] : undefined,
    restValues: j.restValues ? [...j.restValues] : undefined,
  }));
  return {
    ...chain,
    name,
    joints,
    sole: mp(chain.sole),
    soleNormal: mp(chain.soleNormal),
    toe: chain.toe ? { offset: mp(chain.toe.offset) } : undefined,
    kneeDirection: chain.kneeDirection ? mp(chain.kneeDirection) : undefined,
  };
}
