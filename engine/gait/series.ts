/**
 * Compact series a trial records at its chosen rate: per leg the target,
 * the actual foot, contact, fastest joint speed, solver iterations and error;
 * the body height, pitch and roll. Float32 is plenty for plots and replay;
 * metrics are computed from the full-precision state inside the loop.
 * Sample i is at time i / rate.
 */
export interface TrialSeries {
  /** Samples per second. */
  rate: number;
  legs: number;
  /** Samples recorded (arrays may be longer). */
  length: number;
  /** legs × 3 per sample: x, y, z. */
  target: Float32Array;
  foot: Float32Array;
  /** legs per sample: 1 in stance. */
  contact: Uint8Array;
  /** legs per sample: fastest joint, °/s. */
  jointSpeed: Float32Array;
  iterations: Uint16Array;
  /** legs per sample: |target − foot| after the solve, m. */
  error: Float32Array;
  /** One per sample: body origin (hip level) height, pitch (nose up) and roll (left up), m and rad. */
  bodyHeight: Float32Array;
  bodyPitch: Float32Array;
  bodyRoll: Float32Array;
  /** One per sample: body position along the walk, m. */
  bodyZ: Float32Array;
  /** Solved joint angles (engine/gait/joint-angles.ts): DOF values per sample over all legs, int16 steps; 0 and empty when not recorded. */
  jointDofs: number;
  jointAngles: Int16Array;
  /** 7 per sample with the joint angles: body position and rotation quaternion. */
  bodyFrame: Float32Array;
}

export function createSeries(legs: number, capacity: number, rate: number): TrialSeries {
  return {
    rate,
    legs,
    length: 0,
    target: new Float32Array(capacity * legs * 3),
    foot: new Float32Array(capacity * legs * 3),
    contact: new Uint8Array(capacity * legs),
    jointSpeed: new Float32Array(capacity * legs),
    iterations: new Uint16Array(capacity * legs),
    error: new Float32Array(capacity * legs),
    bodyHeight: new Float32Array(capacity),
    bodyPitch: new Float32Array(capacity),
    bodyRoll: new Float32Array(capacity),
    bodyZ: new Float32Array(capacity),
    jointDofs: 0,
    jointAngles: new Int16Array(0),
    bodyFrame: new Float32Array(0),
  };
}

/** A copy holding only the recorded samples (what a worker stores). */
export function trimSeries(s: TrialSeries): TrialSeries {
  const n = s.length;
  const L = s.legs;
  return {
    rate: s.rate,
    legs: L,
    length: n,
    target: s.target.slice(0, n * L * 3),
    foot: s.foot.slice(0, n * L * 3),
    contact: s.contact.slice(0, n * L),
    jointSpeed: s.jointSpeed.slice(0, n * L),
    iterations: s.iterations.slice(0, n * L),
    error: s.error.slice(0, n * L),
    bodyHeight: s.bodyHeight.slice(0, n),
    bodyPitch: s.bodyPitch.slice(0, n),
    bodyRoll: s.bodyRoll.slice(0, n),
    bodyZ: s.bodyZ.slice(0, n),
    jointDofs: s.jointDofs,
    jointAngles: s.jointAngles.slice(0, n * s.jointDofs),
    bodyFrame: s.bodyFrame.slice(0, s.jointDofs ? n * 7 : 0),
  };
}
