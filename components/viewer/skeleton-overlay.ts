import * as THREE from 'three';
import type { LegMapping, LegSide, SkeletonJointSummary } from '../../schemas/characters';
import { colors } from '../../constants/theme';

/**
 * The skeleton drawn over the mesh (no depth test, so it shows through): every bone as a line, every joint as
 * a dot; bones and joints of a leg in its side's colour and drawn larger.
 */
export function skeletonOverlay(joints: SkeletonJointSummary[], legs: LegMapping[], sideColor: Record<LegSide, string>): THREE.Group {
  const legColor = new Map<number, THREE.Color>();
  for (const leg of legs) {
    const c = new THREE.Color(sideColor[leg.side]);
    for (const j of leg.joints) legColor.set(j.joint, c);
    legColor.set(leg.end, c);
  }
  const other = new THREE.Color(colors.graphite);
  const group = new THREE.Group();
  group.name = 'skeleton overlay';

  const bonePositions: number[] = [];
  const boneColors: number[] = [];
  joints.forEach((j, i) => {
    if (j.parent < 0) return;
    const p = joints[j.parent].position;
    const inLeg = legColor.has(i) && legColor.has(j.parent);
    const c = inLeg ? legColor.get(i)! : other;
    bonePositions.push(...p, ...j.position);
    boneColors.push(c.r, c.g, c.b, c.r, c.g, c.b);
  });
  const bones = new THREE.BufferGeometry();
  bones.setAttribute('position', new THREE.Float32BufferAttribute(bonePositions, 3));
  bones.setAttribute('color', new THREE.Float32BufferAttribute(boneColors, 3));
  const lines = new THREE.LineSegments(bones, new THREE.LineBasicMaterial({ vertexColors: true, depthTest: false, transparent: true }));
  lines.renderOrder = 10;
  group.add(lines);

  const dots = (indices: number[], size: number, colorOf: (i: number) => THREE.Color) => {
    const geometry = new THREE.BufferGeometry();
    geometry.setAttribute('position', new THREE.Float32BufferAttribute(indices.flatMap((i) => joints[i].position), 3));
    geometry.setAttribute('color', new THREE.Float32BufferAttribute(indices.flatMap((i) => colorOf(i).toArray()), 3));
    const points = new THREE.Points(geometry, new THREE.PointsMaterial({ size, sizeAttenuation: false, vertexColors: true, depthTest: false, transparent: true }));
    points.renderOrder = 11;
    return points;
  };
  const all = joints.map((_, i) => i);
  group.add(dots(all.filter((i) => !legColor.has(i)), 5, () => other));
  group.add(dots(all.filter((i) => legColor.has(i)), 9, (i) => legColor.get(i)!));
  return group;
}
