/**
 * What real exporters and rigs put in a skeleton that a walking rig must know about: twist and roll bones, toe
 * bones, IK-target and pole helpers, a root bone on the ground, digitigrade legs, non-uniform bind scale. Each
 * finding says how Treadle handles it and what the person can do, and names the legs it concerns, so the legs
 * form can show it beside them.
 */
import { z } from 'zod';
import type { DetectedLeg } from './leg-mapping';
import type { Skeleton } from './types';
import { isPassengerName, nameTokens } from './skeleton-names';
import { findAnkle, bendAxis } from './skeleton-leg-dofs';
import { formatLength, type LengthUnit } from './skeleton-scale';

/** One finding of Treadle's own import (unit scale, unpaired legs, rig quirks, …). */
export const importNoteSchema = z.object({
  code: z.string(),
  severity: z.enum(['warning', 'info']),
  message: z.string(),
  /** Names of the legs the finding concerns, shown beside them in the legs form. */
  legs: z.array(z.string()).optional(),
});
export type ImportNote = z.infer<typeof importNoteSchema>;

/** Words of bones that steer an IK solver or a rig's controls rather than deform the mesh (common practice, no source). */
const HELPER_WORDS = new Set(['ik', 'pole', 'target', 'ctrl', 'control', 'goal', 'locator', 'aim']);

/** Non-uniform when the largest and smallest scale components differ by more than this share. */
const NON_UNIFORM = 1e-3;
/** A root bone this close to the ground (share of the skeleton's height) is a game-engine ground root (common practice, no source). */
const GROUND_BAND = 0.1;
/** Most names listed in one finding; the rest are counted. */
const LISTED = 6;

function list(names: string[]): string {
  const shown = names.slice(0, LISTED).join(', ');
  return names.length > LISTED ? `${shown} and ${names.length - LISTED} more` : shown;
}

function legPathOf(leg: DetectedLeg): number[] {
  return [...leg.joints.map((j) => j.joint), leg.end];
}

export interface QuirkInput {
  skeleton: Skeleton;
  /** Rest world positions, x y z per joint, in the skeleton's units. */
  positions: ArrayLike<number>;
  legs: readonly DetectedLeg[];
  unit?: LengthUnit;
}

/** The rig quirks of a skeleton with its detected legs, each with what Treadle does about it. */
export function rigQuirks({ skeleton, positions, legs, unit = 'metres' }: QuirkInput): ImportNote[] {
  const notes: ImportNote[] = [];
  const joints = skeleton.joints;
  const name = (j: number) => joints[j].name;
  const inLeg = new Set<number>();
  for (const leg of legs) for (const j of legPathOf(leg)) inLeg.add(j);
  const legOfJoint = (j: number): string | null => {
    for (const leg of legs) {
      const path = legPathOf(leg);
      // A joint belongs to a leg when it hangs below the leg's first joint and above (or at) its end.
      for (let k = j; k >= 0; k = joints[k].parent) if (k === path[0]) return leg.name;
    }
    return null;
  };

  let minY = Infinity;
  let maxY = -Infinity;
  for (let j = 0; j < joints.length; j++) {
    minY = Math.min(minY, positions[3 * j + 1]);
    maxY = Math.max(maxY, positions[3 * j + 1]);
  }
  const height = Math.max(maxY - minY, 1e-9);

  const twist = joints.map((_, j) => j).filter((j) => !inLeg.has(j) && isPassengerName(name(j)) && legOfJoint(j) !== null);
  if (twist.length) {
    const legNames = [...new Set(twist.map((j) => legOfJoint(j)!))];
    notes.push({
      code: 'twist_bones',
      severity: 'info',
      message: `Twist and roll bones in the legs (${list(twist.map(name))}) ride along with their limb: Treadle bends the hip, knee and ankle around them and leaves them at rest. Nothing to do; if a leg starts below its hip, pick the hip in the legs form.`,
      legs: legNames,
    });
  }

  const helpers = joints.map((_, j) => j).filter((j) => !inLeg.has(j) && nameTokens(name(j)).some((t) => HELPER_WORDS.has(t)));
  if (helpers.length) {
    notes.push({
      code: 'helper_bones',
      severity: 'info',
      message: `IK-target and pole helper bones (${list(helpers.map(name))}) steer a solver in your engine; they are not legs, and Treadle leaves them out of walking. Nothing to do.`,
    });
  }

  joints.forEach((j, i) => {
    if (j.parent >= 0 || positions[3 * i + 1] - minY > GROUND_BAND * height) return;
    const hasBody = joints.some((k) => k.parent === i);
    if (!hasBody) return;
    notes.push({
      code: 'ground_root',
      severity: 'info',
      message: `The root bone "${j.name}" sits on the ground (${formatLength(positions[3 * i + 1] - minY, unit)} above the lowest joint), below the hips, as game-engine rigs place it. Treadle starts the legs at the hips and places the body by them, not by the root. Nothing to do.`,
    });
  });

  for (const leg of legs) {
    const path = legPathOf(leg);
    const ankle = findAnkle(positions, path);
    const toes = ankle >= 0 ? path.slice(ankle + 1, path.length - 1) : [];
    const beyond = joints.map((_, j) => j).filter((j) => joints[j].parent === leg.end);
    if (toes.length) {
      notes.push({
        code: 'toe_bones',
        severity: 'info',
        message: `${leg.name} ends in toe bones: ${list(toes.map(name))} bend${toes.length > 1 ? '' : 's'} as a hinge for toe-off and ${name(leg.end)} is the sole point. If the feet fold into the ground in trials, end the leg at ${name(toes[0])} in the legs form.`,
        legs: [leg.name],
      });
    } else if (ankle === path.length - 2 && beyond.length) {
      notes.push({
        code: 'toe_bones',
        severity: 'info',
        message: `${leg.name} ends at the ball of its foot, ${name(leg.end)}: Treadle plants it there and leaves the toe bone${beyond.length > 1 ? 's' : ''} beyond it (${list(beyond.map(name))}) at rest, since a bending toe at the end of a leg lets the sole fold into the ground. To plant the toe tip instead, set the leg's end to it in the legs form.`,
        legs: [leg.name],
      });
    }
    // Digitigrade: two hinges above the foot bending opposite ways (knee forward, hock back), standing on the toes.
    const hinges = leg.joints.map((j, k) => ({ j, k })).filter(({ j, k }) => j.dof === 'hinge' && (ankle < 0 || k < ankle));
    for (let h = 1; h < hinges.length; h++) {
      const a = bendAxis(positions, path, hinges[h - 1].k);
      const b = bendAxis(positions, path, hinges[h].k);
      const opposite = a.bend > 0.05 && b.bend > 0.05 && a.axis[0] * b.axis[0] + a.axis[1] * b.axis[1] + a.axis[2] * b.axis[2] < 0;
      if (!opposite) continue;
      notes.push({
        code: 'digitigrade',
        severity: 'info',
        message: `${leg.name} is digitigrade: it stands on its toes, and ${name(hinges[h].j.joint)} bends the other way from ${name(hinges[h - 1].j.joint)}. Treadle bends each about its own axis, from its rest angle. If a trial shows ${name(hinges[h].j.joint)} folding the wrong way, narrow its limits in the legs form.`,
        legs: [leg.name],
      });
      break;
    }
  }

  // A leg of one segment turns only at its hip: its foot keeps one distance from it (measured on the exporter
  // corpus: a six-legged crawler of single segments misses its reach at nearly every touchdown on flat ground).
  const single = legs.filter((l) => l.joints.length === 1);
  if (single.length) {
    const l = single[0];
    notes.push({
      code: 'single_segment_leg',
      severity: 'warning',
      message: `${single.length > 1 ? `${single.length} legs are` : `${l.name} is`} a single segment (like ${name(l.joints[0].joint)} → ${name(l.end)}): turning only at the hip, the foot keeps one distance from it and meets flat ground only on a circle around the hip, so trials count reach misses where the planned foothold is off that circle. If the rig has a joint partway along, add it as a knee in the legs form; otherwise keep the stride short and the step height low in the leg setup.`,
      legs: single.map((x) => x.name),
    });
  }

  const stretched = joints
    .map((j, i) => ({ i, s: j.scale }))
    .filter(({ s }) => {
      const hi = Math.max(Math.abs(s[0]), Math.abs(s[1]), Math.abs(s[2]));
      const lo = Math.min(Math.abs(s[0]), Math.abs(s[1]), Math.abs(s[2]));
      return hi > 0 && (hi - lo) / hi > NON_UNIFORM;
    })
    .map(({ i }) => i);
  if (stretched.length) {
    const legNames = [...new Set(stretched.map(legOfJoint).filter((l): l is string => l !== null))];
    notes.push({
      code: 'non_uniform_scale',
      severity: 'warning',
      message: `The bind pose scales ${list(stretched.map(name))} unevenly. Treadle composes it exactly as glTF defines (the joints stand where three.js puts them) and walks those positions, but engines that do not pass non-uniform scale down a skeleton may place the feet elsewhere. If your engine shows the legs differently, apply the scale in your exporter and upload again.`,
      ...(legNames.length ? { legs: legNames } : {}),
    });
  }
  return notes;
}
