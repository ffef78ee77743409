/** An orbit camera as plain numbers: yaw and pitch around a target, at a distance. Gestures change it; the view reads it. */
export interface Orbit {
  yaw: number;
  pitch: number;
  distance: number;
  target: [number, number, number];
}

const PITCH_LIMIT = Math.PI / 2 - 0.05;

/**
 * An orbit that shows the whole box: its bounding sphere fits inside the narrower of the vertical field of view and
 * the horizontal one (tan(h/2) = aspect · tan(v/2), the perspective projection's own relation), whatever the box's size.
 */
export function fitOrbit(min: [number, number, number], max: [number, number, number], fovDeg: number, aspect = 1): Orbit {
  const centre: [number, number, number] = [(min[0] + max[0]) / 2, (min[1] + max[1]) / 2, (min[2] + max[2]) / 2];
  const radius = Math.max(1e-6, Math.hypot(max[0] - min[0], max[1] - min[1], max[2] - min[2]) / 2);
  const halfV = ((fovDeg / 2) * Math.PI) / 180;
  const halfH = Math.atan(Math.tan(halfV) * Math.max(1e-3, aspect));
  const distance = radius / Math.sin(Math.min(halfV, halfH));
  // Three-quarter view from the front-left, slightly above: legs on both sides stay visible.
  return { yaw: 0.6, pitch: 0.25, distance: distance * 1.05, target: centre };
}

export function rotate(o: Orbit, dx: number, dy: number, viewHeight: number): Orbit {
  const k = (2 * Math.PI) / Math.max(200, viewHeight * 1.5);
  return { ...o, yaw: o.yaw - dx * k, pitch: Math.max(-PITCH_LIMIT, Math.min(PITCH_LIMIT, o.pitch + dy * k)) };
}

export function zoom(o: Orbit, factor: number, limits: { min: number; max: number }): Orbit {
  return { ...o, distance: Math.max(limits.min, Math.min(limits.max, o.distance * factor)) };
}

/** Moves the target in the camera's screen plane so the point under the finger stays under it. */
export function pan(o: Orbit, dx: number, dy: number, viewHeight: number, fovDeg: number): Orbit {
  const perPixel = (2 * o.distance * Math.tan(((fovDeg / 2) * Math.PI) / 180)) / Math.max(1, viewHeight);
  const right: [number, number, number] = [Math.cos(o.yaw), 0, -Math.sin(o.yaw)];
  const up: [number, number, number] = [-Math.sin(o.pitch) * Math.sin(o.yaw), Math.cos(o.pitch), -Math.sin(o.pitch) * Math.cos(o.yaw)];
  const t = o.target;
  return {
    ...o,
    target: [t[0] - (right[0] * dx - up[0] * dy) * perPixel, t[1] - (right[1] * dx - up[1] * dy) * perPixel, t[2] - (right[2] * dx - up[2] * dy) * perPixel],
  };
}

/** Camera position for an orbit: +Z is the character's front (glTF), yaw 0 looks at it from the front. */
export function cameraPosition(o: Orbit): [number, number, number] {
  const c = Math.cos(o.pitch);
  return [o.target[0] + o.distance * c * Math.sin(o.yaw), o.target[1] + o.distance * Math.sin(o.pitch), o.target[2] + o.distance * c * Math.cos(o.yaw)];
}
