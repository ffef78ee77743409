/**
 * The package's public types, written out here so its declarations stand alone: a game type-checks against
 * treadle-runtime with no other package installed. walker.ts checks these against the engine's own types.
 */

/** A joint of the game's skeleton (glTF conventions: metres, +Y up, quaternions [x, y, z, w]). */
export interface SkeletonJoint {
  name: string;
  /** Index of the parent joint in `joints`, or -1 for a root. */
  parent: number;
  /** Rest (bind) local transform relative to the parent. */
  translation: [number, number, number];
  rotation: [number, number, number, number];
  scale: [number, number, number];
}

export interface Skeleton {
  joints: SkeletonJoint[];
}

/** Ground as a regular grid of heights: column c at x = (c − (cols − 1)/2)·cellSize, row r at z = r·cellSize. */
export interface HeightfieldGround {
  cols: number;
  rows: number;
  cellSize: number;
  /** rows × cols heights in metres, row-major. */
  heights: Float64Array;
}

export type StumbleKindName = 'sink' | 'skid' | 'reach-miss' | 'scuff' | 'snap';

/** A leg profile file as Treadle publishes it (validated by loadProfile); the fields a game usually reads. */
export interface LegProfileFile {
  schema: string;
  profileId: number;
  version: number;
  character: { name: string; sha256: string };
  publishedAt: string;
  rig: { legs: { name: string; side: string; joints: { joint: string }[]; end: string }[] };
}

/** The game's ground: height under (x, z), its unit normal written into normal[0..2] (leave it to have it estimated). */
export type GroundQuery = (x: number, z: number, normal: Float64Array) => number;

/** What went wrong with the game's ground; the runtime holds its last good pose meanwhile. */
export interface LegRuntimeError {
  kind: 'ground';
  message: string;
  x: number;
  z: number;
}

/** A profile bound to the game's skeleton by joint names. */
export interface BoundLegProfile {
  readonly profile: LegProfileFile;
}

export interface LegRuntimeOptions {
  /** Internal fixed step, s (default 1/60). */
  timeStep?: number;
  /** Longest walk without drive, s (the ground's length usually ends it first). */
  duration?: number;
  /** Start position (x, z), m, and heading, rad about +Y (0 faces +Z). */
  position?: readonly [number, number];
  heading?: number;
  /** Spacing at which a GroundQuery is sampled along swing paths, m. */
  groundSpacing?: number;
  /** Start standing, every foot planted (a game's spawn); default: walking straight ahead as a trial does. */
  standing?: boolean;
  /** Count stumbles as Treadle's trials do (costs a ground query per foot and step); default off. */
  watchStumbles?: boolean;
  /** Called once when the ground starts failing (again after it has recovered). */
  onError?: (error: LegRuntimeError) => void;
}

/** The legs of one character in the game: the game moves the body, the runtime plants the feet. */
export interface LegRuntime {
  /** Leg names in the order every per-leg call uses (front to back, left before right). */
  readonly legNames: readonly string[];
  /** The fixed internal step, s. */
  readonly timeStep: number;
  /** Fixed steps taken so far. */
  readonly frame: number;
  /** Seconds of game time consumed by update() (and step()). */
  readonly time: number;
  /** Share of the way from the previous fixed step to the last that drawing shows, 0..1. */
  readonly alpha: number;
  /** The body's planar speed and turn rate the walk follows now (after the limits), m/s and rad/s. */
  readonly speed: number;
  readonly turnRate: number;
  /** Gait cycle time now, s. */
  readonly cycleTime: number;
  /** Every foot planted and the body standing. */
  readonly resting: boolean;
  /** The first problem met (null: none); reported once through onError as well. */
  readonly lastError: LegRuntimeError | null;
  /** Desired planar velocity in world axes (m/s) and turn rate (rad/s); followed within the profile's limits. */
  drive(vx: number, vz: number, turnRate: number): void;
  /** Or: the body's world position (x, z) and heading (rad about +Y, 0 faces +Z) the game moved it to this frame. */
  follow(x: number, z: number, heading: number): void;
  /** Advance by a frame time of any length, s: fixed steps inside, drawing interpolated between the last two. */
  update(dt: number): void;
  /** One fixed step (no interpolation); false once a walk without drive reached the end of a heightfield. */
  step(): boolean;
  inStance(leg: number): boolean;
  footPosition(leg: number, out?: Float64Array): Float64Array;
  footTarget(leg: number, out?: Float64Array): Float64Array;
  /** The game skeleton's joint indices of the leg's moving joints, hip first. */
  jointIndices(leg: number): readonly number[];
  /** World matrix (column-major 4×4, rest-space axes) of the leg's k-th moving joint, interpolated. */
  jointWorldMatrix(leg: number, k: number, out?: Float64Array): Float64Array;
  bodyPosition(out?: Float64Array): Float64Array;
  /** Body rotation [x, y, z, w]: heading, then roll and pitch from the feet. */
  bodyRotation(out?: Float64Array): Float64Array;
  /** Stumbles seen so far per kind, in the order of STUMBLE_KINDS (all 0 unless options.watchStumbles). */
  stumbleCounts(out?: Int32Array): Int32Array;
  /**
   * Where the character's rest space sits in the world (column-major 4×4): the character's root goes here, and
   * each leg bone turns by jointWorldMatrix's rotation relative to the body (sample/game.js writes it out).
   */
  characterMatrix(out?: Float64Array): Float64Array;
}

/** An error class the package throws; test a caught error with `instanceof`. */
export interface ErrorClass {
  new (message: string): Error;
  readonly prototype: Error;
}
