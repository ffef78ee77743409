import type { ChainJoint, LegChain } from '../../../engine/rig/types';

/** Planar arm in the XY plane: hinges about +Z, links along +X (textbook convention). */
export function planarArm(lengths: number[], name = 'planar'): LegChain {
  const joints: ChainJoint[] = lengths.map((_, i) => ({
    name: `j${i}`,
    kind: 'hinge',
    offset: i === 0 ? [0, 0, 0] : [lengths[i - 1], 0, 0],
    rest: [0, 0, 0, 1],
    axes: [[0, 0, 1]],
  }));
  return {
    name,
    kind: 'custom',
    joints,
    sole: [lengths[lengths.length - 1], 0, 0],
    soleNormal: [1, 0, 0],
    reach: lengths.reduce((a, b) => a + b, 0),
  };
}

export const deg = (d: number) => (d * Math.PI) / 180;
export const wrap = (a: number) => Math.atan2(Math.sin(a), Math.cos(a));

import type { DofKind } from '../../../engine/rig/types';
import type { Rng } from '../../../engine/math/random';

export function randomUnit(rng: Rng): [number, number, number] {
  const z = rng.range(-1, 1);
  const p = rng.range(0, 2 * Math.PI);
  const r = Math.sqrt(1 - z * z);
  return [r * Math.cos(p), r * Math.sin(p), z];
}

export function randomQuat(rng: Rng): [number, number, number, number] {
  const a = randomUnit(rng);
  const t = rng.range(-Math.PI, Math.PI);
  const s = Math.sin(t / 2);
  return [a[0] * s, a[1] * s, a[2] * s, Math.cos(t / 2)];
}

/** Seeded random chain with the given joint kinds (random offsets, rest rotations, axes; no limits). */
export function randomChain(rng: Rng, kinds: DofKind[]): LegChain {
  const joints: ChainJoint[] = kinds.map((kind, i) => {
    const nAxes = kind === 'universal' ? 2 : kind === 'ball' ? 0 : 1;
    const axes: [number, number, number][] = [];
    for (let a = 0; a < nAxes; a++) axes.push(randomUnit(rng));
    const off = randomUnit(rng);
    const len = i === 0 ? 0 : rng.range(0.1, 0.5);
    return {
      name: `${kind}${i}`,
      kind,
      offset: [off[0] * len, off[1] * len, off[2] * len],
      rest: i % 2 === 0 ? randomQuat(rng) : [0, 0, 0, 1],
      axes,
    };
  });
  const s = randomUnit(rng);
  return {
    name: 'random',
    kind: 'custom',
    joints,
    sole: [s[0] * 0.1, s[1] * 0.1, s[2] * 0.1],
    soleNormal: randomUnit(rng),
    reach: 2,
  };
}

export const ALL_KINDS: DofKind[] = ['hinge', 'universal', 'ball', 'slider'];

export function randomKinds(rng: Rng, n: number): DofKind[] {
  const out: DofKind[] = [];
  for (let i = 0; i < n; i++) out.push(ALL_KINDS[rng.int(4)]);
  return out;
}
