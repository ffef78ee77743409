/**
 * The solved joint angles in a trial's compact series, so a viewer can pose the character exactly as the trial
 * of record solved it (forward kinematics from these values, engine/ik), whatever engine version replays it.
 *
 * Per sample: the body frame (position and rotation quaternion, Float32) and every leg's DOF values in leg
 * order (hinge and universal angles and ball rotation-vector components in radians, slider travel in metres),
 * quantized to int16 steps of ANGLE_STEP rad (about 0.1 mrad: under 0.1 mm at the sole of a 1 m leg) or
 * SLIDE_STEP m. The arrays are made on the first sample; later samples only write into them.
 */
import * as ikLayout from '../ik/layout';
import type { IKWorkspace } from '../ik/workspace';
import type { TrialSeries } from './series';

// Read once: under CommonJS interop each use of an imported name is a getter call.
const { DOF_SLIDE } = ikLayout;

/** Rotations span ±π in int16. */
export const ANGLE_STEP = Math.PI / 32767;
/** Sliders span ±0.327 m in int16. */
export const SLIDE_STEP = 1e-5;
export const BODY_FRAME_VALUES = 7;

const toStep = (v: number, step: number) => Math.max(-32767, Math.min(32767, Math.round(v / step)));

/** Record sample k's body frame and joint angles; `bodyPos` and `bodyRot` ([x, y, z, w]) as the trial holds them. */
export function recordJointAngles(s: TrialSeries, k: number, solvers: readonly IKWorkspace[], bodyPos: ArrayLike<number>, bodyRot: ArrayLike<number>): void {
  if (s.jointDofs === 0) {
    let dofs = 0;
    for (const ws of solvers) dofs += ws.nDof;
    const capacity = s.bodyHeight.length;
    s.jointDofs = dofs;
    s.jointAngles = new Int16Array(capacity * dofs);
    s.bodyFrame = new Float32Array(capacity * BODY_FRAME_VALUES);
  }
  const f = k * BODY_FRAME_VALUES;
  for (let c = 0; c < 3; c++) s.bodyFrame[f + c] = bodyPos[c];
  for (let c = 0; c < 4; c++) s.bodyFrame[f + 3 + c] = bodyRot[c];
  let a = k * s.jointDofs;
  for (const ws of solvers) {
    for (let d = 0; d < ws.nDof; d++) s.jointAngles[a++] = toStep(ws.pose[d], ws.dKind[d] === DOF_SLIDE ? SLIDE_STEP : ANGLE_STEP);
  }
}

/** Leg `leg`'s DOF values at sample k into `out` (length = that leg's DOF count); `first` is the leg's first DOF slot. */
export function readJointAngles(s: TrialSeries, k: number, ws: IKWorkspace, first: number, out: Float64Array): void {
  const a = k * s.jointDofs + first;
  for (let d = 0; d < ws.nDof; d++) out[d] = s.jointAngles[a + d] * (ws.dKind[d] === DOF_SLIDE ? SLIDE_STEP : ANGLE_STEP);
}
