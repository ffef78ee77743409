/**
 * The walk's camera: an orbit (components/viewer/orbit.ts) whose target follows the body, so the walk stays in
 * frame. Gestures turn, zoom and pan the orbit; a pan is kept as an offset from the body, so the camera still
 * follows (the orbit's target is that offset). Framing a leg puts the target on a point and comes closer; reset returns to the default view.
 */
import type * as THREE from 'three';
import { pan, rotate, zoom, type Orbit } from './orbit';

export const WALK_FOV = 40;

export interface FollowCamera {
  orbit: Orbit;
  /** Place `camera` for a followed point (the body origin). */
  apply(camera: THREE.PerspectiveCamera, x: number, y: number, z: number): void;
  rotate(dx: number, dy: number, viewHeight: number): void;
  pan(dx: number, dy: number, viewHeight: number): void;
  zoom(factor: number): void;
  /** Look at a world point (e.g. a stumbling foot) from closer, relative to the followed point now at (x, y, z). */
  frame(point: ArrayLike<number>, x: number, y: number, z: number): void;
  reset(): void;
  /** True after a gesture or a frame: the view is not the default any more. */
  moved: boolean;
}

/** The default three-quarter view from the walker's right front, a little above (h = hip height, m). */
export function createFollowCamera(hipHeight: number): FollowCamera {
  const h = Math.max(hipHeight, 0.2);
  const back: [number, number, number] = [3.2 * h + 0.6, 1.9 * h + 0.2, -1.9 * h - 0.6];
  const distance = Math.hypot(...back);
  const start = (): Orbit => ({
    yaw: Math.atan2(back[0], back[2]),
    pitch: Math.asin(back[1] / distance),
    distance,
    target: [0, -0.5 * h, 0.3 * h],
  });
  const limits = { min: 0.25 * h + 0.1, max: 12 * distance };
  const cam: FollowCamera = {
    orbit: start(),
    moved: false,
    apply(camera, x, y, z) {
      const o = cam.orbit;
      const tx = x + o.target[0];
      const ty = y + o.target[1];
      const tz = z + o.target[2];
      const c = Math.cos(o.pitch);
      camera.position.set(tx + o.distance * c * Math.sin(o.yaw), ty + o.distance * Math.sin(o.pitch), tz + o.distance * c * Math.cos(o.yaw));
      camera.lookAt(tx, ty, tz);
    },
    rotate(dx, dy, viewHeight) {
      cam.orbit = rotate(cam.orbit, dx, dy, viewHeight);
      cam.moved = true;
    },
    pan(dx, dy, viewHeight) {
      cam.orbit = pan(cam.orbit, dx, dy, viewHeight, WALK_FOV);
      cam.moved = true;
    },
    zoom(factor) {
      cam.orbit = zoom(cam.orbit, factor, limits);
      cam.moved = true;
    },
    frame(point, x, y, z) {
      cam.orbit = { ...cam.orbit, target: [point[0] - x, point[1] - y, point[2] - z], distance: Math.max(limits.min, 0.45 * distance) };
      cam.moved = true;
    },
    reset() {
      cam.orbit = start();
      cam.moved = false;
    },
  };
  return cam;
}
