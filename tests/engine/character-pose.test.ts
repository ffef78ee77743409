/**
 * The character's own mesh posed from a trial: each demo character's .glb, loaded by three's GLTFLoader,
 * posed by components/viewer/character-pose.ts from a browser-side replay of the trial
 * (components/viewer/walk-replay.ts: forward kinematics of the joint angles the trial recorded, quantized, after
 * a round trip through the stored encoding; and, for trials stored without them, the trial loop run again). Three.js is the outside reference: the world position of every leg's end
 * joint, composed by three's Object3D world matrices (glTF 2.0 §3.5.3: world = parent · local) and the
 * skinned mesh's bone matrices (boneMatrix = world · inverse bind, glTF 2.0 §3.7.3.3), must equal the foot
 * position the trial recorded within 1 mm. Feet are on a stairs course so knees, hips and ankles all bend.
 */
import * as THREE from 'three';
import { GLTFLoader } from 'three/examples/jsm/loaders/GLTFLoader.js';
import { codeStairsCourse } from '../../engine/course';
import { rigFromCharacter } from '../../engine/gait/character-rig';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { runTrial } from '../../engine/gait/trial';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { importGltf } from '../../server/services/gltf-import';
import { mappingOf } from '../../engine/rig/leg-mapping';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { DEMO_DESIGNS } from '../../seeds/characters';
import { bindCharacter } from '../../components/viewer/character-pose';
import { REPLAY_TOLERANCE, replayFromRecord, replayTrial } from '../../components/viewer/walk-replay';
import { decodeSeries, encodeSeries } from '../../engine/gait/series-encoding';

interface Demo {
  name: string;
  glb: Uint8Array;
  rig: Rig;
  ends: number[];
}
const demos: Demo[] = [];

beforeAll(async () => {
  for (const design of DEMO_DESIGNS) {
    const glb = await buildCharacterGlb(design);
    const imported = await importGltf([{ originalname: `${design.name}.glb`, buffer: Buffer.from(glb) }]);
    const legs = imported.detection.legs.map(mappingOf);
    const rig = rigFromCharacter(imported.skeleton, legs, { name: design.name });
    demos.push({ name: design.name, glb, rig, ends: rig.legs.map((l) => legs.find((m) => m.name === l.name)!.end) });
  }
}, 60_000);

async function loadScene(glb: Uint8Array): Promise<THREE.Group> {
  const buffer = glb.buffer.slice(glb.byteOffset, glb.byteOffset + glb.byteLength) as ArrayBuffer;
  return (await new GLTFLoader().parseAsync(buffer, '')).scene;
}

describe('the character mesh posed from a trial replay', () => {
  it.each(DEMO_DESIGNS.flatMap((d) => [[d.name, 'recorded joint angles'] as const, [d.name, 'the trial loop run again'] as const]))('puts every end joint of %s on the recorded foot within 1 mm (from %s)', async (name, source) => {
    const demo = demos.find((d) => d.name === name)!;
    const course = codeStairsCourse(5, 'up', { leadIn: 2.5, leadOut: 2.5, cellSize: 0.04 });
    const setup = defaultLegSetup(demo.rig);
    const result = runTrial(demo.rig, setup, course, { duration: TRIAL_SECONDS });
    // What the browser gets: the series after its stored encoding.
    const series = decodeSeries(JSON.parse(JSON.stringify(encodeSeries(result.series))));
    expect(series.jointDofs).toBeGreaterThan(0);
    const replay = source === 'recorded joint angles' ? replayFromRecord(demo.rig, series)! : replayTrial(demo.rig, setup, course, series);
    expect(replay).not.toBeNull();
    expect(replay.length).toBe(series.length);
    expect(replay.footDeviation).toBeLessThan(REPLAY_TOLERANCE);

    const scene = await loadScene(demo.glb);
    const bound = bindCharacter(scene, demo.rig, replay.jointOffset);
    if (!bound.ok) throw new Error(bound.reason);
    const root = new THREE.Scene();
    root.add(bound.character.carrier);
    let skinned: THREE.SkinnedMesh | null = null;
    scene.traverse((o) => {
      if ((o as THREE.SkinnedMesh).isSkinnedMesh) skinned ??= o as THREE.SkinnedMesh;
    });
    const skeleton = (skinned as unknown as THREE.SkinnedMesh).skeleton;

    // A few frames spread over the walk, including the first and last.
    const frames = [0, Math.floor(series.length / 5), Math.floor(series.length / 2), Math.floor((4 * series.length) / 5), series.length - 1];
    let worst = 0;
    let moved = 0;
    const p = new THREE.Vector3();
    const m = new THREE.Matrix4();
    for (const k of frames) {
      bound.character.pose(replay, k);
      root.updateMatrixWorld(true);
      skeleton.update();
      demo.rig.legs.forEach((_, i) => {
        const end = demo.ends[i];
        // boneMatrices[end] = world · inverse bind; times the bind matrix gives the joint's world transform.
        m.fromArray(skeleton.boneMatrices!, 16 * end).multiply(new THREE.Matrix4().copy(skeleton.boneInverses[end]).invert());
        p.setFromMatrixPosition(m);
        const o = 3 * (k * series.legs + i);
        const d = Math.hypot(p.x - series.foot[o], p.y - series.foot[o + 1], p.z - series.foot[o + 2]);
        worst = Math.max(worst, d);
        // The same joint by its Object3D world matrix.
        const w = skeleton.bones[end].getWorldPosition(new THREE.Vector3());
        expect(w.distanceTo(p)).toBeLessThan(1e-5);
        if (k > 0) moved = Math.max(moved, Math.abs(series.foot[o + 2] - series.foot[3 * i + 2]));
      });
    }
    expect(worst).toBeLessThan(1e-3);
    // The walk went somewhere: a pose stuck at rest could not pass the check above except at frame 0.
    expect(moved).toBeGreaterThan(0.3);
  });

  it('refuses a scene without a skinned mesh with a reason', () => {
    const demo = demos[0];
    const bound = bindCharacter(new THREE.Group(), demo.rig, [0]);
    expect(bound.ok).toBe(false);
    if (!bound.ok) expect(bound.reason).toMatch(/no skinned mesh/);
  });

  it('reads series stored before joint angles were recorded, and replays them with the trial loop instead', () => {
    const demo = demos[0];
    const course = codeStairsCourse(5, 'up', { leadIn: 2.5, leadOut: 2.5, cellSize: 0.04 });
    const setup = defaultLegSetup(demo.rig);
    const encoded = encodeSeries(runTrial(demo.rig, setup, course, { duration: 3 }).series);
    const { jointDofs: _dofs, ...older } = encoded;
    const { jointAngles: _a, bodyFrame: _b, ...olderFields } = older.fields;
    const series = decodeSeries({ ...older, fields: olderFields });
    expect(series.jointDofs).toBe(0);
    expect(replayFromRecord(demo.rig, series)).toBeNull();
    // A field of the wrong size is refused by name.
    expect(() => decodeSeries({ ...encoded, fields: { ...encoded.fields, jointAngles: 'AAAA' } })).toThrow(/jointAngles must hold/);
  });
});
