/**
 * Mirrored legs behave as mirrors: a leg and its mirror image (mirrorChain: positions reflected in the
 * sagittal plane x → −x, rotation axes as pseudovectors (x, −y, −z)), given mirrored targets and normals
 * from the same start, end with the same hinge and universal angles, and ball rotations mirrored as
 * pseudovectors. A reflection is an isometry, so every method's result must reflect exactly; only
 * rounding separates the two (common practice, no source).
 */
import { SOLVER_METHODS, createWorkspace, setRootTransform, solve } from '../../../engine/ik';
import { digitigradeLeg, humanLeg, insectLeg, mirrorChain } from '../../../engine/rig/presets';
import type { LegChain } from '../../../engine/rig/types';
import { DOF_BALL } from '../../../engine/ik/layout';

const LEGS: [string, LegChain, boolean][] = [
  ['human', humanLeg({ thigh: 0.5, shin: 0.48 }), true],
  ['digitigrade', digitigradeLeg({ scale: 1.5 }), false],
  ['insect', insectLeg({ scale: 2 }), false],
];

/** Targets below and around the hip, some near the edge of reach, some folded in (our own choice). */
const TARGETS: [number, number, number][] = [
  [0.05, -0.8, 0.25],
  [0.12, -0.55, -0.3],
  [-0.04, -0.95, 0.1],
  [0.2, -0.4, 0.4],
];

describe.each(LEGS)('%s leg and its mirror image', (_name, chain, orient) => {
  const mirrored = mirrorChain(chain);
  it.each(SOLVER_METHODS)('%s gives mirrored joint angles within 1e-9', (method) => {
    for (const [x, y, z] of TARGETS) {
      const left = createWorkspace(chain, { method, maxIterations: 40 });
      const right = createWorkspace(mirrored, { method, maxIterations: 40 });
      setRootTransform(left, [0.1, 1, 0], [0, 0, 0, 1]);
      setRootTransform(right, [-0.1, 1, 0], [0, 0, 0, 1]);
      const normal = orient ? [0.1, 0.98, 0.05] : null;
      const mirroredNormal = orient ? [-0.1, 0.98, 0.05] : null;
      const a = Float64Array.from(solve(left, [0.1 + x, 1 + y, z], normal, { startPose: 'rest' }).pose);
      const b = Float64Array.from(solve(right, [-0.1 - x, 1 + y, z], mirroredNormal, { startPose: 'rest' }).pose);
      for (let d = 0; d < a.length; d++) {
        const ball = left.dKind[d] === DOF_BALL;
        // Inside a ball's rotation vector (rx, ry, rz) the mirror flips ry and rz.
        const first = ball && ballStarts(left).has(d);
        const expected = ball && !first ? -b[d] : b[d];
        expect([d, Math.abs(a[d] - expected) <= 1e-9]).toEqual([d, true]);
      }
    }
  });
});

/** DOF indices where a ball joint's rotation vector starts. */
function ballStarts(ws: ReturnType<typeof createWorkspace>): Set<number> {
  const out = new Set<number>();
  for (let j = 0; j < ws.nJoints; j++) if (ws.jBall[j] >= 0) out.add(ws.jDof0[j]);
  return out;
}
