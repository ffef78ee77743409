/**
 * Leg detection on a rest skeleton, by geometry and topology first, names as hints.
 *
 * A leg is a chain from where it leaves the body (a joint with several branches: pelvis, thorax,
 * withers) down to one of the lowest leaf joints, 2–5 joints long, hanging downward and off the
 * character's mirror plane. glTF 2.0 §3.4: +Y up, the front faces +Z, so +X is the character's left.
 */
import type { DetectedLeg, LegSide } from './leg-mapping';
import type { Skeleton } from './types';
import { chainLengths, jointChildren, jointWorldPositions } from './skeleton-world';
import { isPassengerName, nameHint, nameSide } from './skeleton-names';
import { formatLength, type LengthUnit } from './skeleton-scale';
import { findAnkle, proposedLegJoints } from './skeleton-leg-dofs';

export const MIN_LEG_JOINTS = 2;
export const MAX_LEG_JOINTS = 5;

/** Feet lie in the lowest fifth of the skeleton's height (common practice, no source). */
const FOOT_BAND = 0.2;
/** Below this share of the height a branching joint is a foot with toes, not the body. */
const FOOT_CLUSTER_BAND = 0.3;
/** A chain must drop at least this share of its length from its first joint to its end. */
const MIN_DROP = 0.25;
/** Chains staying this close to the mirror plane (share of the skeleton's diagonal) are midline parts: tails, not legs. */
const MIDLINE = 0.04;
/** Mirror partners' joints match within this share of their reach. */
const MIRROR_TOLERANCE = 0.15;

export interface RejectedChain {
  joints: number[];
  reason: string;
}

export interface LegDetection {
  legs: DetectedLeg[];
  /** Candidate chains that were not taken for legs, and why (shown in the import report). */
  rejected: RejectedChain[];
  /** True when the names say the character faces −Z, against the glTF convention. */
  facesMinusZ: boolean;
}

interface Candidate {
  path: number[];
  side: LegSide;
  nameSide: 'left' | 'right' | null;
  reach: number;
  footHeight: number;
  drop: number;
  names: ReturnType<typeof nameHint>;
  mirrorOf: number | null;
  evidence: string[];
}

interface Frame {
  positions: Float64Array;
  children: number[][];
  minY: number;
  height: number;
  centreX: number;
  diagonal: number;
}

function frameOf(skeleton: Skeleton): Frame {
  const positions = jointWorldPositions(skeleton);
  const lo = [Infinity, Infinity, Infinity];
  const hi = [-Infinity, -Infinity, -Infinity];
  for (let j = 0; j < skeleton.joints.length; j++) {
    for (let a = 0; a < 3; a++) {
      lo[a] = Math.min(lo[a], positions[3 * j + a]);
      hi[a] = Math.max(hi[a], positions[3 * j + a]);
    }
  }
  const diagonal = Math.hypot(hi[0] - lo[0], hi[1] - lo[1], hi[2] - lo[2]);
  return {
    positions,
    children: jointChildren(skeleton),
    minY: lo[1],
    height: Math.max(hi[1] - lo[1], 1e-9),
    centreX: (lo[0] + hi[0]) / 2,
    diagonal: Math.max(diagonal, 1e-9),
  };
}

const y = (f: Frame, j: number) => f.positions[3 * j + 1];
const x = (f: Frame, j: number) => f.positions[3 * j];

/** Highest joint of the subtree under `j`. */
function subtreeTop(f: Frame, j: number): number {
  let top = y(f, j);
  const stack = [j];
  while (stack.length) {
    const k = stack.pop()!;
    top = Math.max(top, y(f, k));
    stack.push(...f.children[k]);
  }
  return top;
}

/** A branching joint low down whose other branches stay low is a foot with several toes. */
function isFootCluster(f: Frame, j: number, via: number): boolean {
  if (y(f, j) - f.minY > FOOT_CLUSTER_BAND * f.height) return false;
  return f.children[j].every((c) => c === via || subtreeTop(f, c) <= y(f, j) + 0.05 * f.height);
}

/** Distance of joint p from the segment a → b, as a share of the segment's length. */
function offSegment(f: Frame, p: number, a: number, b: number): number {
  const P = f.positions;
  const d = [P[3 * b] - P[3 * a], P[3 * b + 1] - P[3 * a + 1], P[3 * b + 2] - P[3 * a + 2]];
  const v = [P[3 * p] - P[3 * a], P[3 * p + 1] - P[3 * a + 1], P[3 * p + 2] - P[3 * a + 2]];
  const l2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
  if (!(l2 > 0)) return Infinity;
  const t = Math.max(0, Math.min(1, (v[0] * d[0] + v[1] * d[1] + v[2] * d[2]) / l2));
  return Math.hypot(v[0] - t * d[0], v[1] - t * d[1], v[2] - t * d[2]) / Math.sqrt(l2);
}

/** A bone that lies on a limb segment (within this share of its length) rides along with it (common practice, no source). */
const ON_SEGMENT = 0.1;

/**
 * Whether every other branch of joint `j` (besides the one towards `via`) is a passenger: a single twist, roll or
 * helper bone lying along the segment j → via. Such a joint is still inside the limb, not where it leaves the body.
 */
function onlyPassengersBeside(skeleton: Skeleton, f: Frame, j: number, via: number): boolean {
  return f.children[j].every((c) => c === via || (f.children[c].length === 0 && isPassengerName(skeleton.joints[c].name) && offSegment(f, c, j, via) <= ON_SEGMENT));
}

/** The path without its passengers: twist or roll bones inside the limb that lie on the segment between their neighbours. */
function withoutPassengers(skeleton: Skeleton, f: Frame, path: number[]): number[] {
  const out = [path[0]];
  for (let k = 1; k < path.length - 1; k++) {
    const j = path[k];
    if (isPassengerName(skeleton.joints[j].name) && offSegment(f, j, out[out.length - 1], path[k + 1]) <= ON_SEGMENT) continue;
    out.push(j);
  }
  if (path.length > 1) out.push(path[path.length - 1]);
  return out;
}

/**
 * A foot that rolls over toe bones (ankle → ball → toe tip) ends at the ball: the ball of the foot is where it
 * pushes off, and a bending toe joint at the end of the chain lets the solver fold the sole into the ground
 * (measured on the exporter corpus: footing score 0 with the toe hinge, 30 ended at the ball, same defaults).
 */
function endAtBall(f: Frame, path: number[]): number[] {
  const ankle = findAnkle(f.positions, path);
  return ankle >= 0 && path.length - 1 - ankle >= 2 ? path.slice(0, ankle + 2) : path;
}

/** Walks up from a leaf to where the chain leaves the body; the body joint itself is not part of the chain. */
function chainUpFrom(skeleton: Skeleton, f: Frame, leaf: number): number[] {
  const path = [leaf];
  let via = leaf;
  let j = skeleton.joints[leaf].parent;
  while (j >= 0) {
    if (f.children[j].length >= 2 && !isFootCluster(f, j, via) && !onlyPassengersBeside(skeleton, f, j, via)) return path;
    if (skeleton.joints[j].parent < 0) return path; // a root joint is the body
    path.unshift(j);
    via = j;
    j = skeleton.joints[j].parent;
    if (path.length > skeleton.joints.length) break;
  }
  return path;
}

function judge(skeleton: Skeleton, f: Frame, path: number[], unit: LengthUnit): Candidate | RejectedChain {
  const describeHeight = (h: number) => formatLength(h, unit);
  const names = path.map((j) => nameHint(skeleton.joints[j].name));
  if (path.length < MIN_LEG_JOINTS) return { joints: path, reason: 'a single joint leaving the body, too short for a leg' };
  if (path.length > MAX_LEG_JOINTS) return { joints: path, reason: `${path.length} joints long, more than a leg's ${MAX_LEG_JOINTS}; more like a tail or tentacle` };
  const first = path[0];
  const end = path[path.length - 1];
  const { total } = chainLengths(f.positions, path);
  const drop = y(f, first) - y(f, end);
  if (total <= 1e-9 || drop < MIN_DROP * total) return { joints: path, reason: 'does not hang downward from where it leaves the body' };
  const midline = MIDLINE * f.diagonal;
  if (path.every((j) => Math.abs(x(f, j) - f.centreX) <= midline)) return { joints: path, reason: 'runs along the mirror plane, like a tail' };
  if (names.includes('never-leg')) return { joints: path, reason: `named like a part that is not a leg ("${skeleton.joints[path[names.indexOf('never-leg')]].name}")` };
  const sides = path.map((j) => nameSide(skeleton.joints[j].name)).filter((s): s is 'left' | 'right' => s !== null);
  const declared = sides.length && sides.every((s) => s === sides[0]) ? sides[0] : null;
  const footHeight = y(f, end) - f.minY;
  const hint = names.includes('leg') ? 'leg' : names.includes('arm') ? 'arm' : 'none';
  const evidence = [`end ${describeHeight(footHeight)} above the lowest joint`, `hangs ${describeHeight(drop)} over a length of ${describeHeight(total)}`];
  if (hint === 'leg') evidence.push('named like a leg');
  if (hint === 'arm') evidence.push('named like an arm');
  return {
    path,
    side: x(f, first) > f.centreX ? 'left' : 'right',
    nameSide: declared,
    reach: total,
    footHeight,
    drop,
    names: hint,
    mirrorOf: null,
    evidence,
  };
}

function mirrorCost(f: Frame, a: Candidate, b: Candidate): number {
  if (a.side === b.side) return Infinity;
  const d = (ja: number, jb: number) =>
    Math.hypot(2 * f.centreX - x(f, ja) - x(f, jb), y(f, ja) - y(f, jb), f.positions[3 * ja + 2] - f.positions[3 * jb + 2]);
  const cost = d(a.path[0], b.path[0]) + d(a.path[a.path.length - 1], b.path[b.path.length - 1]);
  return cost <= MIRROR_TOLERANCE * (a.reach + b.reach) ? cost : Infinity;
}

/** Pairs left and right legs greedily by how well one mirrors the other across the plane x = centre. */
function pairByMirror(f: Frame, legs: Candidate[]): void {
  const pairs: { i: number; j: number; cost: number }[] = [];
  for (let i = 0; i < legs.length; i++) {
    for (let j = i + 1; j < legs.length; j++) {
      const cost = mirrorCost(f, legs[i], legs[j]);
      if (Number.isFinite(cost)) pairs.push({ i, j, cost });
    }
  }
  pairs.sort((p, q) => p.cost - q.cost || p.i - q.i || p.j - q.j);
  for (const { i, j } of pairs) {
    if (legs[i].mirrorOf !== null || legs[j].mirrorOf !== null) continue;
    legs[i].mirrorOf = j;
    legs[j].mirrorOf = i;
  }
}

const ROW_NAMES: Record<number, string[]> = {
  1: [''],
  2: ['front', 'hind'],
  3: ['front', 'middle', 'hind'],
};

function rowName(row: number, rows: number): string {
  if (ROW_NAMES[rows]) return ROW_NAMES[rows][row];
  if (row === 0) return 'front';
  if (row === rows - 1) return 'hind';
  return `row ${row + 1}`;
}

const SIDE_WORD: Record<LegSide, string> = { left: 'Left', right: 'Right', centre: 'Centre' };

/** Names legs by side and row, front to back ("Left front", "Right hind"; "Left leg" on a biped). */
function nameLegs(f: Frame, legs: Candidate[], forward: 1 | -1): string[] {
  const z = (c: Candidate) => forward * f.positions[3 * c.path[0] + 2];
  // A row is a mirrored pair or a lone leg, placed by its most forward member.
  const rows: number[][] = [];
  legs.forEach((leg, i) => {
    if (leg.mirrorOf !== null && leg.mirrorOf < i) return;
    rows.push(leg.mirrorOf !== null ? [i, leg.mirrorOf] : [i]);
  });
  rows.sort((a, b) => Math.max(...b.map((i) => z(legs[i]))) - Math.max(...a.map((i) => z(legs[i]))));
  const names: string[] = new Array(legs.length);
  rows.forEach((row, r) => {
    for (const i of row) {
      const place = rowName(r, rows.length);
      names[i] = place ? `${SIDE_WORD[legs[i].side]} ${place}` : `${SIDE_WORD[legs[i].side]} leg`;
    }
  });
  // Two lone legs on one side in one row would share a name; number any repeats.
  const seen = new Map<string, number>();
  return names.map((n) => {
    const count = (seen.get(n) ?? 0) + 1;
    seen.set(n, count);
    return count > 1 ? `${n} ${count}` : n;
  });
}

function confidence(f: Frame, c: Candidate): number {
  const ground = 1 - 0.5 * Math.min(1, c.footHeight / (FOOT_BAND * f.height));
  const hang = Math.min(1, c.drop / (0.6 * c.reach));
  const length = c.path.length >= 3 ? 1 : 0.6;
  const paired = c.mirrorOf !== null ? 1 : 0.5;
  const named = c.names === 'leg' ? 1 : c.names === 'arm' ? 0.3 : 0.7;
  const sideAgrees = c.nameSide === null || c.nameSide === c.side ? 1 : 0.5;
  const score = 0.3 * ground + 0.2 * hang + 0.1 * length + 0.25 * paired + 0.15 * named;
  return Math.round(score * sideAgrees * 100) / 100;
}

export interface DetectOptions {
  /** The unit the skeleton's lengths are in, for the evidence (metres unless the file is read as another). */
  unit?: LengthUnit;
}

/** Finds the legs of a rest skeleton. Deterministic: the same skeleton gives the same legs in the same order. */
export function detectLegs(skeleton: Skeleton, options: DetectOptions = {}): LegDetection {
  const unit = options.unit ?? 'metres';
  const n = skeleton.joints.length;
  if (n === 0) return { legs: [], rejected: [], facesMinusZ: false };
  const f = frameOf(skeleton);
  const rejected: RejectedChain[] = [];
  const candidates: Candidate[] = [];
  const taken = new Set<number>();

  const leaves: number[] = [];
  for (let j = 0; j < n; j++) {
    if (f.children[j].length === 0 && y(f, j) - f.minY <= FOOT_BAND * f.height) leaves.push(j);
  }
  // Lowest leaves first, so a foot with several toes keeps its lowest toe.
  leaves.sort((a, b) => y(f, a) - y(f, b) || a - b);
  for (const leaf of leaves) {
    const path = endAtBall(f, withoutPassengers(skeleton, f, chainUpFrom(skeleton, f, leaf)));
    if (path.some((j) => taken.has(j))) continue;
    const verdict = judge(skeleton, f, path, unit);
    if ('reason' in verdict) {
      rejected.push(verdict);
      continue;
    }
    path.forEach((j) => taken.add(j));
    candidates.push(verdict);
  }

  // Names that consistently contradict the geometric side mean the character faces −Z.
  let agree = 0;
  let disagree = 0;
  for (const c of candidates) {
    if (c.nameSide === null) continue;
    if (c.nameSide === c.side) agree++;
    else disagree++;
  }
  const facesMinusZ = disagree > agree;
  if (facesMinusZ) for (const c of candidates) c.side = c.side === 'left' ? 'right' : 'left';

  // Legs ordered front to back, then left before right, for a stable list.
  const forward = facesMinusZ ? -1 : 1;
  candidates.sort((a, b) => {
    const dz = forward * (f.positions[3 * b.path[0] + 2] - f.positions[3 * a.path[0] + 2]);
    if (Math.abs(dz) > 1e-6) return dz;
    return a.side === b.side ? a.path[0] - b.path[0] : a.side === 'left' ? -1 : 1;
  });
  pairByMirror(f, candidates);
  const names = nameLegs(f, candidates, forward);

  const legs: DetectedLeg[] = candidates.map((c, i) => {
    const evidence = [...c.evidence];
    if (c.mirrorOf !== null) evidence.push(`mirrors ${names[c.mirrorOf]}`);
    else evidence.push('no mirror partner');
    if (c.nameSide !== null && c.nameSide !== c.side) evidence.push(`named ${c.nameSide} but sits on the ${c.side}`);
    return {
      name: names[i],
      side: c.side,
      joints: proposedLegJoints(f.positions, c.path),
      end: c.path[c.path.length - 1],
      confidence: confidence(f, c),
      mirrorOf: c.mirrorOf,
      evidence,
    };
  });
  return { legs, rejected, facesMinusZ };
}

/** The joint path of a leg mapping, hip → end. */
export function legPath(leg: { joints: readonly { joint: number }[]; end: number }): number[] {
  return [...leg.joints.map((j) => j.joint), leg.end];
}
