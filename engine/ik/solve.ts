/**
 * The solve loop: warm start, iterate (FK → error → Jacobian → step → limits)
 * until the foot is within tolerance, the step stalls or the iteration cap.
 */
import * as Q from '../math/quat';
import * as CCD from './ccd';
import * as JAC from './jacobian';
import * as K from './kinematics';
import { DOF_BALL as DOF_BALL_, DOF_SLIDE as DOF_SLIDE_, S_LAMBDA2 as S_LAMBDA2_, S_ANGLE as S_ANGLE_, S_CHANGE as S_CHANGE_, S_POSITION_ERROR2 as S_POSITION_ERROR2_, S_BIAS_SCALE as S_BIAS_SCALE_ } from './layout';
import * as LIM from './limits';
import * as NS from './null-space';
import type { SolverOptions } from './options';
import * as P from './pose';
import * as S from './steps';
import type { IKWorkspace } from './workspace';
import * as W from './workspace';

// Local bindings: transpiled ES module imports turn every use into a getter
// call, which in this loop costs more than the arithmetic.
const forwardKinematics = K.forwardKinematics;
const jacobian = JAC.jacobian;
const ccdSweep = CCD.ccdSweep;
const nullSpaceBias = NS.nullSpaceBias;
const premultiplyUnit = Q.premultiplyUnit;
const fromRotationVector = Q.fromRotationVector;
const dlsStepS = S.dlsStepS;
const jacobianDlsStep3 = S.jacobianDlsStep3;
const manipulability = S.manipulability;
const pseudoinverseStep = S.pseudoinverseStep;
const sdlsStep = S.sdlsStep;
const transposeStep = S.transposeStep;
const applyClamp = W.applyClamp;
const applyWeights = W.applyWeights;
const clampBall = LIM.clampBall;
const stepLeavesLimits = LIM.stepLeavesLimits;
const resetPose = P.resetPose;
const setPose = P.setPose;
const syncBallPose = P.syncBallPose;
const DOF_BALL = DOF_BALL_;
const DOF_SLIDE = DOF_SLIDE_;
const S_LAMBDA2 = S_LAMBDA2_;
const S_ANGLE = S_ANGLE_;
const S_CHANGE = S_CHANGE_;
const S_POSITION_ERROR2 = S_POSITION_ERROR2_;
const S_BIAS_SCALE = S_BIAS_SCALE_;

/** λ² of a DLS retry when the undamped (λ = 0) matrix is singular, m². */
const DLS_RETRY_DAMPING2 = 1e-12;
/** Adaptive λ² floor (keeps the damped matrix positive definite at λ = 0), and its retry, m². */
const ADAPTIVE_MIN_DAMPING2 = 1e-14;
const ADAPTIVE_RETRY_DAMPING2 = 1e-10;

export interface SolveResult {
  /** DOF values after the solve (view onto the workspace's pose; copy it to keep it). */
  pose: Float64Array;
  /** Steps taken. */
  iterations: number;
  /** Final |foot − target|, metres. */
  positionError: number;
  /** Final angle between the sole normal and the target normal, radians (0 without an orientation target). */
  orientationError: number;
  converged: boolean;
  /** Number of DOF clamps against joint limits during the solve. */
  limitHits: number;
  /** Error after each iteration (index 0 = before the first step), when recordErrors; else null. */
  errorHistory: Float64Array | null;
  /** Length of the meaningful part of errorHistory (iterations + 1). */
  errorHistoryLength: number;
}

const METHOD_TRANSPOSE = 0;
const METHOD_PINV = 1;
const METHOD_DLS = 2;
const METHOD_SDLS = 3;
const METHOD_ADAPTIVE = 4;
const METHOD_CCD = 5;

function methodCode(m: SolverOptions['method']): number {
  switch (m) {
    case 'transpose':
      return METHOD_TRANSPOSE;
    case 'pseudoinverse':
      return METHOD_PINV;
    case 'dls':
      return METHOD_DLS;
    case 'sdls':
      return METHOD_SDLS;
    case 'adaptive':
      return METHOD_ADAPTIVE;
    case 'ccd':
      return METHOD_CCD;
    default:
      throw new Error(`unknown IK method: ${String(m)}`);
  }
}

/** A ball's step as a quaternion (module-level, no allocation per solve). */
const quatScratch = new Float64Array(4);

/** Below this |u × n| the sole normal u and the target normal n are taken as parallel (or antiparallel). */
const NORMALS_PARALLEL_BELOW = 1e-12;
/** The perpendicular (−u_y, u_x, 0) is too short to use below this (u near ±Z): (0, −u_z, u_y) instead. */
const PERPENDICULAR_DEGENERATE_BELOW = 1e-9;

/**
 * Task error at the current FK into ws.e (rows 0–2 position, 3–5 weighted
 * orientation when `orient`). The squared position error goes to
 * ws.scalars[S_POSITION_ERROR2], the orientation angle to ws.scalars[S_ANGLE].
 */
function taskError(ws: IKWorkspace, orient: boolean): void {
  const e = ws.e;
  const t = ws.target;
  const f = ws.foot;
  const ex = t[0] - f[0];
  const ey = t[1] - f[1];
  const ez = t[2] - f[2];
  e[0] = ex;
  e[1] = ey;
  e[2] = ez;
  if (orient) {
    const u = ws.footUp;
    const nn = ws.normal;
    const cx = u[1] * nn[2] - u[2] * nn[1];
    const cy = u[2] * nn[0] - u[0] * nn[2];
    const cz = u[0] * nn[1] - u[1] * nn[0];
    const sn = Math.sqrt(cx * cx + cy * cy + cz * cz);
    const cs = u[0] * nn[0] + u[1] * nn[1] + u[2] * nn[2];
    const ang = Math.atan2(sn, cs);
    const wo = ws.options.orientationWeight;
    if (sn > NORMALS_PARALLEL_BELOW) {
      const k = (wo * ang) / sn;
      e[3] = cx * k;
      e[4] = cy * k;
      e[5] = cz * k;
    } else if (cs < 0) {
      // Antiparallel: rotate by π about any axis ⟂ u.
      let px = -u[1];
      let py = u[0];
      let pz = 0;
      let pl = Math.sqrt(px * px + py * py);
      if (pl < PERPENDICULAR_DEGENERATE_BELOW) {
        px = 0;
        py = -u[2];
        pz = u[1];
        pl = Math.sqrt(py * py + pz * pz);
      }
      const k = (wo * Math.PI) / pl;
      e[3] = px * k;
      e[4] = py * k;
      e[5] = pz * k;
    } else {
      e[3] = 0;
      e[4] = 0;
      e[5] = 0;
    }
    ws.scalars[S_ANGLE] = ang;
  } else {
    ws.scalars[S_ANGLE] = 0;
  }
  ws.scalars[S_POSITION_ERROR2] = ex * ex + ey * ey + ez * ez; // squared: the loop compares squares
}

/** dq ← S(e) for the method, with the current effective weights. */
function methodStep(
  ws: IKWorkspace,
  code: number,
  m: number,
  e: Float64Array,
  dq: Float64Array,
  w: Float64Array,
  sw: Float64Array,
): void {
  const o = ws.options;
  switch (code) {
    case METHOD_DLS: {
      const sc = ws.scalars;
      const l2 = o.lambda * o.lambda;
      sc[S_LAMBDA2] = l2;
      if (!dlsStepS(ws, w, m, e, dq)) {
        sc[S_LAMBDA2] = l2 + DLS_RETRY_DAMPING2;
        dlsStepS(ws, w, m, e, dq);
      }
      return;
    }
    case METHOD_ADAPTIVE: {
      let l2: number;
      if (o.adaptiveMode === 'manipulability') {
        const wm = manipulability(ws, w, m);
        const w0 = o.manipulabilityThreshold;
        l2 = wm < w0 ? o.lambda * o.lambda * (1 - wm / w0) * (1 - wm / w0) : 0;
      } else {
        let E = 0;
        for (let r = 0; r < m; r++) E += e[r] * e[r];
        l2 = 0.5 * E + o.lmBias;
      }
      const sc = ws.scalars;
      sc[S_LAMBDA2] = l2 + ADAPTIVE_MIN_DAMPING2;
      if (!dlsStepS(ws, w, m, e, dq)) {
        sc[S_LAMBDA2] = l2 + ADAPTIVE_RETRY_DAMPING2;
        dlsStepS(ws, w, m, e, dq);
      }
      return;
    }
    case METHOD_TRANSPOSE:
      transposeStep(ws, w, m, e, dq);
      return;
    case METHOD_PINV:
      pseudoinverseStep(ws, sw, m, o.svdThreshold, e, dq);
      return;
    case METHOD_SDLS:
      sdlsStep(ws, sw, m, o.gammaMax, e, dq);
      return;
    default:
      throw new Error('not a Jacobian method');
  }
}

/** Damping of the null-space projector N = I − W·Jᵀ(J·W·Jᵀ + ε²I)⁻¹·J (ε in metres). */
const NULL_EPS2 = 1e-6;

/**
 * Step with null-space bias: dq = S(e) + N·z, N the (lightly regularised)
 * projector onto the null space of J, so the bias moves the leg without
 * moving the foot (to first order) whatever the method's own damping.
 */
function biasedStep(
  ws: IKWorkspace,
  code: number,
  m: number,
  e: Float64Array,
  hasBias: boolean,
  w: Float64Array,
  sw: Float64Array,
): void {
  const dq = ws.dq;
  methodStep(ws, code, m, e, dq, w, sw);
  if (!hasBias) return;
  const n = ws.nDof;
  const z = ws.z;
  const J = ws.J;
  const jz = ws.e2;
  for (let r = 0; r < m; r++) jz[r] = 0;
  for (let i = 0; i < n; i++) {
    const zi = z[i];
    if (zi === 0) continue;
    for (let r = 0; r < m; r++) jz[r] += J[6 * i + r] * zi;
  }
  const p = ws.tmpN;
  ws.scalars[S_LAMBDA2] = NULL_EPS2;
  if (!dlsStepS(ws, w, m, jz, p)) return;
  for (let i = 0; i < n; i++) dq[i] += z[i] - p[i];
}

/** Scale dq so no rotation exceeds maxStepAngle (ball: the rotation vector's norm) and no slide maxStepLength. */
function limitStepSize(ws: IKWorkspace): void {
  const n = ws.nDof;
  const dq = ws.dq;
  const o = ws.options;
  let k = 1;
  for (let i = 0; i < n; i++) {
    const kind = ws.dKind[i];
    if (kind === DOF_BALL) {
      const a2 = dq[i] * dq[i] + dq[i + 1] * dq[i + 1] + dq[i + 2] * dq[i + 2];
      const ms = o.maxStepAngle;
      if (a2 * k * k > ms * ms) k = ms / Math.sqrt(a2);
      i += 2;
    } else {
      const a = Math.abs(dq[i]);
      const lim = kind === DOF_SLIDE ? o.maxStepLength : o.maxStepAngle;
      if (a * k > lim) k = lim / a;
    }
  }
  if (k < 1) for (let i = 0; i < n; i++) dq[i] *= k;
}

/** Apply dq to the pose, clamping every DOF to its limits. Returns the number of clamps. */
function applyStep(ws: IKWorkspace): number {
  const n = ws.nDof;
  const dq = ws.dq;
  const pose = ws.pose;
  let hits = 0;
  let mx = 0;
  for (let i = 0; i < n; i++) {
    const di = dq[i];
    if (di > mx) mx = di;
    else if (-di > mx) mx = -di;
    if (ws.dKind[i] === DOF_BALL) continue;
    let v = pose[i] + di;
    if (v < ws.lo[i]) {
      v = ws.lo[i];
      hits++;
    } else if (v > ws.hi[i]) {
      v = ws.hi[i];
      hits++;
    }
    pose[i] = v;
  }
  if (ws.nBall > 0) {
    for (let j = 0; j < ws.nJoints; j++) {
      const b = ws.jBall[j];
      if (b < 0) continue;
      const d = ws.jDof0[j];
      fromRotationVector(quatScratch, 0, dq, d);
      premultiplyUnit(ws.quat, 4 * b, quatScratch, 0);
      if (clampBall(ws, b)) hits++;
    }
  }
  ws.scalars[S_CHANGE] = mx;
  return hits;
}

/** |e − J·d|² (the linearised residual of a step d). */
function predictedResidual2(ws: IKWorkspace, m: number, e: Float64Array, d: Float64Array): number {
  const J = ws.J;
  const n = ws.nDof;
  let s = 0;
  for (let r = 0; r < m; r++) {
    let v = e[r];
    for (let i = 0; i < n; i++) v -= J[6 * i + r] * d[i];
    s += v * v;
  }
  return s;
}

/**
 * One iteration of a Jacobian method (FK current, ws.e holds the error).
 * Joint limits: a DOF whose step would leave its range is held at the limit
 * and the step re-solved for the others on the remaining error, one DOF at a
 * time (the one whose limit the step reaches first), until the step is
 * feasible; the re-solved step is kept where its linearised residual beats the
 * plainly clamped step's.
 */
function jacobianIteration(ws: IKWorkspace, code: number, m: number): number {
  const n = ws.nDof;
  const o = ws.options;
  const e = ws.e;
  clampTaskError(ws);
  // The bias yields to the limits: each step of this solve that hits a limit
  // halves it (else the bias can keep pushing a joint into its limit while the
  // clamp keeps pulling the foot off the target).
  const hasBias = nullSpaceBias(ws, ws.weight);
  if (hasBias) {
    const g = ws.scalars[S_BIAS_SCALE];
    if (g !== 1) for (let i = 0; i < n; i++) ws.z[i] *= g;
  }
  if (code === METHOD_DLS && m === 3 && !hasBias) {
    // The common case (position task, fixed damping): Jacobian and step fused.
    const sc = ws.scalars;
    const l2 = o.lambda * o.lambda;
    sc[S_LAMBDA2] = l2;
    if (!jacobianDlsStep3(ws, ws.weight, e, ws.dq)) {
      sc[S_LAMBDA2] = l2 + DLS_RETRY_DAMPING2;
      dlsStepS(ws, ws.weight, 3, e, ws.dq);
    }
  } else {
    jacobian(ws, m === 6 ? 6 : 3);
    biasedStep(ws, code, m, e, hasBias, ws.weight, ws.sqrtWeight);
  }
  limitStepSize(ws);
  let hits = 0;
  if (o.resolveSaturated && stepLeavesLimits(ws)) hits += resolveAtLimits(ws, code, m, hasBias);
  hits += applyStep(ws);
  if (hasBias && hits > 0) ws.scalars[S_BIAS_SCALE] *= 0.5;
  return hits;
}

/** Target clamp (Buss 2004; Buss & Kim 2005): the position rows of ws.e shortened to ws.clampDistance. */
function clampTaskError(ws: IKWorkspace): void {
  const e = ws.e;
  const el2 = e[0] * e[0] + e[1] * e[1] + e[2] * e[2];
  const cd = ws.clampDistance;
  if (el2 > cd * cd) {
    const k = cd / Math.sqrt(el2);
    e[0] *= k;
    e[1] *= k;
    e[2] *= k;
  }
}

/**
 * ws.dq leaves some joint's range: lock the DOFs it saturates one at a time
 * and re-solve the others on the remaining error (see jacobianIteration),
 * then keep whichever of that and the plainly clamped step has the smaller
 * linearised residual. Returns the DOFs locked.
 */
function resolveAtLimits(ws: IKWorkspace, code: number, m: number, hasBias: boolean): number {
  const n = ws.nDof;
  const e = ws.e;
  const locked = ws.locked;
  const dql = ws.dqLocked;
  const J = ws.J;
  const eRem = ws.eRes; // remaining error (biasedStep uses ws.e2 as its own scratch)
  let hits = 0;
  // Candidate 1: the plain clamped step, and its predicted (linearised) residual.
  const plain = ws.tmpN2;
  for (let i = 0; i < n; i++) {
    const d = ws.dq[i];
    if (ws.dKind[i] === DOF_BALL) plain[i] = d;
    else {
      const v = ws.pose[i] + d;
      plain[i] = (v < ws.lo[i] ? ws.lo[i] : v > ws.hi[i] ? ws.hi[i] : v) - ws.pose[i];
    }
  }
  const resPlain = predictedResidual2(ws, m, e, plain);
  const wEff = ws.wEff;
  const swEff = ws.swEff;
  for (let i = 0; i < n; i++) {
    wEff[i] = ws.weight[i];
    swEff[i] = ws.sqrtWeight[i];
  }
  for (let pass = 0; pass < n; pass++) {
    // Lock the free scalar DOF whose limit the step reaches first (smallest
    // fraction of the step), at that limit; then re-solve the others.
    let best = -1;
    let bestT = Infinity;
    for (let i = 0; i < n; i++) {
      if (locked[i] || ws.dKind[i] === DOF_BALL) continue;
      const d = ws.dq[i];
      const v = ws.pose[i] + d;
      let tt: number;
      if (v < ws.lo[i]) tt = d !== 0 ? (ws.lo[i] - ws.pose[i]) / d : 0;
      else if (v > ws.hi[i]) tt = d !== 0 ? (ws.hi[i] - ws.pose[i]) / d : 0;
      else continue;
      if (tt < bestT) {
        bestT = tt;
        best = i;
      }
    }
    if (best < 0) break;
    {
      const i = best;
      const v = ws.pose[i] + ws.dq[i];
      locked[i] = 1;
      dql[i] = (v < ws.lo[i] ? ws.lo[i] : ws.hi[i]) - ws.pose[i];
      wEff[i] = 0;
      swEff[i] = 0;
      ws.z[i] = 0;
      hits++;
    }
    // Remaining error after the locked DOFs' (clamped) motion.
    for (let r = 0; r < m; r++) eRem[r] = e[r];
    for (let i = 0; i < n; i++) {
      if (!locked[i]) continue;
      const d = dql[i];
      for (let r = 0; r < m; r++) eRem[r] -= J[6 * i + r] * d;
    }
    biasedStep(ws, code, m, eRem, hasBias, wEff, swEff);
    for (let i = 0; i < n; i++) if (locked[i]) ws.dq[i] = 0;
    limitStepSize(ws);
    for (let i = 0; i < n; i++) if (locked[i]) ws.dq[i] = dql[i];
    if (!stepLeavesLimits(ws)) break;
  }
  locked.fill(0); // stepLeavesLimits reads the mask: leave it clear for the next iteration
  // Candidate 2 (re-solved without the saturated DOFs) only where it reaches the target better.
  if (resPlain < predictedResidual2(ws, m, e, ws.dq)) for (let i = 0; i < n; i++) ws.dq[i] = plain[i];
  return hits;
}

/**
 * Solve the leg toward `target` (world sole position), optionally aligning
 * the sole normal with `normal` (world ground normal; adds 3 orientation rows
 * weighted by options.orientationWeight). Starts from options.startPose
 * ('current' by default: the previous solve's pose). The root transform must
 * be set first (setRootTransform / setRootMatrix). `overrides` apply to this
 * call only.
 *
 * Returns ws.result, reused by the next solve: copy what you keep.
 */
export function solve(
  ws: IKWorkspace,
  target: ArrayLike<number>,
  normal?: ArrayLike<number> | null,
  overrides?: Partial<SolverOptions>,
): SolveResult {
  if (!overrides) return solveImpl(ws, target, normal);
  const saved = ws.options;
  ws.options = { ...saved, ...overrides };
  if (ws.options.recordErrors && ws.options.maxIterations + 1 > ws.errorHistory.length) {
    (ws as { errorHistory: Float64Array }).errorHistory = new Float64Array(ws.options.maxIterations + 1);
  }
  const weightsChanged = 'weights' in overrides;
  if (weightsChanged) applyWeights(ws);
  applyClamp(ws);
  try {
    return solveImpl(ws, target, normal);
  } finally {
    ws.options = saved;
    if (weightsChanged) applyWeights(ws);
    applyClamp(ws);
  }
}

function solveImpl(ws: IKWorkspace, target: ArrayLike<number>, normal: ArrayLike<number> | null | undefined): SolveResult {
  const o = ws.options;
  const n = ws.nDof;
  const code = methodCode(o.method);
  ws.target[0] = target[0];
  ws.target[1] = target[1];
  ws.target[2] = target[2];
  let orient = false;
  if (normal) {
    const l = Math.sqrt(normal[0] * normal[0] + normal[1] * normal[1] + normal[2] * normal[2]);
    if (l > 0) {
      ws.normal[0] = normal[0] / l;
      ws.normal[1] = normal[1] / l;
      ws.normal[2] = normal[2] / l;
      orient = true;
    }
  }
  const m = orient ? 6 : 3;
  const start = o.startPose;
  if (start === 'rest') resetPose(ws);
  else if (start !== 'current' && start != null) setPose(ws, start as ArrayLike<number>);
  const maxIt = o.maxIterations;
  ws.scalars[S_BIAS_SCALE] = 1; // null-space bias scale (see jacobianIteration)
  const hist = o.recordErrors ? ws.errorHistory : null;
  const wo = o.orientationWeight;
  forwardKinematics(ws);
  taskError(ws, orient);
  let posErr2 = ws.scalars[S_POSITION_ERROR2];
  let ang = ws.scalars[S_ANGLE];
  if (hist) hist[0] = Math.sqrt(posErr2 + (orient ? wo * wo * ang * ang : 0));
  let it = 0;
  let hits = 0;
  let converged = false;
  const tol = o.tolerance;
  const tol2 = tol * tol;
  const otol = o.orientationTolerance;
  const minStep = o.minStep;
  for (;;) {
    if (posErr2 <= tol2 && (!orient || ang <= otol)) {
      converged = true;
      break;
    }
    if (it >= maxIt) break;
    let change: number;
    if (code === METHOD_CCD) {
      hits += ccdSweep(ws);
      change = ws.scalars[S_CHANGE];
    } else {
      hits += jacobianIteration(ws, code, m);
      change = ws.scalars[S_CHANGE];
      forwardKinematics(ws);
    }
    it++;
    taskError(ws, orient);
    posErr2 = ws.scalars[S_POSITION_ERROR2];
    ang = ws.scalars[S_ANGLE];
    if (hist) hist[it] = Math.sqrt(posErr2 + (orient ? wo * wo * ang * ang : 0));
    if (change < minStep) {
      converged = posErr2 <= tol2 && (!orient || ang <= otol);
      break;
    }
  }
  if (ws.nBall > 0) syncBallPose(ws);
  const r = ws.result;
  r.iterations = it;
  r.positionError = Math.sqrt(posErr2);
  r.orientationError = ang;
  r.converged = converged;
  r.limitHits = hits;
  r.errorHistory = hist;
  r.errorHistoryLength = hist ? it + 1 : 0;
  return r;
}
