/**
 * The browser half of `npm run bench:view` (bundled by tests/bench/view.ts with esbuild and run in headless
 * chromium): pose 1 and 4 demo characters from their trials frame after frame and time the JavaScript of a
 * frame (posing, three's world matrices, the skinned meshes' bone matrices), never the GPU. Peers in the same
 * run: the same scene's matrix update with no posing (what three does every frame anyway), and the stick figure.
 */
import * as THREE from 'three';
import { GLTFLoader } from 'three/examples/jsm/loaders/GLTFLoader.js';
import { decodeSeries } from '../../engine/gait/series-encoding';
import type { Rig } from '../../engine/gait/rig';
import { bindCharacter, type PosedCharacter } from '../../components/viewer/character-pose';
import { replayFromRecord, type WalkReplay } from '../../components/viewer/walk-replay';
import { createStickFigure } from '../../components/trial/walk-scene';
import { poseOfSample } from '../../components/trial/series-pose';

export interface BenchInput {
  characters: { name: string; glb: string; rig: Rig; series: unknown }[];
  frames: number;
}

function bytesOf(b64: string): ArrayBuffer {
  const s = atob(b64);
  const out = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = s.charCodeAt(i);
  return out.buffer;
}

interface Loaded {
  name: string;
  replay: WalkReplay;
  character: PosedCharacter;
  skeletons: THREE.Skeleton[];
  rig: Rig;
  series: ReturnType<typeof decodeSeries>;
}

async function load(c: BenchInput['characters'][number]): Promise<Loaded> {
  const series = decodeSeries(c.series);
  const replay = replayFromRecord(c.rig, series);
  if (!replay) throw new Error(`${c.name}: the series holds no joint angles`);
  const gltf = await new GLTFLoader().parseAsync(bytesOf(c.glb), '');
  const bound = bindCharacter(gltf.scene, c.rig, replay.jointOffset);
  if (!bound.ok) throw new Error(`${c.name}: ${bound.reason}`);
  const skeletons: THREE.Skeleton[] = [];
  gltf.scene.traverse((o) => {
    const m = o as THREE.SkinnedMesh;
    if (m.isSkinnedMesh && !skeletons.includes(m.skeleton)) skeletons.push(m.skeleton);
  });
  return { name: c.name, replay, character: bound.character, skeletons, rig: c.rig, series };
}

export const FRAMES_PER_READING = 100;

/** Median of per-frame times (ms) over `frames` frames of `frame(k)`, after a warm-up. */
function timePerFrame(frames: number, frame: (k: number) => void): { median: number; p95: number } {
  for (let k = 0; k < 200; k++) frame(k);
  const times: number[] = [];
  for (let k = 0; k < frames; k++) {
    const t0 = performance.now();
    // Many frames per reading: the browser clock is coarse (0.1 ms in chromium without cross-origin isolation).
    for (let r = 0; r < FRAMES_PER_READING; r++) frame(k * FRAMES_PER_READING + r);
    times.push((performance.now() - t0) / FRAMES_PER_READING);
  }
  times.sort((a, b) => a - b);
  return { median: times[Math.floor(times.length / 2)], p95: times[Math.floor(times.length * 0.95)] };
}

export async function runBench(input: BenchInput) {
  const loaded = await Promise.all(input.characters.map(load));
  const results: Record<string, { median: number; p95: number }> = {};
  for (const count of [1, 4]) {
    const cast = Array.from({ length: count }, (_, i) => loaded[i % loaded.length]);
    // Four walkers need four scenes of their own (a three object hangs in one scene): load again for repeats.
    const actors = count === 1 ? cast : await Promise.all(cast.map((_, i) => load(input.characters[i % input.characters.length])));
    const scene = new THREE.Scene();
    for (const a of actors) scene.add(a.character.carrier);
    const figures = actors.map((a) => createStickFigure(a.rig));
    const sticks = new THREE.Scene();
    for (const f of figures) sticks.add(f.skeleton, f.targets);
    results[`pose ${count}`] = timePerFrame(input.frames, (k) => {
      for (const a of actors) a.character.pose(a.replay, k % a.replay.length);
      scene.updateMatrixWorld();
      for (const a of actors) for (const s of a.skeletons) s.update();
    });
    results[`no posing ${count}`] = timePerFrame(input.frames, () => {
      scene.updateMatrixWorld();
      for (const a of actors) for (const s of a.skeletons) s.update();
    });
    results[`stick ${count}`] = timePerFrame(input.frames, (k) => {
      actors.forEach((a, i) => figures[i].update(poseOfSample(a.series, k % a.series.length)));
      sticks.updateMatrixWorld();
    });
  }
  return { results, characters: loaded.map((l) => `${l.name} (${l.rig.legs.length} legs, ${l.replay.joints} leg joints)`) };
}

(globalThis as unknown as { runBench: typeof runBench }).runBench = runBench;
