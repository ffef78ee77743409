/**
 * Peers for the IK benchmark (not engine code):
 *  - FdDlsPeer: DLS "as it is usually first written": a finite-difference
 *    Jacobian that perturbs each DOF and recomputes the whole chain with
 *    gl-matrix objects, ml-matrix for (JJᵀ + λ²I)⁻¹, new matrices every
 *    iteration. Same λ, tolerance, iteration cap, target clamp and step cap as ours.
 *  - ThreeCcdPeer: three.js's CCDIKSolver on an equivalent bone chain.
 */
import { mat4, quat, vec3 } from 'gl-matrix';
import { Matrix, inverse } from 'ml-matrix';
import { Bone, Euler, Quaternion, Skeleton, Vector3 } from 'three';
import { CCDIKSolver } from 'three/examples/jsm/animation/CCDIKSolver.js';
import { createWorkspace } from '../../engine/ik';
import { clampBall } from '../../engine/ik/limits';
import { expRotationVector, logQuaternion } from '../../engine/ik/pose';
import type { LegChain } from '../../engine/rig/types';

export interface PeerOptions {
  lambda: number;
  tolerance: number;
  maxIterations: number;
  clampDistance: number;
  maxStepAngle: number;
  maxStepLength: number;
}

export class FdDlsPeer {
  readonly n: number;
  pose: number[];
  private readonly rest: number[];
  private readonly limiter; // our workspace, used only for its ball-limit clamp
  constructor(
    readonly chain: LegChain,
    readonly opts: PeerOptions,
  ) {
    this.limiter = createWorkspace(chain);
    this.n = this.limiter.nDof;
    this.rest = Array.from(this.limiter.restPose);
    this.pose = this.rest.slice();
  }

  reset(): void {
    this.pose = this.rest.slice();
  }

  /** Sole position for a pose (ball DOFs as rotation vectors), recomputing the chain. */
  fk(pose: number[]): vec3 {
    let world = mat4.create(); // root = identity in the benchmark
    let d = 0;
    for (const j of this.chain.joints) {
      const local = mat4.create();
      let q = quat.fromValues(j.rest[0], j.rest[1], j.rest[2], j.rest[3]);
      let t = vec3.fromValues(j.offset[0], j.offset[1], j.offset[2]);
      if (j.kind === 'hinge') {
        const r = quat.setAxisAngle(quat.create(), vec3.fromValues(...j.axes[0]), pose[d]);
        q = quat.multiply(quat.create(), q, r);
        d += 1;
      } else if (j.kind === 'universal') {
        const r1 = quat.setAxisAngle(quat.create(), vec3.fromValues(...j.axes[0]), pose[d]);
        const r2 = quat.setAxisAngle(quat.create(), vec3.fromValues(...j.axes[1]), pose[d + 1]);
        q = quat.multiply(quat.create(), quat.multiply(quat.create(), q, r1), r2);
        d += 2;
      } else if (j.kind === 'ball') {
        const v = vec3.fromValues(pose[d], pose[d + 1], pose[d + 2]);
        const a = vec3.length(v);
        const r = a > 0 ? quat.setAxisAngle(quat.create(), vec3.scale(vec3.create(), v, 1 / a), a) : quat.create();
        q = quat.multiply(quat.create(), q, r);
        d += 3;
      } else {
        mat4.fromRotationTranslation(local, q, t);
        world = mat4.multiply(mat4.create(), world, local);
        const slide = mat4.fromTranslation(mat4.create(), vec3.scale(vec3.create(), vec3.fromValues(...j.axes[0]), pose[d]));
        world = mat4.multiply(mat4.create(), world, slide);
        d += 1;
        continue;
      }
      mat4.fromRotationTranslation(local, q, t);
      world = mat4.multiply(mat4.create(), world, local);
      t = vec3.create();
    }
    return vec3.transformMat4(vec3.create(), vec3.fromValues(...this.chain.sole), world);
  }

  private clampPose(pose: number[]): void {
    const ws = this.limiter;
    for (let i = 0; i < this.n; i++) {
      if (ws.dKind[i] === 1) continue;
      pose[i] = Math.min(ws.hi[i], Math.max(ws.lo[i], pose[i]));
    }
    for (let j = 0; j < ws.nJoints; j++) {
      const b = ws.jBall[j];
      if (b < 0) continue;
      const d = ws.jDof0[j];
      expRotationVector(pose[d], pose[d + 1], pose[d + 2], ws.quat, 4 * b);
      if (clampBall(ws, b)) {
        const out = new Float64Array(3);
        logQuaternion(ws.quat, 4 * b, out, 0);
        pose[d] = out[0];
        pose[d + 1] = out[1];
        pose[d + 2] = out[2];
      }
    }
  }

  solve(target: ArrayLike<number>): { iterations: number; error: number } {
    const { lambda, tolerance, maxIterations, clampDistance, maxStepAngle, maxStepLength } = this.opts;
    const h = 1e-6;
    let pose = this.pose;
    let it = 0;
    let f = this.fk(pose);
    let e = [target[0] - f[0], target[1] - f[1], target[2] - f[2]];
    let err = Math.hypot(e[0], e[1], e[2]);
    while (err > tolerance && it < maxIterations) {
      const J = new Matrix(3, this.n);
      for (let i = 0; i < this.n; i++) {
        const p2 = pose.slice();
        p2[i] += h;
        const f2 = this.fk(p2);
        for (let r = 0; r < 3; r++) J.set(r, i, (f2[r] - f[r]) / h);
      }
      const ec = err > clampDistance ? e.map((v) => (v * clampDistance) / err) : e;
      const A = J.mmul(J.transpose()).add(Matrix.eye(3).mul(lambda * lambda));
      const dq = J.transpose().mmul(inverse(A)).mmul(Matrix.columnVector(ec)).to1DArray();
      let k = 1;
      for (let i = 0; i < this.n; i++) {
        const lim = this.limiter.dKind[i] === 2 ? maxStepLength : maxStepAngle;
        if (Math.abs(dq[i]) * k > lim) k = lim / Math.abs(dq[i]);
      }
      pose = pose.map((v, i) => v + k * dq[i]);
      this.clampPose(pose);
      it++;
      f = this.fk(pose);
      e = [target[0] - f[0], target[1] - f[1], target[2] - f[2]];
      err = Math.hypot(e[0], e[1], e[2]);
    }
    this.pose = pose;
    return { iterations: it, error: err };
  }
}

/**
 * three.js CCD on an equivalent bone chain: hinges get `limitation` (their
 * axis) and Euler bounds on that axis; a universal joint (X then Z) is an
 * Euler XYZ box with Y held at 0, which is exactly R_x·R_z with our limits; a
 * ball is an Euler box (swing ±cone on X and Z, twist on Y) approximating the
 * cone; three's CCD cannot drive a slider, so a piston stays at its rest
 * extension.
 */
export class ThreeCcdPeer {
  readonly bones: Bone[] = [];
  readonly links: Bone[] = [];
  readonly effector: Bone;
  readonly target: Bone;
  readonly root: Bone;
  readonly solver: CCDIKSolver;
  readonly restQuats: Quaternion[] = [];
  private readonly ik: { iteration: number };
  private readonly tmp = new Vector3();

  constructor(chain: LegChain, iteration: number) {
    const ws = createWorkspace(chain);
    this.root = new Bone();
    this.bones.push(this.root);
    let parent: Bone = this.root;
    const linkSpecs: {
      index: number;
      limitation?: Vector3;
      rotationMin?: Vector3;
      rotationMax?: Vector3;
    }[] = [];
    let carry = new Vector3(); // translation carried from a slider
    let d = 0;
    for (const j of chain.joints) {
      if (j.kind === 'slider') {
        const a = new Vector3(...j.axes[0]).normalize().multiplyScalar(ws.restPose[d]);
        carry.add(new Vector3(...j.offset)).add(a);
        d += 1;
        continue;
      }
      const bone = new Bone();
      bone.position.set(j.offset[0], j.offset[1], j.offset[2]).add(carry);
      carry = new Vector3();
      const q = new Quaternion(j.rest[0], j.rest[1], j.rest[2], j.rest[3]);
      const spec: (typeof linkSpecs)[number] = { index: this.bones.length };
      if (j.kind === 'hinge') {
        const ax = new Vector3(...j.axes[0]).normalize();
        q.multiply(new Quaternion().setFromAxisAngle(ax, ws.restPose[d]));
        spec.limitation = ax;
        const lo = ws.lo[d];
        const hi = ws.hi[d];
        const comp = Math.abs(ax.x) > 0.5 ? 0 : Math.abs(ax.y) > 0.5 ? 1 : 2;
        const mn = [0, 0, 0];
        const mx = [0, 0, 0];
        mn[comp] = Number.isFinite(lo) ? lo : -Math.PI;
        mx[comp] = Number.isFinite(hi) ? hi : Math.PI;
        spec.rotationMin = new Vector3(...mn);
        spec.rotationMax = new Vector3(...mx);
        d += 1;
      } else if (j.kind === 'universal') {
        q.setFromEuler(new Euler(ws.restPose[d], 0, ws.restPose[d + 1], 'XYZ'));
        spec.rotationMin = new Vector3(ws.lo[d], 0, ws.lo[d + 1]);
        spec.rotationMax = new Vector3(ws.hi[d], 0, ws.hi[d + 1]);
        d += 2;
      } else {
        const b = j.ball;
        const sw = b ? Math.min(b.swing, Math.PI / 2) : Math.PI;
        spec.rotationMin = new Vector3(-sw, b ? b.twistMin : -Math.PI, -sw);
        spec.rotationMax = new Vector3(sw, b ? b.twistMax : Math.PI, sw);
        d += 3;
      }
      bone.quaternion.copy(q);
      parent.add(bone);
      this.bones.push(bone);
      this.links.push(bone);
      this.restQuats.push(q.clone());
      linkSpecs.push(spec);
      parent = bone;
    }
    this.effector = new Bone();
    this.effector.position.set(chain.sole[0], chain.sole[1], chain.sole[2]).add(carry);
    parent.add(this.effector);
    this.bones.push(this.effector);
    this.target = new Bone();
    this.bones.push(this.target);
    const skeleton = new Skeleton(this.bones);
    const ik = {
      target: this.bones.length - 1,
      effector: this.bones.length - 2,
      links: linkSpecs.reverse(),
      iteration,
    };
    this.ik = ik;
    // CCDIKSolver only reads mesh.skeleton.bones.
    this.solver = new CCDIKSolver({ skeleton } as never, [ik] as never);
    this.reset();
  }

  setIterations(n: number): void {
    this.ik.iteration = n;
  }

  reset(): void {
    this.links.forEach((b, i) => b.quaternion.copy(this.restQuats[i]));
    this.root.updateMatrixWorld(true);
  }

  solve(target: ArrayLike<number>): number {
    this.target.position.set(target[0], target[1], target[2]);
    this.target.updateMatrixWorld(true);
    this.solver.update();
    this.tmp.setFromMatrixPosition(this.effector.matrixWorld);
    return Math.hypot(this.tmp.x - target[0], this.tmp.y - target[1], this.tmp.z - target[2]);
  }
}
