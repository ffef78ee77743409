/**
 * The solve loop: warm start, iterate (FK → error → Jacobian → step → limits)
 * until the foot is within tolerance, the step stalls or the iteration cap.
 */
import * as K from './kinematics';
import * as S from './steps';
import type { SolveResult, SolverOptions } from './types';
import type { IKWorkspace } from './workspace';
import * as W from './workspace';

// Local bindings: transpiled ES module imports turn every use into a getter
// call, which in this loop costs more than the arithmetic.
const forwardKinematics = K.forwardKinematics;
const jacobian = K.jacobian;
const premultiplyQuat = K.premultiplyQuat;
const dlsStepS = S.dlsStepS;
const jacobianDlsStep3 = S.jacobianDlsStep3;
const manipulability = S.manipulability;
const pseudoinverseStep = S.pseudoinverseStep;
const sdlsStep = S.sdlsStep;
const transposeStep = S.transposeStep;
const applyClamp = W.applyClamp;
const applyWeights = W.applyWeights;
const clampBall = W.clampBall;
const expRotationVector = W.expRotationVector;
const expRotationVectorAt = W.expRotationVectorAt;
const logQuaternion = W.logQuaternion;
const resetPose = W.resetPose;
const setPose = W.setPose;
const syncBallPose = W.syncBallPose;
const DOF_BALL = 1;
const DOF_SLIDE = 2;
const JOINT_BALL = 2;
const JOINT_SLIDER = 3;

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

/** Scratch for the orientation error (module-level, no allocation per solve). */
const quatScratch = new Float64Array(4);

/**
 * Task error at the current FK into ws.e (rows 0–2 position, 3–5 weighted
 * orientation when `orient`). Returns |e_p|; the orientation angle goes to errState[0].
 */
const errState = new Float64Array(3);
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
    if (sn > 1e-12) {
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
      if (pl < 1e-9) {
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
    errState[0] = ang;
  } else {
    errState[0] = 0;
  }
  errState[2] = ex * ex + ey * ey + ez * ez; // squared: the loop compares squares
}

/** Secondary-task joint velocity z (null-space bias); returns false when there is none. */
function nullSpaceBias(ws: IKWorkspace, w: Float64Array): boolean {
  const ns = ws.options.nullSpace;
  if (!ns || ns.kind === 'none') return false;
  const n = ws.nDof;
  const z = ws.z;
  if (ns.kind === 'rest') {
    const g = ns.gain;
    for (let i = 0; i < n; i++) z[i] = ws.dKind[i] === DOF_BALL ? 0 : g * w[i] * (ws.restPose[i] - ws.pose[i]);
    for (let j = 0; j < ws.nJoints; j++) {
      const b = ws.jBall[j];
      if (b < 0) continue;
      const d = ws.jDof0[j];
      logQuaternion(ws.quat, 4 * b, ws.tmpN, d);
      for (let k = 0; k < 3; k++) z[d + k] = -g * w[d + k] * ws.tmpN[d + k];
    }
    return true;
  }
  // Pole: move the knee toward the pole, sideways to the hip→foot line.
  const k = Math.min(Math.max(ws.knee, 0), ws.nJoints - 1);
  const kx = ws.jPos[3 * k];
  const ky = ws.jPos[3 * k + 1];
  const kz = ws.jPos[3 * k + 2];
  let dx = ns.pole[0] - kx;
  let dy = ns.pole[1] - ky;
  let dz = ns.pole[2] - kz;
  let ux = ws.foot[0] - ws.jPos[0];
  let uy = ws.foot[1] - ws.jPos[1];
  let uz = ws.foot[2] - ws.jPos[2];
  const ul = Math.sqrt(ux * ux + uy * uy + uz * uz);
  if (ul > 1e-12) {
    ux /= ul;
    uy /= ul;
    uz /= ul;
    const p = dx * ux + dy * uy + dz * uz;
    dx -= p * ux;
    dy -= p * uy;
    dz -= p * uz;
  }
  const g = ns.gain;
  for (let i = 0; i < n; i++) {
    if (ws.dJoint[i] >= k) {
      z[i] = 0;
      continue;
    }
    const ax = ws.dAxisW[3 * i];
    const ay = ws.dAxisW[3 * i + 1];
    const az = ws.dAxisW[3 * i + 2];
    let cx: number, cy: number, cz: number;
    if (ws.dKind[i] === DOF_SLIDE) {
      cx = ax;
      cy = ay;
      cz = az;
    } else {
      const pj = 3 * ws.dJoint[i];
      const rx = kx - ws.jPos[pj];
      const ry = ky - ws.jPos[pj + 1];
      const rz = kz - ws.jPos[pj + 2];
      cx = ay * rz - az * ry;
      cy = az * rx - ax * rz;
      cz = ax * ry - ay * rx;
    }
    z[i] = g * w[i] * (cx * dx + cy * dy + cz * dz);
  }
  return true;
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
      sc[0] = l2;
      if (!dlsStepS(ws, w, m, e, dq)) {
        sc[0] = l2 + 1e-12;
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
      sc[0] = l2 + 1e-14;
      if (!dlsStepS(ws, w, m, e, dq)) {
        sc[0] = l2 + 1e-10;
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
  ws.scalars[0] = NULL_EPS2;
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

/** Does pose + dq leave the limits on some free scalar DOF? */
function violates(ws: IKWorkspace): boolean {
  const n = ws.nDof;
  for (let i = 0; i < n; i++) {
    if (ws.locked[i] || ws.dKind[i] === DOF_BALL) continue;
    const v = ws.pose[i] + ws.dq[i];
    if (v < ws.lo[i] || v > ws.hi[i]) return true;
  }
  return false;
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
      expRotationVectorAt(dq, d, quatScratch, 0);
      premultiplyQuat(quatScratch, ws.quat, 4 * b);
      if (clampBall(ws, b)) hits++;
    }
  }
  errState[1] = mx;
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
  // Target clamp (Buss 2004; Buss & Kim 2005).
  const e = ws.e;
  const el2 = e[0] * e[0] + e[1] * e[1] + e[2] * e[2];
  const cd = ws.clampDistance;
  if (el2 > cd * cd) {
    const k = cd / Math.sqrt(el2);
    e[0] *= k;
    e[1] *= k;
    e[2] *= k;
  }
  // The bias yields to the limits: each step of this solve that hits a limit
  // halves it (else the bias can keep pushing a joint into its limit while the
  // clamp keeps pulling the foot off the target).
  const hasBias = nullSpaceBias(ws, ws.weight);
  if (hasBias) {
    const g = ws.scalars[7];
    if (g !== 1) for (let i = 0; i < n; i++) ws.z[i] *= g;
  }
  if (code === METHOD_DLS && m === 3 && !hasBias) {
    // The common case (position task, fixed damping): Jacobian and step fused.
    const sc = ws.scalars;
    const l2 = o.lambda * o.lambda;
    sc[0] = l2;
    if (!jacobianDlsStep3(ws, ws.weight, e, ws.dq)) {
      sc[0] = l2 + 1e-12;
      dlsStepS(ws, ws.weight, 3, e, ws.dq);
    }
  } else {
    jacobian(ws, m === 6 ? 6 : 3);
    biasedStep(ws, code, m, e, hasBias, ws.weight, ws.sqrtWeight);
  }
  limitStepSize(ws);
  let hits = 0;
  if (o.resolveSaturated && violates(ws)) {
    const locked = ws.locked;
    const dql = ws.dqLocked;
    const J = ws.J;
    const eRem = ws.eRes; // remaining error (biasedStep uses ws.e2 as its own scratch)
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
      if (!violates(ws)) break;
    }
    locked.fill(0); // `violates` reads the mask: leave it clear for the next iteration
    // Candidate 2 (re-solved without the saturated DOFs) only where it reaches the target better.
    if (resPlain < predictedResidual2(ws, m, e, ws.dq)) for (let i = 0; i < n; i++) ws.dq[i] = plain[i];
  }
  hits += applyStep(ws);
  if (hasBias && hits > 0) ws.scalars[7] *= 0.5;
  return hits;
}

/**
 * One CCD sweep, foot → hip: each DOF in turn moves the sole toward the target
 * (hinge: the angle between the projections on the plane ⟂ axis; ball: the
 * shortest rotation; slider: the projection on its axis), clamped to its limits.
 * Returns limit hits; the largest change goes to errState[1].
 */
function ccdSweep(ws: IKWorkspace): number {
  const t = ws.target;
  let hits = 0;
  let change = 0;
  for (let j = ws.nJoints - 1; j >= 0; j--) {
    const kind = ws.jKind[j];
    const d0 = ws.jDof0[j];
    if (kind === JOINT_BALL) {
      const px = ws.jPos[3 * j];
      const py = ws.jPos[3 * j + 1];
      const pz = ws.jPos[3 * j + 2];
      const r1x = ws.foot[0] - px;
      const r1y = ws.foot[1] - py;
      const r1z = ws.foot[2] - pz;
      const r2x = t[0] - px;
      const r2y = t[1] - py;
      const r2z = t[2] - pz;
      const cx = r1y * r2z - r1z * r2y;
      const cy = r1z * r2x - r1x * r2z;
      const cz = r1x * r2y - r1y * r2x;
      const sn = Math.sqrt(cx * cx + cy * cy + cz * cz);
      if (sn < 1e-14) continue;
      const ang = Math.atan2(sn, r1x * r2x + r1y * r2y + r1z * r2z);
      const k = ang / sn;
      const wx = cx * k;
      const wy = cy * k;
      const wz = cz * k;
      const A = ws.dAxisW;
      const dx = A[3 * d0] * wx + A[3 * d0 + 1] * wy + A[3 * d0 + 2] * wz;
      const dy = A[3 * d0 + 3] * wx + A[3 * d0 + 4] * wy + A[3 * d0 + 5] * wz;
      const dz = A[3 * d0 + 6] * wx + A[3 * d0 + 7] * wy + A[3 * d0 + 8] * wz;
      expRotationVector(dx, dy, dz, quatScratch, 0);
      premultiplyQuat(quatScratch, ws.quat, 4 * ws.jBall[j]);
      if (clampBall(ws, ws.jBall[j])) hits++;
      if (ang > change) change = ang;
      forwardKinematics(ws, j);
      continue;
    }
    const nd = kind === JOINT_SLIDER || kind === 0 ? 1 : 2;
    for (let d = d0 + nd - 1; d >= d0; d--) {
      const ax = ws.dAxisW[3 * d];
      const ay = ws.dAxisW[3 * d + 1];
      const az = ws.dAxisW[3 * d + 2];
      let delta: number;
      if (kind === JOINT_SLIDER) {
        delta = ax * (t[0] - ws.foot[0]) + ay * (t[1] - ws.foot[1]) + az * (t[2] - ws.foot[2]);
      } else {
        const px = ws.jPos[3 * j];
        const py = ws.jPos[3 * j + 1];
        const pz = ws.jPos[3 * j + 2];
        let r1x = ws.foot[0] - px;
        let r1y = ws.foot[1] - py;
        let r1z = ws.foot[2] - pz;
        let r2x = t[0] - px;
        let r2y = t[1] - py;
        let r2z = t[2] - pz;
        const p1 = r1x * ax + r1y * ay + r1z * az;
        const p2 = r2x * ax + r2y * ay + r2z * az;
        r1x -= p1 * ax;
        r1y -= p1 * ay;
        r1z -= p1 * az;
        r2x -= p2 * ax;
        r2y -= p2 * ay;
        r2z -= p2 * az;
        const cx = r1y * r2z - r1z * r2y;
        const cy = r1z * r2x - r1x * r2z;
        const cz = r1x * r2y - r1y * r2x;
        const s = ax * cx + ay * cy + az * cz;
        const c = r1x * r2x + r1y * r2y + r1z * r2z;
        if (Math.abs(s) < 1e-15 && c >= 0) continue;
        delta = Math.atan2(s, c);
      }
      let v = ws.pose[d] + delta;
      if (v < ws.lo[d]) {
        v = ws.lo[d];
        hits++;
      } else if (v > ws.hi[d]) {
        v = ws.hi[d];
        hits++;
      }
      const ch = Math.abs(v - ws.pose[d]);
      if (ch > change) change = ch;
      ws.pose[d] = v;
      forwardKinematics(ws, j);
    }
  }
  errState[1] = change;
  return hits;
}

/**
 * Solve the leg toward `target` (world sole position), optionally aligning
 * the sole normal with `normal` (world ground normal; adds 3 orientation rows
 * weighted by options.orientationWeight). Starts from options.warmStart
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
  const ws0 = o.warmStart;
  if (ws0 === 'rest') resetPose(ws);
  else if (ws0 !== 'current' && ws0 != null) setPose(ws, ws0 as ArrayLike<number>);
  const maxIt = o.maxIterations;
  ws.scalars[7] = 1; // null-space bias scale (see jacobianIteration)
  const hist = o.recordErrors ? ws.errorHistory : null;
  const wo = o.orientationWeight;
  forwardKinematics(ws);
  taskError(ws, orient);
  let posErr2 = errState[2];
  let ang = errState[0];
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
      change = errState[1];
    } else {
      hits += jacobianIteration(ws, code, m);
      change = errState[1];
      forwardKinematics(ws);
    }
    it++;
    taskError(ws, orient);
    posErr2 = errState[2];
    ang = errState[0];
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
