/**
 * What the walk leaves behind in the 3D view: a trail of each foot over its last steps, and a mark at every
 * recent stumble where it happened, in its kind's colour and glyph (the same glyphs as the timeline,
 * components/trial/stumble-glyphs.ts), turned to face the camera and drawn over the scene.
 * Meshes and buffers are made once; a frame only moves them.
 */
import * as THREE from 'three';
import type { TrialSeries } from '../../engine/gait/series';
import { STUMBLE_KINDS, type StumbleKind } from '../../engine/metrics/stumble-thresholds';
import type { StumbleEvent } from '../../engine/metrics/trial-metrics';
import { colors } from '../../constants/theme';
import { stumbleColor } from '../trial/stumble-glyphs';

/** Seconds of foot trail behind the playhead, and how long a stumble's mark stays after it happened. */
export const TRAIL_SECONDS = 1.5;
export const MARK_SECONDS = 2.5;
const MAX_MARKS = 24;

/** A flat glyph (unit half-size) in the XY plane, as triangles: the shapes of glyphPath, with strokes as thin bars. */
function glyphGeometry(kind: StumbleKind): THREE.BufferGeometry {
  const bar = (x0: number, y0: number, x1: number, y1: number, w: number): THREE.Shape => {
    const dx = x1 - x0;
    const dy = y1 - y0;
    const l = Math.hypot(dx, dy) || 1;
    const nx = (-dy / l) * (w / 2);
    const ny = (dx / l) * (w / 2);
    return new THREE.Shape([new THREE.Vector2(x0 + nx, y0 + ny), new THREE.Vector2(x1 + nx, y1 + ny), new THREE.Vector2(x1 - nx, y1 - ny), new THREE.Vector2(x0 - nx, y0 - ny)]);
  };
  switch (kind) {
    case 'sink': // pointing down, into the ground
      return new THREE.ShapeGeometry(new THREE.Shape([new THREE.Vector2(-1, 1), new THREE.Vector2(0, -1), new THREE.Vector2(1, 1)]));
    case 'skid':
      return new THREE.ShapeGeometry(new THREE.Shape([new THREE.Vector2(0, 1), new THREE.Vector2(-1, 0), new THREE.Vector2(0, -1), new THREE.Vector2(1, 0)]));
    case 'reach-miss':
      return new THREE.ShapeGeometry([bar(-1, -1, 1, 1, 0.45), bar(-1, 1, 1, -1, 0.45)]);
    case 'scuff':
      return new THREE.CircleGeometry(1, 20);
    case 'snap':
      return new THREE.ShapeGeometry([bar(-1, -1, -0.33, 1, 0.4), bar(-0.33, 1, 0.33, -1, 0.4), bar(0.33, -1, 1, 1, 0.4)]);
  }
}

export interface WalkMarks {
  group: THREE.Group;
  /** Show the trail and marks at sample k (fractional is fine); `camera` turns the marks to face it. */
  update(k: number, camera: THREE.Camera): void;
  dispose(): void;
}

export function createWalkMarks(series: TrialSeries, events: readonly StumbleEvent[], hipHeight: number): WalkMarks {
  const group = new THREE.Group();
  group.name = 'walk marks';
  const L = series.legs;
  const trailPoints = Math.max(2, Math.ceil(TRAIL_SECONDS * series.rate) + 1);
  const trailMaterial = new THREE.LineBasicMaterial({ color: colors.graphite, transparent: true, opacity: 0.7 });
  const trails = Array.from({ length: L }, () => {
    const positions = new Float32Array(3 * trailPoints);
    const attribute = new THREE.BufferAttribute(positions, 3);
    attribute.setUsage(THREE.DynamicDrawUsage);
    const geometry = new THREE.BufferGeometry();
    geometry.setAttribute('position', attribute);
    const line = new THREE.Line(geometry, trailMaterial);
    line.frustumCulled = false;
    group.add(line);
    return { positions, attribute, line };
  });

  const size = 0.035 * Math.max(hipHeight, 0.2) + 0.012;
  const geometries = Object.fromEntries(STUMBLE_KINDS.map((k) => [k, glyphGeometry(k)])) as Record<StumbleKind, THREE.BufferGeometry>;
  const materials = Object.fromEntries(
    STUMBLE_KINDS.map((k) => [k, new THREE.MeshBasicMaterial({ color: stumbleColor(k), side: THREE.DoubleSide, depthTest: false, transparent: true })]),
  ) as Record<StumbleKind, THREE.MeshBasicMaterial>;
  const marks = Array.from({ length: MAX_MARKS }, () => {
    const m = new THREE.Mesh(geometries.sink, materials.sink);
    m.renderOrder = 20;
    m.visible = false;
    m.scale.setScalar(size);
    m.frustumCulled = false;
    group.add(m);
    return m;
  });
  const sorted = [...events].sort((a, b) => a.time - b.time);
  const times = Float64Array.from(sorted, (e) => e.time);
  // Where each stumble happened: its foot at the sample nearest its time, a little above the sole.
  const at = new Float32Array(3 * sorted.length);
  sorted.forEach((e, n) => {
    const s = Math.max(0, Math.min(series.length - 1, Math.round(e.time * series.rate)));
    const o = 3 * (s * L + Math.min(e.leg, L - 1));
    at[3 * n] = series.foot[o];
    at[3 * n + 1] = series.foot[o + 1] + 1.6 * size;
    at[3 * n + 2] = series.foot[o + 2];
  });

  return {
    group,
    update(k, camera) {
      const last = Math.max(0, Math.min(series.length - 1, Math.floor(k)));
      const first = Math.max(0, last - trailPoints + 1);
      for (let i = 0; i < L; i++) {
        const t = trails[i];
        let n = 0;
        for (let s = first; s <= last; s++, n++) {
          const o = 3 * (s * L + i);
          t.positions[3 * n] = series.foot[o];
          t.positions[3 * n + 1] = series.foot[o + 1] + 0.004;
          t.positions[3 * n + 2] = series.foot[o + 2];
        }
        t.attribute.needsUpdate = true;
        t.line.geometry.setDrawRange(0, n);
      }
      const now = k / series.rate;
      // Stumbles from MARK_SECONDS ago up to now, newest kept when there are more than the pool holds.
      let hi = 0;
      while (hi < times.length && times[hi] <= now + 1e-6) hi++;
      let lo = hi;
      while (lo > 0 && times[lo - 1] >= now - MARK_SECONDS && hi - lo < MAX_MARKS) lo--;
      for (let m = 0; m < MAX_MARKS; m++) {
        const mark = marks[m];
        const n = lo + m;
        if (n >= hi) {
          mark.visible = false;
          continue;
        }
        const kind = sorted[n].kind;
        mark.geometry = geometries[kind];
        mark.material = materials[kind];
        mark.position.set(at[3 * n], at[3 * n + 1], at[3 * n + 2]);
        mark.quaternion.copy(camera.quaternion);
        mark.visible = true;
      }
    },
    dispose() {
      for (const t of trails) t.line.geometry.dispose();
      trailMaterial.dispose();
      for (const k of STUMBLE_KINDS) {
        geometries[k].dispose();
        materials[k].dispose();
      }
    },
  };
}
