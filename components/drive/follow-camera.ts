/**
 * Drive's camera behind the character: its yaw chases the body's heading as a critically damped spring, so a
 * turn swings the view round smoothly, without overshoot and the same at any frame rate; the gap to the heading
 * is always taken the short way round, so a heading that wraps past ±π moves the view a little, never a full turn.
 */

/** Time the view takes to settle behind a new heading, s: about the length of a step (common practice, no source). */
export const FOLLOW_SMOOTH_TIME = 0.35;

export interface FollowYaw {
  /** The view's yaw now (rad about +Y, 0 looks along +Z), unwrapped: it may run past ±π. */
  yaw: number;
  /** Its rate, rad/s. */
  rate: number;
  /** False until the first heading: the view then starts right behind it. */
  started: boolean;
}

export function createFollowYaw(): FollowYaw {
  return { yaw: 0, rate: 0, started: false };
}

/** An angle brought into (−π, π]. */
export function wrapAngle(a: number): number {
  const t = a - 2 * Math.PI * Math.floor((a + Math.PI) / (2 * Math.PI));
  return t === -Math.PI ? Math.PI : t;
}

/**
 * One frame of the spring towards `heading` over `dt` seconds: the exact solution of x'' + 2ωx' + ω²x = 0
 * (critical damping) with the target held for the frame, ω = 2 / smoothTime. Allocates nothing.
 */
export function stepFollowYaw(f: FollowYaw, heading: number, dt: number, smoothTime = FOLLOW_SMOOTH_TIME): number {
  if (!Number.isFinite(heading)) return f.yaw;
  if (!f.started) {
    f.yaw = heading;
    f.rate = 0;
    f.started = true;
    return f.yaw;
  }
  if (!(dt > 0)) return f.yaw;
  const w = 2 / smoothTime;
  // Offset from the target, the short way round.
  const x = wrapAngle(f.yaw - heading);
  const e = Math.exp(-w * dt);
  const c = (f.rate + w * x) * dt;
  const next = (x + c) * e;
  f.rate = (f.rate - w * c) * e;
  f.yaw += next - x;
  return f.yaw;
}

/** Where the camera sits and looks for a body at (x, y, z) with hip height h, seen from behind along `yaw`. */
export function behindCamera(x: number, y: number, z: number, h: number, yaw: number, eye: Float64Array, look: Float64Array): void {
  const fx = Math.sin(yaw);
  const fz = Math.cos(yaw);
  const back = 3 * h + 0.7;
  eye[0] = x - fx * back;
  eye[1] = y + 1.3 * h + 0.25;
  eye[2] = z - fz * back;
  // A point a little ahead of the body, below the hips: the ground the next steps land on stays in view.
  const ahead = 0.8 * h + 0.2;
  look[0] = x + fx * ahead;
  look[1] = y - 0.6 * h;
  look[2] = z + fz * ahead;
}
