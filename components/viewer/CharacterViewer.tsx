import { useCallback, useEffect, useRef, useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import { GLView, type ExpoWebGLRenderingContext } from 'expo-gl';
import * as THREE from 'three';
import { GLTFLoader } from 'three/examples/jsm/loaders/GLTFLoader.js';
import type { LegMapping, SkeletonJointSummary } from '../../schemas/characters';
import { colors, radius, space, type } from '../../constants/theme';
import { sideColor } from '../characters/format';
import { cameraPosition, fitOrbit, pan, rotate, zoom, type Orbit } from './orbit';
import { useOrbitGestures } from './gestures';
import { skeletonOverlay } from './skeleton-overlay';

const FOV = 40;

/** GLView's web-only prop (not in its public types): preserveDrawingBuffer lets tests read the pixels back. */
const webContextProps = Platform.OS === 'web' ? ({ webglContextAttributes: { preserveDrawingBuffer: true, antialias: true } } as object) : {};

interface Stage {
  renderer: THREE.WebGLRenderer;
  scene: THREE.Scene;
  camera: THREE.PerspectiveCamera;
  gl: ExpoWebGLRenderingContext;
  limits: { min: number; max: number };
}

/** A stand-in for the canvas three expects, for native where the context has none. */
function canvasFor(gl: ExpoWebGLRenderingContext): HTMLCanvasElement {
  const real = (gl as unknown as { canvas?: HTMLCanvasElement }).canvas;
  if (real && typeof (real as { addEventListener?: unknown }).addEventListener === 'function') return real;
  return { width: gl.drawingBufferWidth, height: gl.drawingBufferHeight, style: {}, addEventListener() {}, removeEventListener() {}, clientHeight: gl.drawingBufferHeight } as unknown as HTMLCanvasElement;
}

/**
 * The character in 3D: its skinned mesh from the stored .glb (three's GLTFLoader), scaled by the character's unit
 * fix, and its skeleton drawn over it (positions come in metres), every leg in its side's colour. The camera frames
 * the joints at once, then the whole mesh as bound once it has loaded, so a head above its last joint stays in view
 * whatever the character's size or the file's up axis. Renders on demand (after loading and after each gesture).
 */
export function CharacterViewer({ fileUrl, joints, legs, unitScale = 1, height = 340 }: { fileUrl: string; joints: SkeletonJointSummary[]; legs: LegMapping[]; unitScale?: number; height?: number }) {
  const stage = useRef<Stage | null>(null);
  const orbit = useRef<Orbit | null>(null);
  const overlay = useRef<THREE.Object3D | null>(null);
  const [state, setState] = useState<'loading' | 'ready' | 'failed'>('loading');
  const [problem, setProblem] = useState<string | null>(null);

  const draw = useCallback(() => {
    const s = stage.current;
    const o = orbit.current;
    if (!s || !o) return;
    s.camera.position.set(...cameraPosition(o));
    s.camera.lookAt(o.target[0], o.target[1], o.target[2]);
    s.renderer.render(s.scene, s.camera);
    s.gl.endFrameEXP();
  }, []);

  const gestures = useOrbitGestures({
    rotate: (dx, dy) => {
      if (!orbit.current || !stage.current) return;
      orbit.current = rotate(orbit.current, dx, dy, height);
      draw();
    },
    pan: (dx, dy) => {
      if (!orbit.current) return;
      orbit.current = pan(orbit.current, dx, dy, height, FOV);
      draw();
    },
    zoom: (factor) => {
      if (!orbit.current || !stage.current) return;
      orbit.current = zoom(orbit.current, factor, stage.current.limits);
      draw();
    },
  });

  // The legs can change (a saved mapping) without reloading the file.
  useEffect(() => {
    const s = stage.current;
    if (!s) return;
    if (overlay.current) s.scene.remove(overlay.current);
    overlay.current = skeletonOverlay(joints, legs, sideColor);
    s.scene.add(overlay.current);
    draw();
  }, [joints, legs, draw]);

  const onContextCreate = useCallback(
    async (gl: ExpoWebGLRenderingContext) => {
      const renderer = new THREE.WebGLRenderer({ canvas: canvasFor(gl), context: gl as unknown as WebGL2RenderingContext, antialias: true });
      renderer.setPixelRatio(1);
      renderer.setSize(gl.drawingBufferWidth, gl.drawingBufferHeight, false);
      renderer.setClearColor(colors.paperDeep);
      const scene = new THREE.Scene();
      scene.add(new THREE.HemisphereLight(colors.paper, colors.graphite, 2.2));
      const sun = new THREE.DirectionalLight('#ffffff', 1.6);
      sun.position.set(2, 4, 3);
      scene.add(sun);
      const camera = new THREE.PerspectiveCamera(FOV, gl.drawingBufferWidth / Math.max(1, gl.drawingBufferHeight), 0.001, 1000);

      const lo: [number, number, number] = [Infinity, Infinity, Infinity];
      const hi: [number, number, number] = [-Infinity, -Infinity, -Infinity];
      for (const j of joints) for (let a = 0; a < 3; a++) {
        lo[a] = Math.min(lo[a], j.position[a]);
        hi[a] = Math.max(hi[a], j.position[a]);
      }
      const size = Math.max(hi[0] - lo[0], hi[1] - lo[1], hi[2] - lo[2], 1e-4);
      const grid = new THREE.GridHelper(size * 3, 12, colors.graphite, colors.rule);
      grid.position.set((lo[0] + hi[0]) / 2, lo[1], (lo[2] + hi[2]) / 2);
      scene.add(grid);

      overlay.current = skeletonOverlay(joints, legs, sideColor);
      scene.add(overlay.current);
      const aspect = gl.drawingBufferWidth / Math.max(1, gl.drawingBufferHeight);
      camera.near = size / 1000;
      camera.far = size * 100;
      camera.updateProjectionMatrix();
      orbit.current = fitOrbit(lo, hi, FOV, aspect);
      stage.current = { renderer, scene, camera, gl, limits: { min: size * 0.2, max: size * 20 } };
      draw();

      try {
        const response = await fetch(fileUrl, { credentials: 'same-origin' });
        if (!response.ok) throw new Error(`The file could not be fetched (${response.status}).`);
        const gltf = await new GLTFLoader().parseAsync(await response.arrayBuffer(), '');
        // The joints arrive in metres with the unit fix applied; the mesh is in the file's own units.
        gltf.scene.scale.multiplyScalar(unitScale);
        scene.add(gltf.scene);
        gltf.scene.updateMatrixWorld(true);
        // The mesh as bound (skinned vertices, precise), with the joints: the whole character in view.
        const box = new THREE.Box3().setFromObject(gltf.scene, true);
        if (!box.isEmpty()) {
          const mlo: [number, number, number] = [Math.min(lo[0], box.min.x), Math.min(lo[1], box.min.y), Math.min(lo[2], box.min.z)];
          const mhi: [number, number, number] = [Math.max(hi[0], box.max.x), Math.max(hi[1], box.max.y), Math.max(hi[2], box.max.z)];
          const whole = Math.max(mhi[0] - mlo[0], mhi[1] - mlo[1], mhi[2] - mlo[2], 1e-4);
          orbit.current = fitOrbit(mlo, mhi, FOV, aspect);
          if (stage.current) stage.current.limits = { min: whole * 0.2, max: whole * 20 };
          camera.near = whole / 1000;
          camera.far = whole * 100;
          camera.updateProjectionMatrix();
        }
        setState('ready');
        draw();
      } catch (err) {
        setProblem((err as Error).message);
        setState('failed');
        draw();
      }
    },
    // The context is made once; joints and legs at that moment seed the overlay, later changes go through the effect above.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [fileUrl],
  );

  useEffect(
    () => () => {
      stage.current?.renderer.dispose();
      stage.current = null;
    },
    [],
  );

  return (
    <View style={[styles.frame, { height }]}>
      <View ref={gestures.ref} style={styles.fill} {...gestures.panHandlers} aria-label="3D view of the character: drag to orbit, pinch or scroll to zoom, two fingers or right-drag to pan" role="img" testID="character-viewer">
        <GLView style={styles.fill} onContextCreate={onContextCreate} {...webContextProps} />
      </View>
      <View style={styles.legend} pointerEvents="none">
        <Text style={[styles.legendText, { color: sideColor.left }]}>● left legs</Text>
        <Text style={[styles.legendText, { color: sideColor.right }]}>● right legs</Text>
        <Text style={[styles.legendText, { color: colors.graphite }]}>● other joints</Text>
      </View>
      {state === 'loading' ? (
        <Text style={styles.status} pointerEvents="none">
          Loading the mesh…
        </Text>
      ) : null}
      {problem ? (
        <Text style={styles.status} role="alert">
          {problem}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { borderRadius: radius.lg, overflow: 'hidden', backgroundColor: colors.paperDeep, borderWidth: 1, borderColor: colors.rule },
  fill: { flex: 1 },
  legend: { position: 'absolute', left: space.md, bottom: space.sm, flexDirection: 'row', gap: space.md, flexWrap: 'wrap' },
  legendText: { ...type.small },
  status: { position: 'absolute', top: space.md, left: space.md, ...type.small, color: colors.graphite },
});
