/**
 * The three.js scene of a walk: the course as a shaded height mesh, the body as a box, each leg as a line
 * from its hip through its joints (when known) to the foot, feet as spheres (filled in stance, open in
 * swing) and targets as small rings. Shared by the trial playback and the live preview.
 */
import * as THREE from 'three';
import type { Heightfield } from '../../engine/course/heightfield';
import type { Rig } from '../../engine/gait/rig';
import { colors } from '../../constants/theme';

export interface WalkPose {
  /** Body origin (hip level), m. */
  body: [number, number, number];
  pitch: number;
  roll: number;
  /** legs × 3: foot and target positions; contact per leg (1 in stance). */
  feet: ArrayLike<number>;
  targets: ArrayLike<number>;
  contact: ArrayLike<number>;
  /** Optional joint positions per leg (hip → last joint), when the solver's pose is at hand. */
  joints?: ArrayLike<number>[];
  /** The body's whole rotation [x, y, z, w] when it also turns (drive mode); pitch and roll are then unused. */
  rotation?: [number, number, number, number];
}

export interface WalkScene {
  scene: THREE.Scene;
  camera: THREE.PerspectiveCamera;
  update(pose: WalkPose): void;
  dispose(): void;
}

const LOW = new THREE.Color(colors.paperDeep);
const HIGH = new THREE.Color(colors.graphite);

function courseMesh(hf: Heightfield): THREE.Mesh {
  const { cols, rows, cellSize, heights } = hf;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < heights.length; i++) {
    lo = Math.min(lo, heights[i]);
    hi = Math.max(hi, heights[i]);
  }
  const span = Math.max(hi - lo, 1e-3);
  const position = new Float32Array(cols * rows * 3);
  const color = new Float32Array(cols * rows * 3);
  const c = new THREE.Color();
  for (let r = 0; r < rows; r++) {
    for (let k = 0; k < cols; k++) {
      const i = r * cols + k;
      position[3 * i] = (k - (cols - 1) / 2) * cellSize;
      position[3 * i + 1] = heights[i];
      position[3 * i + 2] = r * cellSize;
      c.copy(LOW).lerp(HIGH, (heights[i] - lo) / span);
      color.set([c.r, c.g, c.b], 3 * i);
    }
  }
  const index: number[] = [];
  for (let r = 0; r + 1 < rows; r++) {
    for (let k = 0; k + 1 < cols; k++) {
      const a = r * cols + k;
      index.push(a, a + cols, a + 1, a + 1, a + cols, a + cols + 1);
    }
  }
  const g = new THREE.BufferGeometry();
  g.setAttribute('position', new THREE.BufferAttribute(position, 3));
  g.setAttribute('color', new THREE.BufferAttribute(color, 3));
  g.setIndex(index);
  g.computeVertexNormals();
  return new THREE.Mesh(g, new THREE.MeshLambertMaterial({ vertexColors: true, side: THREE.DoubleSide }));
}

/** Lights and the course: what every walk scene starts from. */
export function createCourseScene(course: Heightfield): THREE.Scene {
  const scene = new THREE.Scene();
  scene.add(new THREE.HemisphereLight(colors.paper, colors.graphite, 2.2));
  const sun = new THREE.DirectionalLight('#ffffff', 1.4);
  sun.position.set(3, 6, 2);
  scene.add(sun);
  scene.add(courseMesh(course));
  return scene;
}

/** The stick figure of a rig: body box and leg lines (the "skeleton"), feet and target rings. */
export interface StickFigure {
  /** Body box, leg lines and feet: hidden when the character's own mesh is shown. */
  skeleton: THREE.Group;
  /** Target rings: always shown. */
  targets: THREE.Group;
  update(pose: WalkPose): void;
  dispose(): void;
}

export function createStickFigure(rig: Rig, tint?: string): StickFigure {
  const h = Math.max(rig.hipHeight, 0.2);
  const skeleton = new THREE.Group();
  skeleton.name = 'skeleton';
  const targets = new THREE.Group();
  targets.name = 'targets';
  let width = 0;
  let length = 0;
  for (const l of rig.legs) {
    width = Math.max(width, Math.abs(l.hip[0]) * 2);
    length = Math.max(length, Math.abs(l.hip[2]) * 2);
  }
  const body = new THREE.Mesh(new THREE.BoxGeometry(Math.max(width, 0.1 * h), 0.25 * h, Math.max(length, 0.25 * h)), new THREE.MeshLambertMaterial({ color: tint ?? colors.ember }));
  skeleton.add(body);
  const legMaterial = new THREE.LineBasicMaterial({ color: colors.ink });
  const stanceMaterial = new THREE.MeshLambertMaterial({ color: colors.ink });
  const swingMaterial = new THREE.MeshLambertMaterial({ color: colors.paper, emissive: new THREE.Color(colors.graphite) });
  const footGeometry = new THREE.SphereGeometry(0.035 * h + 0.01, 12, 8);
  const ringGeometry = new THREE.TorusGeometry(0.05 * h + 0.012, 0.006, 6, 20);
  const ringMaterial = new THREE.MeshBasicMaterial({ color: colors.moss });
  const materials: THREE.Material[] = [body.material, legMaterial, stanceMaterial, swingMaterial, ringMaterial];
  const legs = rig.legs.map((leg) => {
    // Hip, every joint after it, the foot: the buffer is sized once and drawn up to what this frame fills.
    const positions = new Float32Array(3 * (leg.chain.joints.length + 2));
    const geometry = new THREE.BufferGeometry();
    const attribute = new THREE.BufferAttribute(positions, 3);
    attribute.setUsage(THREE.DynamicDrawUsage);
    geometry.setAttribute('position', attribute);
    const line = new THREE.Line(geometry, legMaterial);
    // The points move every frame; bounds from the first frame would cull the line once the walk leaves them.
    line.frustumCulled = false;
    const foot = new THREE.Mesh(footGeometry, stanceMaterial);
    const target = new THREE.Mesh(ringGeometry, ringMaterial);
    target.rotation.x = Math.PI / 2;
    skeleton.add(line, foot);
    targets.add(target);
    return { line, attribute, positions, foot, target };
  });
  const rot = new THREE.Quaternion();
  const euler = new THREE.Euler();
  const v = new THREE.Vector3();

  return {
    skeleton,
    targets,
    update(p) {
      // Pitch is nose up (a rotation about −X when +Z is forward), roll is left side up (about +Z).
      euler.set(-p.pitch, 0, p.roll, 'YXZ');
      if (p.rotation) rot.set(p.rotation[0], p.rotation[1], p.rotation[2], p.rotation[3]);
      else rot.setFromEuler(euler);
      body.position.set(p.body[0], p.body[1], p.body[2]);
      body.quaternion.copy(rot);
      rig.legs.forEach((leg, i) => {
        const parts = legs[i];
        const pts = parts.positions;
        v.set(leg.hip[0], leg.hip[1], leg.hip[2]).applyQuaternion(rot).add(body.position);
        pts[0] = v.x;
        pts[1] = v.y;
        pts[2] = v.z;
        let n = 1;
        const joints = p.joints?.[i];
        if (joints) for (let k = 3; k + 2 < joints.length && n + 1 < pts.length / 3; k += 3, n++) {
          pts[3 * n] = joints[k];
          pts[3 * n + 1] = joints[k + 1];
          pts[3 * n + 2] = joints[k + 2];
        }
        pts[3 * n] = p.feet[3 * i];
        pts[3 * n + 1] = p.feet[3 * i + 1];
        pts[3 * n + 2] = p.feet[3 * i + 2];
        n++;
        parts.attribute.needsUpdate = true;
        parts.line.geometry.setDrawRange(0, n);
        parts.foot.position.set(p.feet[3 * i], p.feet[3 * i + 1], p.feet[3 * i + 2]);
        parts.foot.material = p.contact[i] ? stanceMaterial : swingMaterial;
        parts.target.position.set(p.targets[3 * i], p.targets[3 * i + 1] + 0.003, p.targets[3 * i + 2]);
      });
    },
    dispose() {
      for (const g of [skeleton, targets]) g.traverse((o) => (o as THREE.Mesh).geometry?.dispose?.());
      for (const m of materials) m.dispose();
    },
  };
}

/** One walker over a course with a follow camera: the live preview's scene. */
export function createWalkScene(course: Heightfield, rig: Rig, aspect: number): WalkScene {
  const scene = createCourseScene(course);
  const camera = new THREE.PerspectiveCamera(40, aspect, 0.01, 500);
  const figure = createStickFigure(rig);
  scene.add(figure.skeleton, figure.targets);
  const h = Math.max(rig.hipHeight, 0.2);
  return {
    scene,
    camera,
    update(p) {
      figure.update(p);
      camera.position.set(p.body[0] + 3.2 * h + 0.6, p.body[1] + 1.4 * h + 0.2, p.body[2] - 1.6 * h - 0.3);
      camera.lookAt(p.body[0], p.body[1] - 0.5 * h, p.body[2] + 0.3 * h);
    },
    dispose() {
      figure.dispose();
      scene.traverse((o) => (o as THREE.Mesh).geometry?.dispose?.());
    },
  };
}
