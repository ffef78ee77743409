import { detectLegs } from '../../engine/rig/detect-legs';
import { nameSide, nameTokens, nameHint } from '../../engine/rig/skeleton-names';
import { legMappingProblems } from '../../engine/rig/skeleton-leg-check';
import { jointWorldPositions } from '../../engine/rig/skeleton-world';
import type { Skeleton } from '../../engine/rig/types';
import type { RigDesign } from '../../seeds/characters/rig-builder';
import { anonymised, bipedWithLongArms, bipedWithTail, burrow, skitter, wicket } from '../fixtures/gltf/build-fixtures';

/** The rest skeleton of a design as the importer builds it: identity rotations, translations from the parent. */
function skeletonOf(design: RigDesign): Skeleton {
  const index = new Map(design.bones.map((b, i) => [b.name, i]));
  return {
    joints: design.bones.map((b) => {
      const parent = b.parent === null ? -1 : index.get(b.parent)!;
      const p = parent < 0 ? [0, 0, 0] : design.bones[parent].at;
      return { name: b.name, parent, translation: [b.at[0] - p[0], b.at[1] - p[1], b.at[2] - p[2]], rotation: [0, 0, 0, 1], scale: [1, 1, 1] };
    }),
  };
}

function summary(design: RigDesign, rename: (n: string) => string = (n) => n) {
  const skeleton = skeletonOf(design);
  const result = detectLegs(skeleton);
  const name = (j: number) => rename(skeleton.joints[j].name);
  return {
    result,
    skeleton,
    legs: result.legs.map((l) => ({
      name: l.name,
      side: l.side,
      joints: l.joints.map((j) => `${name(j.joint)}:${j.dof}`),
      end: name(l.end),
      mirror: l.mirrorOf === null ? null : result.legs[l.mirrorOf].name,
    })),
  };
}

// Expected legs are what the designs in seeds/characters build: our own rigs, so the truth is known by construction.
const WICKET_LEGS = [
  { name: 'Left leg', side: 'left', joints: ['thigh_L:ball', 'shin_L:hinge', 'foot_L:universal'], end: 'toe_L', mirror: 'Right leg' },
  { name: 'Right leg', side: 'right', joints: ['thigh_R:ball', 'shin_R:hinge', 'foot_R:universal'], end: 'toe_R', mirror: 'Left leg' },
];
const burrowLeg = (row: 'F' | 'H', s: 'L' | 'R') => ({
  name: `${s === 'L' ? 'Left' : 'Right'} ${row === 'F' ? 'front' : 'hind'}`,
  side: s === 'L' ? 'left' : 'right',
  joints: [`upper_${row}${s}:ball`, `lower_${row}${s}:hinge`, `pastern_${row}${s}:hinge`],
  end: `hoof_${row}${s}`,
  mirror: `${s === 'L' ? 'Right' : 'Left'} ${row === 'F' ? 'front' : 'hind'}`,
});
const BURROW_LEGS = [burrowLeg('F', 'L'), burrowLeg('F', 'R'), burrowLeg('H', 'L'), burrowLeg('H', 'R')];
const ROW = ['front', 'middle', 'hind'];
const SKITTER_LEGS = [1, 2, 3].flatMap((n) =>
  (['L', 'R'] as const).map((s) => ({
    name: `${s === 'L' ? 'Left' : 'Right'} ${ROW[n - 1]}`,
    side: s === 'L' ? 'left' : 'right',
    joints: [`coxa_${s}${n}:ball`, `femur_${s}${n}:hinge`, `tibia_${s}${n}:hinge`],
    end: `tarsus_${s}${n}`,
    mirror: `${s === 'L' ? 'Right' : 'Left'} ${ROW[n - 1]}`,
  })),
);

describe('leg detection on the demo characters', () => {
  // glTF 2.0 §3.4: +Y up and the asset's front faces +Z, so the character's left is +X.
  it('finds Wicket’s two legs: hip ball, knee hinge, ankle universal, toe as the end', () => {
    expect(summary(wicket).legs).toEqual(WICKET_LEGS);
  });

  it('finds Burrow’s four legs, front and hind paired, and not its power cable', () => {
    const { legs, result, skeleton } = summary(burrow);
    expect(legs).toEqual(BURROW_LEGS);
    expect(result.rejected.map((r) => skeleton.joints[r.joints[0]].name)).toEqual(['cable_1']);
  });

  it('finds Skitter’s six legs in three rows and not its feelers', () => {
    expect(summary(skitter).legs).toEqual(SKITTER_LEGS);
  });

  it('is sure of legs that are paired, named like legs and reach the ground', () => {
    for (const design of [wicket, burrow, skitter]) for (const leg of summary(design).result.legs) expect(leg.confidence).toBeGreaterThanOrEqual(0.9);
  });
});

describe('leg detection by geometry alone', () => {
  it.each([
    ['Wicket', wicket, WICKET_LEGS],
    ['Burrow', burrow, BURROW_LEGS],
    ['Skitter', skitter, SKITTER_LEGS],
  ] as const)('finds the same legs in %s with meaningless bone names in shuffled order', (_n, design, expected) => {
    const { design: anon, original } = anonymised(design, 21);
    const { legs, result } = summary(anon, (n) => original.get(n)!);
    expect(legs).toEqual(expected);
    // Without names to back it up, detection is less sure, but still sure enough.
    for (const leg of result.legs) {
      expect(leg.confidence).toBeLessThan(1);
      expect(leg.confidence).toBeGreaterThan(0.75);
    }
  });
});

describe('parts that are not legs', () => {
  it('does not take a tail dragging on the ground for a leg, named or not', () => {
    const tailed = bipedWithTail();
    expect(summary(tailed).legs).toEqual(WICKET_LEGS);
    const { design, original } = anonymised(tailed, 5);
    const anon = summary(design, (n) => original.get(n)!);
    expect(anon.legs).toEqual(WICKET_LEGS);
    expect(anon.result.rejected.map((r) => r.reason)).toEqual(['runs along the mirror plane, like a tail']);
  });

  it('does not take arms hanging at the sides for legs, named or not', () => {
    const armed = bipedWithLongArms();
    expect(summary(armed).legs).toEqual(WICKET_LEGS);
    const { design, original } = anonymised(armed, 8);
    expect(summary(design, (n) => original.get(n)!).legs).toEqual(WICKET_LEGS);
  });
});

describe('DOF inference and default limits', () => {
  it('puts the knee hinge about the normal of the hip–knee–ankle plane, from straight to the flexion limit', () => {
    const skeleton = skeletonOf(wicket);
    const positions = jointWorldPositions(skeleton);
    const leg = detectLegs(skeleton).legs[0];
    const knee = leg.joints[1];
    const [hip, k, ankle] = [leg.joints[0].joint, knee.joint, leg.joints[2].joint].map((j) => [positions[3 * j], positions[3 * j + 1], positions[3 * j + 2]]);
    const u = [k[0] - hip[0], k[1] - hip[1], k[2] - hip[2]];
    const v = [ankle[0] - k[0], ankle[1] - k[1], ankle[2] - k[2]];
    // Plane normal u × v and bend angle acos(u·v / |u||v|) (vector algebra, common practice, no source).
    const n = [u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0]];
    const nn = Math.hypot(n[0], n[1], n[2]);
    const bend = Math.acos((u[0] * v[0] + u[1] * v[1] + u[2] * v[2]) / (Math.hypot(u[0], u[1], u[2]) * Math.hypot(v[0], v[1], v[2])));
    knee.axes[0].forEach((c, i) => expect(c).toBeCloseTo(n[i] / nn, 9));
    // Wicket's knee points forward (+Z), so flexing it moves the foot backward: the axis is the character's left, +X.
    expect(knee.axes[0][0]).toBeGreaterThan(0.99);
    expect(knee.limits[0].min).toBeCloseTo(-bend, 9);
    expect(knee.limits[0].max).toBeCloseTo((150 * Math.PI) / 180 - bend, 9);
  });

  it('gives the hip a swing cone and twist range, and the ankle flexion about the foot’s lateral axis plus roll about its length', () => {
    const leg = detectLegs(skeletonOf(wicket)).legs[0];
    const [hip, , ankle] = leg.joints;
    expect(hip.axes).toEqual([]);
    expect(hip.limits[0].min).toBe(0);
    expect(hip.limits[1].min).toBe(-hip.limits[1].max);
    // Wicket's foot points straight ahead: lateral axis +X, long axis +Z.
    expect(ankle.axes[0].map((c) => Math.round(c * 1e9) / 1e9)).toEqual([1, 0, 0]);
    expect(ankle.axes[1].map((c) => Math.round(c * 1e9) / 1e9)).toEqual([0, 0, 1]);
  });
});

describe('sides and facing', () => {
  it('follows the names when they say the character faces −Z', () => {
    // Wicket turned 180° about +Y: x and z negate, the names stay.
    const turned: RigDesign = { ...wicket, bones: wicket.bones.map((b) => ({ ...b, at: [-b.at[0], b.at[1], -b.at[2]] })) };
    const { result, legs } = summary(turned);
    expect(result.facesMinusZ).toBe(true);
    expect(legs.map((l) => [l.side, l.end])).toEqual([
      ['left', 'toe_L'],
      ['right', 'toe_R'],
    ]);
  });
});

describe('joint-name hints', () => {
  // Naming conventions common in rigs from DCC tools and mocap (common practice, no source).
  it.each([
    ['LeftUpLeg', 'left', 'leg'],
    ['thigh.L', 'left', 'leg'],
    ['Bip01 R Calf', 'right', 'leg'],
    ['leg_FR_2', 'right', 'leg'],
    ['mixamorig:RightToeBase', 'right', 'leg'],
    ['upperarm_l', 'left', 'arm'],
    ['Tail03', null, 'never-leg'],
    ['spine_02', null, 'none'],
  ])('%s → side %s, %s', (name, side, hint) => {
    expect(nameSide(name)).toBe(side);
    expect(nameHint(name)).toBe(hint);
  });

  it('splits camel case, digits and separators', () => {
    expect(nameTokens('mixamorig:LeftUpLeg_01')).toEqual(['mixamorig', 'left', 'up', 'leg', '01']);
  });
});

describe('checking an edited mapping against the skeleton', () => {
  it('accepts what detection proposed and names the joint of each problem', () => {
    const skeleton = skeletonOf(burrow);
    const legs = detectLegs(skeleton).legs;
    expect(legMappingProblems(skeleton, legs)).toEqual({});
    const skipping = [{ ...legs[0], joints: [legs[0].joints[0], legs[1].joints[1]] }];
    expect(legMappingProblems(skeleton, skipping)['legs.0.joints.1.joint']).toMatch(/"lower_FR" is not below "upper_FL"/);
  });
});
