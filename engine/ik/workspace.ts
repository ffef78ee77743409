/**
 * Per-leg solver workspace: the chain flattened into typed arrays, the current
 * pose (DOF values + ball quaternions), the root (hip) transform, the forward
 * kinematics output and every scratch buffer the solvers need. Created once per
 * leg; nothing is allocated while solving.
 */
import type { LegChain } from '../rig/types';
import { DOF_COUNT } from '../rig/types';
import type { SolveResult, SolverOptions } from './types';

/** DOF motion kinds in the flattened layout. */
export const DOF_ROT = 0; // hinge or one axis of a universal joint
export const DOF_BALL = 1; // one of the three rotation-vector components of a ball joint
export const DOF_SLIDE = 2;

export const JOINT_HINGE = 0;
export const JOINT_UNIVERSAL = 1;
export const JOINT_BALL = 2;
export const JOINT_SLIDER = 3;

export const DEFAULT_OPTIONS: SolverOptions = {
  method: 'dls',
  maxIterations: 32,
  tolerance: 5e-4,
  orientationTolerance: 1e-3,
  maxStepAngle: 0.6,
  maxStepLength: 0.1,
  clampDistance: 0,
  orientationWeight: 0.1,
  lambda: 0.05,
  svdThreshold: 1e-4,
  gammaMax: Math.PI / 4,
  adaptiveMode: 'error',
  manipulabilityThreshold: 1e-2,
  lmBias: 1e-4,
  weights: null,
  nullSpace: { kind: 'none' },
  minStep: 1e-9,
  resolveSaturated: true,
  recordErrors: false,
  warmStart: 'current',
};

export interface IKWorkspace {
  readonly chain: LegChain;
  readonly nJoints: number;
  readonly nDof: number;
  readonly nBall: number;
  options: SolverOptions;

  // ---- flattened chain (static) ----
  /** Joint kind per joint (JOINT_*). */
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
  /** DOF kind (DOF_*), owning joint, local axis (3 per DOF). */
  readonly dKind: Int32Array;
  readonly dJoint: Int32Array;
  readonly dAxis: Float64Array;
  /** Axis code per DOF: 0/1/2 = +X/+Y/+Z, 3/4/5 = −X/−Y/−Z, 6 = general. */
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

  // ---- scratch ----
  /** Jacobian, column per DOF with stride 6 (rows 0–2 position, 3–5 orientation). */
  readonly J: Float64Array;
  readonly Jw: Float64Array; // weighted copy (stride 6)
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
  readonly savePose: Float64Array;
  readonly saveQuat: Float64Array;
  readonly target: Float64Array; // 3
  readonly normal: Float64Array; // 3
  readonly errorHistory: Float64Array;
  /** Scalar scratch (doubles passed between hot functions without boxing). */
  readonly scalars: Float64Array;
  readonly result: SolveResult;
}

function quatToMat(x: number, y: number, z: number, w: number, m: Float64Array, o: number): void {
  const n = Math.sqrt(x * x + y * y + z * z + w * w) || 1;
  x /= n;
  y /= n;
  z /= n;
  w /= n;
  m[o] = 1 - 2 * (y * y + z * z);
  m[o + 1] = 2 * (x * y - z * w);
  m[o + 2] = 2 * (x * z + y * w);
  m[o + 3] = 2 * (x * y + z * w);
  m[o + 4] = 1 - 2 * (x * x + z * z);
  m[o + 5] = 2 * (y * z - x * w);
  m[o + 6] = 2 * (x * z - y * w);
  m[o + 7] = 2 * (y * z + x * w);
  m[o + 8] = 1 - 2 * (x * x + y * y);
}

export { quatToMat };

/** Number of DOFs of a chain. */
export function dofCount(chain: LegChain): number {
  let n = 0;
  for (const j of chain.joints) n += DOF_COUNT[j.kind];
  return n;
}

function normalize3(v: readonly number[]): [number, number, number] {
  const l = Math.sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2]);
  if (!(l > 0)) throw new Error('zero-length axis in leg chain');
  return [v[0] / l, v[1] / l, v[2] / l];
}

/** Build the workspace for one leg. Options are the defaults overridden by `options`. */
export function createWorkspace(chain: LegChain, options: Partial<SolverOptions> = {}): IKWorkspace {
  const nJ = chain.joints.length;
  if (nJ === 0) throw new Error('leg chain has no joints');
  const n = dofCount(chain);
  let nBall = 0;
  for (const j of chain.joints) if (j.kind === 'ball') nBall++;

  const jKind = new Int32Array(nJ);
  const jDof0 = new Int32Array(nJ);
  const jBall = new Int32Array(nJ).fill(-1);
  const jOffset = new Float64Array(3 * nJ);
  const jRest = new Float64Array(9 * nJ);
  const jRestIdentity = new Uint8Array(nJ);
  const dKind = new Int32Array(n);
  const dJoint = new Int32Array(n);
  const dAxis = new Float64Array(3 * n);
  const dAxisCode = new Int32Array(n).fill(6);
  const lo = new Float64Array(n).fill(-Infinity);
  const hi = new Float64Array(n).fill(Infinity);
  const chainWeight = new Float64Array(n).fill(1);
  const restPose = new Float64Array(n);
  const bAxis = new Float64Array(3 * Math.max(nBall, 1));
  const bSwing = new Float64Array(Math.max(nBall, 1)).fill(Math.PI);
  const bCosHalfSwing = new Float64Array(Math.max(nBall, 1)).fill(-1);
  const bTwistMin = new Float64Array(Math.max(nBall, 1)).fill(-Math.PI);
  const bTwistMax = new Float64Array(Math.max(nBall, 1)).fill(Math.PI);
  const bLimited = new Uint8Array(Math.max(nBall, 1));
  const nb1 = Math.max(nBall, 1);
  const bCosHalfTwistMin = new Float64Array(nb1);
  const bSinHalfTwistMin = new Float64Array(nb1);
  const bCosHalfTwistMax = new Float64Array(nb1);
  const bSinHalfTwistMax = new Float64Array(nb1);

  let d = 0;
  let b = 0;
  for (let ji = 0; ji < nJ; ji++) {
    const j = chain.joints[ji];
    const k = DOF_COUNT[j.kind];
    jDof0[ji] = d;
    jOffset[3 * ji] = j.offset[0];
    jOffset[3 * ji + 1] = j.offset[1];
    jOffset[3 * ji + 2] = j.offset[2];
    const r = j.rest ?? [0, 0, 0, 1];
    quatToMat(r[0], r[1], r[2], r[3], jRest, 9 * ji);
    jRestIdentity[ji] = r[0] === 0 && r[1] === 0 && r[2] === 0 ? 1 : 0;
    if (j.kind === 'ball') {
      jKind[ji] = JOINT_BALL;
      jBall[ji] = b;
      const basis = [
        [1, 0, 0],
        [0, 1, 0],
        [0, 0, 1],
      ];
      for (let a = 0; a < 3; a++) {
        dKind[d + a] = DOF_BALL;
        dJoint[d + a] = ji;
        dAxis.set(basis[a], 3 * (d + a));
        chainWeight[d + a] = j.weights?.[a] ?? 1;
      }
      if (j.ball) {
        const ax = normalize3(j.ball.twistAxis);
        bAxis.set(ax, 3 * b);
        bSwing[b] = j.ball.swing;
        bCosHalfSwing[b] = Math.cos(Math.min(j.ball.swing, Math.PI) / 2);
        bTwistMin[b] = j.ball.twistMin;
        bTwistMax[b] = j.ball.twistMax;
        if (!(j.ball.twistMin <= j.ball.twistMax)) throw new Error(`joint ${j.name}: twistMin > twistMax`);
        bLimited[b] = 1;
      } else {
        bAxis.set([0, -1, 0], 3 * b);
      }
      const hmin = Math.max(-Math.PI, bTwistMin[b]) / 2;
      const hmax = Math.min(Math.PI, bTwistMax[b]) / 2;
      bCosHalfTwistMin[b] = Math.cos(hmin);
      bSinHalfTwistMin[b] = Math.sin(hmin);
      bCosHalfTwistMax[b] = Math.cos(hmax);
      bSinHalfTwistMax[b] = Math.sin(hmax);
      b++;
    } else {
      jKind[ji] = j.kind === 'hinge' ? JOINT_HINGE : j.kind === 'universal' ? JOINT_UNIVERSAL : JOINT_SLIDER;
      if (j.axes.length < k) throw new Error(`joint ${j.name}: ${j.kind} needs ${k} axes`);
      for (let a = 0; a < k; a++) {
        dKind[d + a] = j.kind === 'slider' ? DOF_SLIDE : DOF_ROT;
        dJoint[d + a] = ji;
        const ax = normalize3(j.axes[a]);
        dAxis.set(ax, 3 * (d + a));
        for (let c = 0; c < 3; c++) {
          const others = [0, 1, 2].filter((q) => q !== c);
          if (others.every((q) => ax[q] === 0) && Math.abs(ax[c]) === 1) dAxisCode[d + a] = ax[c] > 0 ? c : c + 3;
        }
        const lim = j.limits?.[a];
        if (lim) {
          if (!(lim.min <= lim.max)) throw new Error(`joint ${j.name}: limit min > max`);
          lo[d + a] = lim.min;
          hi[d + a] = lim.max;
        }
        chainWeight[d + a] = j.weights?.[a] ?? 1;
        let rv = j.restValues?.[a] ?? 0;
        rv = Math.min(hi[d + a], Math.max(lo[d + a], rv));
        restPose[d + a] = rv;
      }
    }
    d += k;
  }

  const opts: SolverOptions = { ...DEFAULT_OPTIONS, ...options };
  const weight = new Float64Array(n);
  const sqrtWeight = new Float64Array(n);
  const maxIt = Math.max(opts.maxIterations, 1);
  const errorHistory = new Float64Array(maxIt + 1);
  const pose = new Float64Array(n);
  const quat = new Float64Array(4 * Math.max(nBall, 1));
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
  const ws: IKWorkspace = {
    chain,
    nJoints: nJ,
    nDof: n,
    nBall,
    options: opts,
    jKind,
    jDof0,
    jBall,
    jOffset,
    jRest,
    jRestIdentity,
    dKind,
    dJoint,
    dAxis,
    dAxisCode,
    lo,
    hi,
    chainWeight,
    weight,
    sqrtWeight,
    restPose,
    bAxis,
    bSwing,
    bCosHalfSwing,
    bTwistMin,
    bTwistMax,
    bCosHalfTwistMin,
    bSinHalfTwistMin,
    bCosHalfTwistMax,
    bSinHalfTwistMax,
    bLimited,
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
    J: new Float64Array(6 * n),
    Jw: new Float64Array(6 * n),
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
    savePose: new Float64Array(n),
    saveQuat: new Float64Array(quat.length),
    target: new Float64Array(3),
    normal: new Float64Array(3),
    errorHistory,
    scalars: new Float64Array(8),
    result,
  };
  applyWeights(ws);
  applyClamp(ws);
  resetPose(ws);
  return ws;
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

/** Default target clamp as a fraction of the chain's reach (clampDistance = 0). */
export const CLAMP_REACH_FRACTION = 0.1;

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

/** Set the pose to the chain's rest pose (ball joints to identity). */
export function resetPose(ws: IKWorkspace): void {
  ws.pose.set(ws.restPose);
  for (let b = 0; b < ws.nBall; b++) {
    ws.quat[4 * b] = 0;
    ws.quat[4 * b + 1] = 0;
    ws.quat[4 * b + 2] = 0;
    ws.quat[4 * b + 3] = 1;
  }
}

// Scratch for the scalar entry point, so both entry points share one exp map without allocating.
const ROTATION_VECTOR = new Float64Array(3);

/** Rotation vector → unit quaternion (exact exp map), written at q[o..o+3]. */
export function expRotationVector(x: number, y: number, z: number, q: Float64Array, o: number): void {
  ROTATION_VECTOR[0] = x;
  ROTATION_VECTOR[1] = y;
  ROTATION_VECTOR[2] = z;
  expRotationVectorAt(ROTATION_VECTOR, 0, q, o);
}

/** expRotationVector reading the rotation vector from v[vo..vo+2] (no boxed arguments). */
export function expRotationVectorAt(v: Float64Array, vo: number, q: Float64Array, o: number): void {
  const x = v[vo];
  const y = v[vo + 1];
  const z = v[vo + 2];
  const t2 = x * x + y * y + z * z;
  let s: number;
  let c: number;
  if (t2 < 1e-2) {
    const h2 = t2 * 0.25;
    c = 1 - h2 / 2 + (h2 * h2) / 24 - (h2 * h2 * h2) / 720 + (h2 * h2 * h2 * h2) / 40320;
    s = 0.5 * (1 - h2 / 6 + (h2 * h2) / 120 - (h2 * h2 * h2) / 5040 + (h2 * h2 * h2 * h2) / 362880);
  } else {
    const t = Math.sqrt(t2);
    c = Math.cos(t / 2);
    s = Math.sin(t / 2) / t;
  }
  q[o] = x * s;
  q[o + 1] = y * s;
  q[o + 2] = z * s;
  q[o + 3] = c;
}

/** Unit quaternion → rotation vector (log map, shortest rotation), written at out[o..o+2]. */
export function logQuaternion(q: ArrayLike<number>, qo: number, out: Float64Array, o: number): void {
  let x = q[qo];
  let y = q[qo + 1];
  let z = q[qo + 2];
  let w = q[qo + 3];
  if (w < 0) {
    x = -x;
    y = -y;
    z = -z;
    w = -w;
  }
  const sn = Math.sqrt(x * x + y * y + z * z);
  let k: number;
  if (sn < 1e-8) k = 2 / (w > 0 ? w : 1);
  else k = (2 * Math.atan2(sn, w)) / sn;
  out[o] = x * k;
  out[o + 1] = y * k;
  out[o + 2] = z * k;
}

/** Copy ball quaternions into the pose as rotation vectors. */
export function syncBallPose(ws: IKWorkspace): void {
  for (let j = 0; j < ws.nJoints; j++) {
    const b = ws.jBall[j];
    if (b >= 0) logQuaternion(ws.quat, 4 * b, ws.pose, ws.jDof0[j]);
  }
}

/**
 * Set the pose from DOF values (ball entries are rotation vectors in the
 * joint's rest frame). Scalar DOFs are clamped to their limits and balls to
 * their cone/twist; returns the number of values that had to be clamped.
 */
export function setPose(ws: IKWorkspace, pose: ArrayLike<number>, clamp = true): number {
  if (pose.length !== ws.nDof) throw new Error(`pose: expected ${ws.nDof} values, got ${pose.length}`);
  let hits = 0;
  for (let i = 0; i < ws.nDof; i++) {
    let v = pose[i];
    if (clamp && ws.dKind[i] !== DOF_BALL) {
      if (v < ws.lo[i]) {
        v = ws.lo[i];
        hits++;
      } else if (v > ws.hi[i]) {
        v = ws.hi[i];
        hits++;
      }
    }
    ws.pose[i] = v;
  }
  for (let j = 0; j < ws.nJoints; j++) {
    const b = ws.jBall[j];
    if (b < 0) continue;
    const d = ws.jDof0[j];
    expRotationVector(pose[d], pose[d + 1], pose[d + 2], ws.quat, 4 * b);
    if (clamp && clampBall(ws, b)) hits++;
    logQuaternion(ws.quat, 4 * b, ws.pose, d);
  }
  return hits;
}

/** Copy of the current pose (ball entries as rotation vectors). */
export function getPose(ws: IKWorkspace, out: Float64Array = new Float64Array(ws.nDof)): Float64Array {
  syncBallPose(ws);
  out.set(ws.pose);
  return out;
}

/** Set a ball joint's quaternion directly ([x, y, z, w], relative to its rest frame). */
export function setBallQuaternion(ws: IKWorkspace, joint: number, q: ArrayLike<number>): void {
  const b = ws.jBall[joint];
  if (b < 0) throw new Error(`joint ${joint} is not a ball joint`);
  const n = Math.hypot(q[0], q[1], q[2], q[3]) || 1;
  for (let i = 0; i < 4; i++) ws.quat[4 * b + i] = q[i] / n;
  logQuaternion(ws.quat, 4 * b, ws.pose, ws.jDof0[joint]);
}

/**
 * Clamp ball b's quaternion to its swing cone and twist range (swing–twist
 * decomposition about the twist axis). Returns true if it was changed.
 */
export function clampBall(ws: IKWorkspace, b: number): boolean {
  if (!ws.bLimited[b]) return false;
  const q = ws.quat;
  const o = 4 * b;
  let x = q[o];
  let y = q[o + 1];
  let z = q[o + 2];
  let w = q[o + 3];
  const ax = ws.bAxis[3 * b];
  const ay = ws.bAxis[3 * b + 1];
  const az = ws.bAxis[3 * b + 2];
  let t = x * ax + y * ay + z * az;
  if (w < 0 || (w === 0 && t < 0)) {
    x = -x;
    y = -y;
    z = -z;
    w = -w;
    t = -t;
  }
  const nt2 = t * t + w * w; // = (swing's w)² = cos²(swing/2)
  const ch = ws.bCosHalfSwing[b];
  const tmin = ws.bTwistMin[b];
  const tmax = ws.bTwistMax[b];
  const swingOk = ch <= 0 || nt2 >= ch * ch;
  // twist/2 = atan2(t, w) ∈ [−π/2, π/2] (w ≥ 0). In range without an atan2:
  // twist ≤ tmax ⟺ sin(twist/2 − tmax/2) ≤ 0 ⟺ t·cos(tmax/2) − w·sin(tmax/2) ≤ 0.
  const twistOk =
    t * ws.bCosHalfTwistMax[b] - w * ws.bSinHalfTwistMax[b] <= 0 &&
    t * ws.bCosHalfTwistMin[b] - w * ws.bSinHalfTwistMin[b] >= 0;
  if (swingOk && twistOk) return false;
  const nt = Math.sqrt(nt2);
  const twist = nt > 1e-12 ? 2 * Math.atan2(t, w) : 0;
  // twist quaternion tw = (a·t, w)/nt; swing = q ⊗ conj(tw)
  let tx: number, ty: number, tz: number, tw: number;
  if (nt > 1e-12) {
    tx = (ax * t) / nt;
    ty = (ay * t) / nt;
    tz = (az * t) / nt;
    tw = w / nt;
  } else {
    tx = 0;
    ty = 0;
    tz = 0;
    tw = 1;
  }
  // swing = q ⊗ conj(tw)  (conj = (−tx, −ty, −tz, tw))
  let sx = w * -tx + x * tw + y * -tz - z * -ty;
  let sy = w * -ty - x * -tz + y * tw + z * -tx;
  let sz = w * -tz + x * -ty - y * -tx + z * tw;
  let sw = w * tw - x * -tx - y * -ty - z * -tz;
  if (!swingOk) {
    const sn = Math.sqrt(sx * sx + sy * sy + sz * sz);
    const h = ws.bSwing[b] / 2;
    const k = sn > 1e-15 ? Math.sin(h) / sn : 0;
    sx *= k;
    sy *= k;
    sz *= k;
    sw = Math.cos(h);
  }
  if (!twistOk) {
    const tc = (twist < tmin ? tmin : tmax) / 2;
    const s = Math.sin(tc);
    tx = ax * s;
    ty = ay * s;
    tz = az * s;
    tw = Math.cos(tc);
  }
  // q = swing ⊗ tw
  q[o] = sw * tx + sx * tw + sy * tz - sz * ty;
  q[o + 1] = sw * ty - sx * tz + sy * tw + sz * tx;
  q[o + 2] = sw * tz + sx * ty - sy * tx + sz * tw;
  q[o + 3] = sw * tw - sx * tx - sy * ty - sz * tz;
  return true;
}

/** Set the root (hip socket) transform from a position and a unit quaternion [x, y, z, w]. */
export function setRootTransform(ws: IKWorkspace, position: ArrayLike<number>, rotation?: ArrayLike<number>): void {
  ws.rootPos[0] = position[0];
  ws.rootPos[1] = position[1];
  ws.rootPos[2] = position[2];
  if (rotation) quatToMat(rotation[0], rotation[1], rotation[2], rotation[3], ws.rootRot, 0);
}

/** Set the root transform from a 4×4 column-major matrix (gl-matrix / three.js layout; rigid, no scale). */
export function setRootMatrix(ws: IKWorkspace, m: ArrayLike<number>): void {
  const R = ws.rootRot;
  R[0] = m[0];
  R[1] = m[4];
  R[2] = m[8];
  R[3] = m[1];
  R[4] = m[5];
  R[5] = m[9];
  R[6] = m[2];
  R[7] = m[6];
  R[8] = m[10];
  ws.rootPos[0] = m[12];
  ws.rootPos[1] = m[13];
  ws.rootPos[2] = m[14];
}
