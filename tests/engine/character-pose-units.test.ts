/**
 * The mesh of a character authored in centimetres, posed over its fixed (metre) rig: components/viewer/character-pose.ts
 * reads the unit fix back from the rig's lengths against the bones', so each leg's end joint, composed by three.js's
 * own world matrices (the reference: glTF 2.0 §3.5.3 world = parent · local; §3.7.3.3 boneMatrix = world · inverse
 * bind), lands on the foot the trial recorded within 1 mm, as it does for a file in metres.
 */
import * as THREE from 'three';
import { GLTFLoader } from 'three/examples/jsm/loaders/GLTFLoader.js';
import { codeStairsCourse } from '../../engine/course';
import { rigFromCharacter } from '../../engine/gait/character-rig';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { runTrial } from '../../engine/gait/trial';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { importGltf } from '../../server/services/gltf-import';
import { mappingOf } from '../../engine/rig/leg-mapping';
import { scaledSkeleton } from '../../engine/rig/skeleton-scale';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { wicket } from '../../seeds/characters';
import { bindCharacter } from '../../components/viewer/character-pose';
import { replayFromRecord } from '../../components/viewer/walk-replay';
import { decodeSeries, encodeSeries } from '../../engine/gait/series-encoding';
import { scaledDesign } from '../fixtures/gltf/exporter-corpus';

jest.setTimeout(120_000);

it('poses a centimetre file over its metre rig with every end joint on the recorded foot within 1 mm', async () => {
  const glb = await buildCharacterGlb(scaledDesign(wicket, 100));
  const imported = await importGltf([{ originalname: 'wicket-cm.glb', buffer: Buffer.from(glb) }]);
  const legs = imported.detection.legs.map(mappingOf);
  const rig = rigFromCharacter(scaledSkeleton(imported.skeleton, 0.01), legs, { name: 'Wicket in centimetres' });
  const ends = rig.legs.map((l) => legs.find((m) => m.name === l.name)!.end);
  const course = codeStairsCourse(5, 'up', { leadIn: 2.5, leadOut: 2.5, cellSize: 0.04 });
  const result = runTrial(rig, defaultLegSetup(rig), course, { duration: TRIAL_SECONDS });
  const series = decodeSeries(JSON.parse(JSON.stringify(encodeSeries(result.series))));
  const replay = replayFromRecord(rig, series)!;

  const scene = (await new GLTFLoader().parseAsync(glb.buffer.slice(glb.byteOffset, glb.byteOffset + glb.byteLength) as ArrayBuffer, '')).scene;
  const bound = bindCharacter(scene, rig, replay.jointOffset);
  if (!bound.ok) throw new Error(bound.reason);
  expect(scene.scale.x).toBeCloseTo(0.01, 9);
  const root = new THREE.Scene();
  root.add(bound.character.carrier);
  let skinned: THREE.SkinnedMesh | null = null;
  scene.traverse((o) => {
    if ((o as THREE.SkinnedMesh).isSkinnedMesh) skinned ??= o as THREE.SkinnedMesh;
  });
  const skeleton = (skinned as unknown as THREE.SkinnedMesh).skeleton;
  let worst = 0;
  const m = new THREE.Matrix4();
  const p = new THREE.Vector3();
  for (const k of [0, Math.floor(series.length / 3), Math.floor((2 * series.length) / 3), series.length - 1]) {
    bound.character.pose(replay, k);
    root.updateMatrixWorld(true);
    skeleton.update();
    rig.legs.forEach((_, i) => {
      m.fromArray(skeleton.boneMatrices!, 16 * ends[i]).multiply(new THREE.Matrix4().copy(skeleton.boneInverses[ends[i]]).invert());
      p.setFromMatrixPosition(m);
      const o = 3 * (k * series.legs + i);
      worst = Math.max(worst, Math.hypot(p.x - series.foot[o], p.y - series.foot[o + 1], p.z - series.foot[o + 2]));
    });
  }
  expect(worst).toBeLessThan(1e-3);
});
