/**
 * Analytic geometric Jacobian (rotation column ω×(pₑ−pⱼ), orientation rows ω;
 * slider column = axis) against central finite differences, on seeded random
 * chains of every DOF type. Source of the Jacobian form: Buss 2004 §2;
 * Spong et al. ch. 5 (geometric Jacobian).
 */
import {
  createWorkspace,
  finiteDifferenceJacobian,
  forwardKinematics,
  jacobian,
  setPose,
  setRootTransform,
} from '../../../engine/ik';
import { mulberry32 } from '../../../engine/math/random';
import { ALL_KINDS, randomChain, randomKinds, randomQuat, randomUnit } from './helpers';

describe('analytic vs finite-difference Jacobian', () => {
  test.each(ALL_KINDS.map((k) => [k]))('single-kind chains of %s joints', (kind) => {
    const rng = mulberry32(101 + ALL_KINDS.indexOf(kind));
    for (let trial = 0; trial < 10; trial++) {
      const chain = randomChain(rng, [kind, kind, kind]);
      check(chain, rng);
    }
  });

  test('seeded random mixed chains (2–6 joints), position and orientation rows', () => {
    const rng = mulberry32(4242);
    for (let trial = 0; trial < 60; trial++) {
      const kinds = randomKinds(rng, 2 + rng.int(5));
      check(randomChain(rng, kinds), rng);
    }
  });
});

function check(chain: ReturnType<typeof randomChain>, rng: ReturnType<typeof mulberry32>) {
  const ws = createWorkspace(chain, { orientationWeight: 0.3 });
  const pose = new Float64Array(ws.nDof);
  for (let i = 0; i < pose.length; i++) pose[i] = rng.range(-1.5, 1.5);
  setPose(ws, pose);
  const p = randomUnit(rng);
  setRootTransform(ws, p, randomQuat(rng));
  forwardKinematics(ws);
  for (const rows of [3, 6] as const) {
    const Ja = Float64Array.from(jacobian(ws, rows));
    const Jf = finiteDifferenceJacobian(ws, rows, 1e-6);
    for (let i = 0; i < ws.nDof; i++)
      for (let r = 0; r < rows; r++) expect(Math.abs(Ja[6 * i + r] - Jf[6 * i + r])).toBeLessThan(1e-7);
  }
}
