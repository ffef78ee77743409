import { useCallback, useEffect, useRef } from 'react';
import { Platform, Pressable, StyleSheet, Text, View } from 'react-native';
import { GLView, type ExpoWebGLRenderingContext } from 'expo-gl';
import * as THREE from 'three';
import { GLTFLoader } from 'three/examples/jsm/loaders/GLTFLoader.js';
import type { Heightfield } from '../../engine/course/heightfield';
import type { Rig } from '../../engine/gait/rig';
import type { TrialSeries } from '../../engine/gait/series';
import type { StumbleEvent } from '../../engine/metrics/trial-metrics';
import { colors, fonts, radius, space, touchTarget } from '../../constants/theme';
import { poseOfSample } from '../trial/series-pose';
import { createCourseScene, createStickFigure, type StickFigure } from '../trial/walk-scene';
import { bindCharacter, type PosedCharacter } from './character-pose';
import { createFollowCamera, WALK_FOV, type FollowCamera } from './follow-camera';
import { useOrbitGestures } from './gestures';
import { createWalkMarks, type WalkMarks } from './walk-marks';
import type { WalkReplay } from './walk-replay';
import { useDrawLoop } from './useDrawLoop';

/** One walker on the stage: its rig and series, the replay that poses its mesh, and the mesh's bytes. */
export interface StageWalker {
  key: string;
  label: string;
  rig: Rig;
  series: TrialSeries;
  /** A finished replay that matches the series, or null (the stick figure is drawn from the series alone). */
  replay: WalkReplay | null;
  events: readonly StumbleEvent[];
  /** The character's .glb, or null while it loads or when there is none. */
  mesh: ArrayBuffer | null;
  /** Drawn see-through over the first walker. */
  ghost?: boolean;
}

/** Where the mesh of a walker stands: shown, waiting for bytes or replay, or not usable (with the reason). */
export type MeshStatus = { state: 'waiting' } | { state: 'shown' } | { state: 'none'; reason: string };

/** Ask the stage to frame one leg of one walker at a time; `seq` makes a repeat of the same request count. */
export interface StageFocus {
  walker: string;
  leg: number;
  time: number;
  seq: number;
}

/** GLView's web-only prop: preserveDrawingBuffer lets tests read pixels back and the clip copy frames. */
const webContextProps = Platform.OS === 'web' ? ({ webglContextAttributes: { preserveDrawingBuffer: true, antialias: true } } as object) : {};

function canvasFor(gl: ExpoWebGLRenderingContext): HTMLCanvasElement {
  const real = (gl as unknown as { canvas?: HTMLCanvasElement }).canvas;
  if (real && typeof (real as { addEventListener?: unknown }).addEventListener === 'function') return real;
  return { width: gl.drawingBufferWidth, height: gl.drawingBufferHeight, style: {}, addEventListener() {}, removeEventListener() {}, clientHeight: gl.drawingBufferHeight } as unknown as HTMLCanvasElement;
}

interface Actor {
  walker: StageWalker;
  figure: StickFigure;
  marks: WalkMarks;
  joints: Float32Array[];
  character: PosedCharacter | null;
  /** The mesh bytes and replay the character was bound from (a new pair binds again). */
  boundFrom: [ArrayBuffer | null, WalkReplay | null];
  binding: boolean;
  /** The last status told to onMeshStatus, so a status is told once. */
  told: string;
}

interface Stage {
  gl: ExpoWebGLRenderingContext;
  renderer: THREE.WebGLRenderer;
  scene: THREE.Scene;
  camera: THREE.PerspectiveCamera;
  follow: FollowCamera;
  actors: Map<string, Actor>;
}

/**
 * The 3D walk of one or more walkers over one course, on one clock (`timeAt()`, seconds). Each walker is its
 * character's own skinned mesh posed from the trial, or its stick figure ("skeleton": body, leg lines, feet);
 * target rings, foot trails and stumble marks are always drawn. A follow camera keeps the first walker in frame:
 * one finger or the mouse orbits, two fingers or the right button pan, pinch or the wheel zoom, "Reset view"
 * returns. Draws every animation frame while `animating`, otherwise when `revision` changes.
 */
export function WalkStage({
  course,
  walkers,
  timeAt,
  animating,
  revision,
  skeleton,
  focus,
  height = 300,
  label,
  onMeshStatus,
  onCanvas,
  testID = 'walk-view',
}: {
  course: Heightfield;
  walkers: StageWalker[];
  timeAt: () => number;
  animating: boolean;
  revision: number;
  skeleton: boolean;
  focus?: StageFocus | null;
  height?: number;
  label: string;
  onMeshStatus?(key: string, status: MeshStatus): void;
  /** The canvas the stage draws into (web), for clips and stills. */
  onCanvas?(canvas: HTMLCanvasElement | null): void;
  testID?: string;
}) {
  const stage = useRef<Stage | null>(null);
  const props = useRef({ walkers, timeAt, skeleton, focus, onMeshStatus });
  props.current = { walkers, timeAt, skeleton, focus, onMeshStatus };
  const framed = useRef<number | null>(null);

  const draw = useCallback(() => {
    const s = stage.current;
    if (!s) return;
    const { timeAt: now, skeleton: showSkeleton, focus: f } = props.current;
    const t = now();
    let lead: Actor | null = null;
    for (const a of s.actors.values()) {
      const { series, replay } = a.walker;
      const k = Math.max(0, Math.min(series.length - 1, t * series.rate));
      const pose = poseOfSample(series, k);
      if (replay && replay.length > 0) {
        const sample = Math.max(0, Math.min(replay.length - 1, Math.round(k)));
        let slot = replay.joints * sample;
        for (let i = 0; i < a.joints.length; i++) {
          const j = a.joints[i];
          for (let c = 0; c < j.length; c++) j[c] = replay.position[3 * slot + c];
          slot += replay.jointsPerLeg[i];
        }
        pose.joints = a.joints;
      }
      a.figure.update(pose);
      const meshShown = !!a.character && !showSkeleton;
      a.figure.skeleton.visible = !meshShown;
      if (a.character) {
        a.character.carrier.visible = meshShown;
        if (meshShown) a.character.pose(replay!, k);
      }
      if (!lead && !a.walker.ghost) lead = a;
    }
    lead ??= s.actors.values().next().value ?? null;
    if (lead) {
      const { series } = lead.walker;
      const k = Math.max(0, Math.min(series.length - 1, Math.round(t * series.rate)));
      const bx = 0;
      const by = series.bodyHeight[k];
      const bz = series.bodyZ[k];
      if (f && framed.current !== f.seq) {
        framed.current = f.seq;
        const target = s.actors.get(f.walker) ?? lead;
        const ks = Math.max(0, Math.min(target.walker.series.length - 1, Math.round(f.time * target.walker.series.rate)));
        const L = target.walker.series.legs;
        const o = 3 * (ks * L + Math.min(f.leg, L - 1));
        s.follow.frame(target.walker.series.foot.subarray(o, o + 3), bx, target.walker.series.bodyHeight[ks], target.walker.series.bodyZ[ks]);
      }
      s.follow.apply(s.camera, bx, by, bz);
      s.camera.updateMatrixWorld();
      for (const a of s.actors.values()) a.marks.update(Math.max(0, t * a.walker.series.rate), s.camera);
    }
    s.renderer.render(s.scene, s.camera);
    s.gl.endFrameEXP();
  }, []);

  /** Bring the actors in line with the walkers: add new ones, drop gone ones, bind meshes that became ready. */
  const sync = useCallback(() => {
    const s = stage.current;
    if (!s) return;
    const { walkers: ws, onMeshStatus } = props.current;
    const report = (key: string, status: MeshStatus) => {
      const a = s.actors.get(key);
      const said = JSON.stringify(status);
      if (!a || a.told === said) return;
      a.told = said;
      onMeshStatus?.(key, status);
    };
    const keys = new Set(ws.map((w) => w.key));
    for (const [key, a] of s.actors) {
      if (keys.has(key) && a.walker.rig === ws.find((w) => w.key === key)!.rig && a.walker.series === ws.find((w) => w.key === key)!.series) continue;
      s.scene.remove(a.figure.skeleton, a.figure.targets, a.marks.group);
      if (a.character) s.scene.remove(a.character.carrier);
      a.figure.dispose();
      a.marks.dispose();
      a.character?.dispose();
      s.actors.delete(key);
    }
    ws.forEach((w, index) => {
      let a = s.actors.get(w.key);
      if (!a) {
        const figure = createStickFigure(w.rig, w.ghost ? colors.moss : index === 0 ? colors.ember : colors.graphite);
        const marks = createWalkMarks(w.series, w.events, w.rig.hipHeight);
        s.scene.add(figure.skeleton, figure.targets, marks.group);
        a = { walker: w, figure, marks, joints: w.rig.legs.map((l) => new Float32Array(3 * l.chain.joints.length)), character: null, boundFrom: [null, null], binding: false, told: '' };
        s.actors.set(w.key, a);
      }
      a.walker = w;
      const actor = a;
      if (actor.binding || (actor.boundFrom[0] === w.mesh && actor.boundFrom[1] === w.replay)) return;
      if (!w.mesh || !w.replay) {
        report(w.key, { state: 'waiting' });
        return;
      }
      actor.boundFrom = [w.mesh, w.replay];
      actor.binding = true;
      const replay = w.replay;
      new GLTFLoader()
        .parseAsync(w.mesh.slice(0), '')
        .then((gltf) => {
          actor.binding = false;
          if (stage.current !== s || s.actors.get(w.key) !== actor) return;
          const bound = bindCharacter(gltf.scene, w.rig, replay.jointOffset);
          if (!bound.ok) {
            report(w.key, { state: 'none', reason: bound.reason });
            return;
          }
          if (actor.character) {
            s.scene.remove(actor.character.carrier);
            actor.character.dispose();
          }
          if (w.ghost) {
            gltf.scene.traverse((o) => {
              const m = o as THREE.Mesh;
              if (!m.isMesh) return;
              const see = (mat: THREE.Material) => Object.assign(mat.clone(), { transparent: true, opacity: 0.4, depthWrite: false });
              m.material = Array.isArray(m.material) ? m.material.map(see) : see(m.material);
            });
          }
          actor.character = bound.character;
          s.scene.add(bound.character.carrier);
          report(w.key, { state: 'shown' });
          draw();
        })
        .catch((err: unknown) => {
          actor.binding = false;
          report(w.key, { state: 'none', reason: `The character's file could not be read (${(err as Error).message}); the walk is drawn as a skeleton.` });
        });
    });
  }, [draw]);

  const gestures = useOrbitGestures({
    rotate: (dx, dy) => {
      stage.current?.follow.rotate(dx, dy, height);
      draw();
    },
    pan: (dx, dy) => {
      stage.current?.follow.pan(dx, dy, height);
      draw();
    },
    zoom: (factor) => {
      stage.current?.follow.zoom(factor);
      draw();
    },
  });

  const onContextCreate = useCallback(
    (gl: ExpoWebGLRenderingContext) => {
      const canvas = canvasFor(gl);
      const renderer = new THREE.WebGLRenderer({ canvas, context: gl as unknown as WebGL2RenderingContext, antialias: true });
      renderer.setPixelRatio(1);
      renderer.setSize(gl.drawingBufferWidth, gl.drawingBufferHeight, false);
      renderer.setClearColor(colors.paper);
      const scene = createCourseScene(course);
      const camera = new THREE.PerspectiveCamera(WALK_FOV, gl.drawingBufferWidth / Math.max(1, gl.drawingBufferHeight), 0.01, 500);
      const lead = props.current.walkers[0];
      stage.current = { gl, renderer, scene, camera, follow: createFollowCamera(lead?.rig.hipHeight ?? 0.5), actors: new Map() };
      onCanvas?.(Platform.OS === 'web' ? canvas : null);
      sync();
      draw();
    },
    // The context is made once per course; walkers are brought in line by the effect below.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [course],
  );

  useEffect(() => {
    sync();
    draw();
  }, [walkers, skeleton, sync, draw]);

  useDrawLoop(animating, draw, [revision, focus?.seq]);

  useEffect(
    () => () => {
      const s = stage.current;
      if (s) {
        for (const a of s.actors.values()) {
          a.figure.dispose();
          a.marks.dispose();
          a.character?.dispose();
        }
        s.renderer.dispose();
      }
      stage.current = null;
      onCanvas?.(null);
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [],
  );

  return (
    <View style={[styles.frame, { height }]} testID={testID}>
      <View ref={gestures.ref} style={styles.fill} {...gestures.panHandlers} role="img" aria-label={`${label}. Drag to orbit, pinch or scroll to zoom, two fingers or right-drag to pan.`}>
        <GLView key={`${course.rows}x${course.cols}`} style={styles.fill} onContextCreate={onContextCreate} {...webContextProps} />
      </View>
      <Pressable
        accessibilityRole="button"
        accessibilityLabel="Reset view"
        onPress={() => {
          stage.current?.follow.reset();
          framed.current = focus?.seq ?? null;
          draw();
        }}
        style={({ pressed }) => [styles.reset, pressed && styles.resetPressed]}
      >
        <Text style={styles.resetText}>Reset view</Text>
      </Pressable>
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { borderRadius: radius.lg, overflow: 'hidden', backgroundColor: colors.paperDeep, borderWidth: 1, borderColor: colors.rule },
  fill: { flex: 1 },
  reset: {
    position: 'absolute',
    top: space.sm,
    right: space.sm,
    minHeight: touchTarget,
    minWidth: touchTarget,
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.md,
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.rule,
  },
  resetPressed: { backgroundColor: colors.paperDeep },
  resetText: { fontFamily: fonts.bodyStrong, fontSize: 13, color: colors.ink },
});
