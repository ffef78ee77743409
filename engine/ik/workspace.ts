/**
 * Per-leg solver workspace: the chain flattened into typed arrays, the current
 * pose (DOF values + ball quaternions), the root (hip) transform, the forward
 * kinematics output and every scratch buffer the solvers need. Created once per
 * leg; nothing is allocated while solving.
 */
import { vec3 } from 'gl-matrix';
import * as M3 from '../math/mat3';
import type { ChainJoint, LegChain } from '../rig/types';
import { DOF_COUNT } from '../rig/types';
import { AXIS_GENERAL, AXIS_NEGATIVE, DOF_BALL, DOF_ROT, DOF_SLIDE, JOINT_BALL, JOINT_HINGE, JOINT_SLIDER, JOINT_UNIVERSAL } from './layout';
import { CLAMP_REACH_FRACTION, DEFAULT_OPTIONS, type SolverOptions } from './options';
import { resetPose } from './pose';
import type { SolveResult } from './solve';

export interface IKWorkspace {
  readonly chain: LegChain;
  readonly nJoints: number;
  readonly nDof: number;
  readonly nBall: number;
  options: SolverOptions;

  // ---- flattened chain (static) ----
  /** Joint kind per joint (JOINT_* in layout.ts). */
  readonly jKind: Int32Array;
  /** First DOF index per joint. */
  readonly jDof0: Int32Array;
  /** Ball index per joint (−1 if not a ball). */
  readonly jBall: Int32Array;
  /** Offsets, 3 per joint. */
  readonly jOffset: Float64Array;
  /** Rest rotation matrices, 9 per joint, row-major. */
  readonly jRest: Float64Array;
  /** True if the rest rotation is the identity (skips a matrix product). */
  readonly jRestIdentity: Uint8Array;
  /** DOF kind (DOF_* in layout.ts), owning joint, local axis (3 per DOF). */
  readonly dKind: Int32Array;
  readonly dJoint: Int32Array;
  readonly dAxis: Float64Array;
  /** Axis code per DOF: 0/1/2 = +X/+Y/+Z, 3/4/5 = −X/−Y/−Z, AXIS_GENERAL otherwise (layout.ts). */
  readonly dAxisCode: Int32Array;
  /** Per-DOF limits (±Infinity for free and for ball components). */
  readonly lo: Float64Array;
  readonly hi: Float64Array;
  /** Chain weights per DOF; `weight` is the effective one (options.weights or chain). */
  readonly chainWeight: Float64Array;
  readonly weight: Float64Array;
  readonly sqrtWeight: Float64Array;
  readonly restPose: Float64Array;
  /** Ball limits per ball: twist axis (3), cos(swing/2), swing, twistMin, twistMax, hasLimit. */
  readonly bAxis: Float64Array;
  readonly bSwing: Float64Array;
  readonly bCosHalfSwing: Float64Array;
  readonly bTwistMin: Float64Array;
  readonly bTwistMax: Float64Array;
  /** cos/sin of half the twist bounds (in-range test without atan2). */
  readonly bCosHalfTwistMin: Float64Array;
  readonly bSinHalfTwistMin: Float64Array;
  readonly bCosHalfTwistMax: Float64Array;
  readonly bSinHalfTwistMax: Float64Array;
  readonly bLimited: Uint8Array;
  readonly sole: Float64Array;
  readonly soleNormal: Float64Array;
  readonly toe: Float64Array | null;
  readonly knee: number;
  /** Effective target clamp (options.clampDistance, or 0.1·reach when that is 0). */
  clampDistance: number;

  // ---- state ----
  /** DOF values; for ball joints the rotation vector of the quaternion (kept in sync after each solve). */
  readonly pose: Float64Array;
  /** Ball quaternions [x, y, z, w], 4 per ball (the source of truth for ball joints). */
  readonly quat: Float64Array;
  /** Root (hip socket) world position and rotation (row-major 3×3). */
  readonly rootPos: Float64Array;
  readonly rootRot: Float64Array;

  /** cos/sin cache of the rotational scalar DOFs (see forwardKinematics). */
  readonly trigAngle: Float64Array;
  readonly trigCos: Float64Array;
  readonly trigSin: Float64Array;
  readonly trigCount: Int32Array;

  // ---- forward kinematics output ----
  readonly jPos: Float64Array; // 3 per joint
  readonly jRot: Float64Array; // 9 per joint (world, row-major)
  readonly dAxisW: Float64Array; // 3 per DOF (world)
  readonly foot: Float64Array; // sole point, world
  readonly footUp: Float64Array; // sole normal, world
  /** A general-axis DOF's local rotation while forwardKinematics applies it (9). */
  readonly localRot: Float64Array;

  // ---- scratch ----
  /** Jacobian, column per DOF with stride 6 (rows 0–2 position, 3–5 orientation). */
  readonly J: Float64Array;
  readonly A: Float64Array; // 6×6
  readonly e: Float64Array; // 6
  readonly e2: Float64Array; // 6
  readonly eRes: Float64Array; // 6
  readonly y: Float64Array; // 6
  readonly dq: Float64Array; // n
  readonly z: Float64Array; // n (null-space bias)
  readonly locked: Uint8Array; // n
  readonly tmpN: Float64Array; // n
  readonly tmpN2: Float64Array; // n
  /** Effective weights of the current pass (weights with saturated DOFs locked). */
  readonly wEff: Float64Array; // n
  readonly swEff: Float64Array; // n (square roots)
  readonly dqLocked: Float64Array; // n
  readonly svdU: Float64Array; // n×6
  readonly svdS: Float64Array; // 6
  readonly svdV: Float64Array; // 6×6
  readonly svdA: Float64Array; // n×6
  readonly target: Float64Array; // 3
  readonly normal: Float64Array; // 3
  readonly errorHistory: Float64Array;
  /** Scalar scratch (doubles passed between hot functions without boxing; slots S_* in layout.ts). */
  readonly scalars: Float64Array;
  readonly result: SolveResult;
}

/** Number of DOFs of a chain. */
export function dofCount(chain: LegChain): number {
  let n = 0;
  for (const j of chain.joints) n += DOF_COUNT[j.kind];
  return n;
}

/** v / |v| (a division, not a product with the reciprocal: stored rigs keep their exact figures). */
function normalize3(v: readonly number[]): [number, number, number] {
  const out: [number, number, number] = [v[0], v[1], v[2]];
  const l = Math.sqrt(vec3.squaredLength(out));
  if (!(l > 0)) throw new Error('zero-length axis in leg chain');
  vec3.divide(out, out, [l, l, l]);
  return out;
}

/** The axis code (layout.ts) of a unit axis: a coordinate axis ± or AXIS_GENERAL. */
function axisCode(a: readonly number[]): number {
  for (let c = 0; c < 3; c++) {
    const alongC = Math.abs(a[c]) === 1 && a[(c + 1) % 3] === 0 && a[(c + 2) % 3] === 0;
    if (alongC) return a[c] > 0 ? c : c + AXIS_NEGATIVE;
  }
  return AXIS_GENERAL;
}

/** Build the workspace for one leg. Options are the defaults overridden by `options`. */
export function createWorkspace(chain: LegChain, options: Partial<SolverOptions> = {}): IKWorkspace {
  const nJ = chain.joints.length;
  if (nJ === 0) throw new Error('leg chain has no joints');
  let nBall = 0;
  for (const j of chain.joints) if (j.kind === 'ball') nBall++;
  const ws = allocate(chain, dofCount(chain), nBall, { ...DEFAULT_OPTIONS, ...options });
  let d = 0;
  let b = 0;
  for (let ji = 0; ji < nJ; ji++) {
    const j = chain.joints[ji];
    placeJoint(ws, j, ji, d);
    if (j.kind === 'ball') flattenBall(ws, j, ji, d, b++);
    else flattenAxes(ws, j, ji, d);
    d += DOF_COUNT[j.kind];
  }
  applyWeights(ws);
  applyClamp(ws);
  resetPose(ws);
  return ws;
}

/** Every buffer of the workspace, filled with the values of a free joint (no limits, weight 1, identity rest). */
function allocate(chain: LegChain, n: number, nBall: number, opts: SolverOptions): IKWorkspace {
  const nJ = chain.joints.length;
  const nb1 = Math.max(nBall, 1);
  const pose = new Float64Array(n);
  const quat = new Float64Array(4 * nb1);
  const result: SolveResult = {
    pose,
    iterations: 0,
    positionError: 0,
    orientationError: 0,
    converged: false,
    limitHits: 0,
    errorHistory: null,
    errorHistoryLength: 0,
  };
  const rootRot = new Float64Array(9);
  rootRot[0] = rootRot[4] = rootRot[8] = 1;
  return {
    chain,
    nJoints: nJ,
    nDof: n,
    nBall,
    options: opts,
    jKind: new Int32Array(nJ),
    jDof0: new Int32Array(nJ),
    jBall: new Int32Array(nJ).fill(-1),
    jOffset: new Float64Array(3 * nJ),
    jRest: new Float64Array(9 * nJ),
    jRestIdentity: new Uint8Array(nJ),
    dKind: new Int32Array(n),
    dJoint: new Int32Array(n),
    dAxis: new Float64Array(3 * n),
    dAxisCode: new Int32Array(n).fill(AXIS_GENERAL),
    lo: new Float64Array(n).fill(-Infinity),
    hi: new Float64Array(n).fill(Infinity),
    chainWeight: new Float64Array(n).fill(1),
    weight: new Float64Array(n),
    sqrtWeight: new Float64Array(n),
    restPose: new Float64Array(n),
    bAxis: new Float64Array(3 * nb1),
    bSwing: new Float64Array(nb1).fill(Math.PI),
    bCosHalfSwing: new Float64Array(nb1).fill(-1),
    bTwistMin: new Float64Array(nb1).fill(-Math.PI),
    bTwistMax: new Float64Array(nb1).fill(Math.PI),
    bCosHalfTwistMin: new Float64Array(nb1),
    bSinHalfTwistMin: new Float64Array(nb1),
    bCosHalfTwistMax: new Float64Array(nb1),
    bSinHalfTwistMax: new Float64Array(nb1),
    bLimited: new Uint8Array(nb1),
    sole: Float64Array.from(chain.sole),
    soleNormal: Float64Array.from(normalize3(chain.soleNormal)),
    toe: chain.toe ? Float64Array.from(chain.toe.offset) : null,
    knee: chain.knee ?? Math.max(0, nJ - 2),
    clampDistance: 0,
    pose,
    quat,
    trigAngle: new Float64Array(n),
    trigCos: new Float64Array(n).fill(1),
    trigSin: new Float64Array(n),
    trigCount: new Int32Array(n),
    rootPos: new Float64Array(3),
    rootRot,
    jPos: new Float64Array(3 * nJ),
    jRot: new Float64Array(9 * nJ),
    dAxisW: new Float64Array(3 * n),
    foot: new Float64Array(3),
    footUp: new Float64Array(3),
    localRot: new Float64Array(9),
    J: new Float64Array(6 * n),
    A: new Float64Array(36),
    e: new Float64Array(6),
    e2: new Float64Array(6),
    eRes: new Float64Array(6),
    y: new Float64Array(6),
    dq: new Float64Array(n),
    z: new Float64Array(n),
    locked: new Uint8Array(n),
    tmpN: new Float64Array(n),
    tmpN2: new Float64Array(n),
    wEff: new Float64Array(n),
    swEff: new Float64Array(n),
    dqLocked: new Float64Array(n),
    svdU: new Float64Array(6 * n),
    svdS: new Float64Array(6),
    svdV: new Float64Array(36),
    svdA: new Float64Array(6 * n),
    target: new Float64Array(3),
    normal: new Float64Array(3),
    errorHistory: new Float64Array(Math.max(opts.maxIterations, 1) + 1),
    scalars: new Float64Array(8),
    result,
  };
}

/** Joint ji's first DOF, offset and rest rotation. */
function placeJoint(ws: IKWorkspace, j: ChainJoint, ji: number, d: number): void {
  ws.jDof0[ji] = d;
  ws.jOffset[3 * ji] = j.offset[0];
  ws.jOffset[3 * ji + 1] = j.offset[1];
  ws.jOffset[3 * ji + 2] = j.offset[2];
  const r = j.rest ?? [0, 0, 0, 1];
  M3.fromQuat(ws.jRest, 9 * ji, r, 0);
  ws.jRestIdentity[ji] = r[0] === 0 && r[1] === 0 && r[2] === 0 ? 1 : 0;
}

/** Ball joint ji (ball b): three rotation-vector DOFs about its rest frame's axes, and its cone and twist limits. */
function flattenBall(ws: IKWorkspace, j: ChainJoint, ji: number, d: number, b: number): void {
  ws.jKind[ji] = JOINT_BALL;
  ws.jBall[ji] = b;
  for (let a = 0; a < 3; a++) {
    ws.dKind[d + a] = DOF_BALL;
    ws.dJoint[d + a] = ji;
    ws.dAxis[3 * (d + a) + a] = 1;
    ws.chainWeight[d + a] = j.weights?.[a] ?? 1;
  }
  if (j.ball) {
    ws.bAxis.set(normalize3(j.ball.twistAxis), 3 * b);
    ws.bSwing[b] = j.ball.swing;
    ws.bCosHalfSwing[b] = Math.cos(Math.min(j.ball.swing, Math.PI) / 2);
    ws.bTwistMin[b] = j.ball.twistMin;
    ws.bTwistMax[b] = j.ball.twistMax;
    if (!(j.ball.twistMin <= j.ball.twistMax)) throw new Error(`joint ${j.name}: twistMin > twistMax`);
    ws.bLimited[b] = 1;
  } else {
    ws.bAxis.set([0, -1, 0], 3 * b);
  }
  // cos/sin of the half twist bounds: clampBall's in-range test without an atan2.
  const hmin = Math.max(-Math.PI, ws.bTwistMin[b]) / 2;
  const hmax = Math.min(Math.PI, ws.bTwistMax[b]) / 2;
  ws.bCosHalfTwistMin[b] = Math.cos(hmin);
  ws.bSinHalfTwistMin[b] = Math.sin(hmin);
  ws.bCosHalfTwistMax[b] = Math.cos(hmax);
  ws.bSinHalfTwistMax[b] = Math.sin(hmax);
}

/** Hinge, universal or slider joint ji: one DOF per axis, with its limits, weight and rest value. */
function flattenAxes(ws: IKWorkspace, j: ChainJoint, ji: number, d: number): void {
  const k = DOF_COUNT[j.kind];
  ws.jKind[ji] = j.kind === 'hinge' ? JOINT_HINGE : j.kind === 'universal' ? JOINT_UNIVERSAL : JOINT_SLIDER;
  if (j.axes.length < k) throw new Error(`joint ${j.name}: ${j.kind} needs ${k} axes`);
  for (let a = 0; a < k; a++) {
    const i = d + a;
    ws.dKind[i] = j.kind === 'slider' ? DOF_SLIDE : DOF_ROT;
    ws.dJoint[i] = ji;
    const ax = normalize3(j.axes[a]);
    ws.dAxis.set(ax, 3 * i);
    ws.dAxisCode[i] = axisCode(ax);
    const lim = j.limits?.[a];
    if (lim) {
      if (!(lim.min <= lim.max)) throw new Error(`joint ${j.name}: limit min > max`);
      ws.lo[i] = lim.min;
      ws.hi[i] = lim.max;
    }
    ws.chainWeight[i] = j.weights?.[a] ?? 1;
    ws.restPose[i] = Math.min(ws.hi[i], Math.max(ws.lo[i], j.restValues?.[a] ?? 0));
  }
}

/** Recompute effective weights from options.weights (or the chain's). */
export function applyWeights(ws: IKWorkspace): void {
  const w = ws.options.weights;
  if (w && w.length !== ws.nDof) throw new Error(`weights: expected ${ws.nDof} values, got ${w.length}`);
  for (let i = 0; i < ws.nDof; i++) {
    const v = w ? w[i] : ws.chainWeight[i];
    if (!(v >= 0)) throw new Error('weights must be ≥ 0');
    ws.weight[i] = v;
    ws.sqrtWeight[i] = Math.sqrt(v);
  }
}

/** Resolve the effective target clamp distance. */
export function applyClamp(ws: IKWorkspace): void {
  const c = ws.options.clampDistance;
  ws.clampDistance = c > 0 ? c : CLAMP_REACH_FRACTION * (ws.chain.reach > 0 ? ws.chain.reach : 1);
}

/** Replace some options (kept for later solves). */
export function setOptions(ws: IKWorkspace, options: Partial<SolverOptions>): void {
  const next = { ...ws.options, ...options };
  const needHistory = Math.max(next.maxIterations, 1) + 1;
  if (needHistory > ws.errorHistory.length) {
    (ws as { errorHistory: Float64Array }).errorHistory = new Float64Array(needHistory);
  }
  ws.options = next;
  if ('weights' in options) applyWeights(ws);
  applyClamp(ws);
}

/** Set the root (hip socket) transform from a position and a unit quaternion [x, y, z, w]. */
export function setRootTransform(ws: IKWorkspace, position: ArrayLike<number>, rotation?: ArrayLike<number>): void {
  vec3.copy(ws.rootPos, position as vec3);
  if (rotation) M3.fromQuat(ws.rootRot, 0, rotation, 0);
}

/** Set the root transform from a 4×4 column-major matrix (gl-matrix / three.js layout; rigid, no scale). */
export function setRootMatrix(ws: IKWorkspace, m: ArrayLike<number>): void {
  M3.fromMat4(ws.rootRot, 0, m);
  vec3.set(ws.rootPos, m[12], m[13], m[14]);
}
