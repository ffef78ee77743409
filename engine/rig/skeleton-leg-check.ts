/**
 * Checks a leg mapping against the skeleton it names: joints exist, each leg runs down one path of the
 * hierarchy (every joint below the previous one, the end joint below the last), and no joint serves two legs.
 * Returns messages keyed like zod's field paths ("legs.0.joints.1.joint"), empty when all is well.
 */
import type { LegMapping } from './leg-mapping';
import type { Skeleton } from './types';
import { isDescendant } from './skeleton-world';

export function legMappingProblems(skeleton: Skeleton, legs: readonly LegMapping[]): Record<string, string> {
  const problems: Record<string, string> = {};
  const n = skeleton.joints.length;
  const usedBy = new Map<number, string>();
  const name = (j: number) => `"${skeleton.joints[j].name}"`;
  legs.forEach((leg, l) => {
    const path = [...leg.joints.map((j) => j.joint), leg.end];
    const keys = [...leg.joints.map((_, k) => `legs.${l}.joints.${k}.joint`), `legs.${l}.end`];
    for (let k = 0; k < path.length; k++) {
      const j = path[k];
      if (j >= n) {
        problems[keys[k]] = `The skeleton has no joint ${j}; it has ${n}.`;
        return;
      }
      if (k > 0 && !isDescendant(skeleton, j, path[k - 1])) {
        problems[keys[k]] = `${name(j)} is not below ${name(path[k - 1])} in the skeleton; a leg runs down one branch.`;
        return;
      }
      const other = usedBy.get(j);
      if (other !== undefined) {
        problems[keys[k]] = `${name(j)} is already part of ${other}.`;
        return;
      }
    }
    path.forEach((j) => usedBy.set(j, leg.name));
  });
  return problems;
}
