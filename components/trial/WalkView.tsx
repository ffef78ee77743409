import { useCallback, useEffect, useRef } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { GLView, type ExpoWebGLRenderingContext } from 'expo-gl';
import * as THREE from 'three';
import type { Heightfield } from '../../engine/course/heightfield';
import type { Rig } from '../../engine/gait/rig';
import { colors, radius } from '../../constants/theme';
import { createWalkScene, type WalkPose, type WalkScene } from './walk-scene';
import { useDrawLoop } from '../viewer/useDrawLoop';

/** GLView's web-only prop: preserveDrawingBuffer lets browser tests read pixels back. */
const webContextProps = Platform.OS === 'web' ? ({ webglContextAttributes: { preserveDrawingBuffer: true, antialias: true } } as object) : {};

function canvasFor(gl: ExpoWebGLRenderingContext): HTMLCanvasElement {
  const real = (gl as unknown as { canvas?: HTMLCanvasElement }).canvas;
  if (real && typeof (real as { addEventListener?: unknown }).addEventListener === 'function') return real;
  return { width: gl.drawingBufferWidth, height: gl.drawingBufferHeight, style: {}, addEventListener() {}, removeEventListener() {}, clientHeight: gl.drawingBufferHeight } as unknown as HTMLCanvasElement;
}

/**
 * A walk in 3D (expo-gl GLView + three). `poseAt()` is asked for the pose to draw: on every animation frame
 * while `animating`, otherwise whenever `revision` changes. `aim`, when given, places the camera after the scene's own.
 */
export function WalkView({ course, rig, poseAt, animating, revision, height = 300, label, aim }: { course: Heightfield; rig: Rig; poseAt: () => WalkPose | null; animating: boolean; revision: number; height?: number; label: string; aim?: (camera: THREE.PerspectiveCamera, pose: WalkPose) => void }) {
  const stage = useRef<{ gl: ExpoWebGLRenderingContext; renderer: THREE.WebGLRenderer; walk: WalkScene } | null>(null);
  const poseRef = useRef(poseAt);
  poseRef.current = poseAt;
  const aimRef = useRef(aim);
  aimRef.current = aim;

  const draw = useCallback(() => {
    const s = stage.current;
    if (!s) return;
    const pose = poseRef.current();
    if (pose) {
      s.walk.update(pose);
      aimRef.current?.(s.walk.camera, pose);
    }
    s.renderer.render(s.walk.scene, s.walk.camera);
    s.gl.endFrameEXP();
  }, []);

  const onContextCreate = useCallback(
    (gl: ExpoWebGLRenderingContext) => {
      const renderer = new THREE.WebGLRenderer({ canvas: canvasFor(gl), context: gl as unknown as WebGL2RenderingContext, antialias: true });
      renderer.setPixelRatio(1);
      renderer.setSize(gl.drawingBufferWidth, gl.drawingBufferHeight, false);
      renderer.setClearColor(colors.paper);
      stage.current = { gl, renderer, walk: createWalkScene(course, rig, gl.drawingBufferWidth / Math.max(1, gl.drawingBufferHeight)) };
      draw();
    },
    [course, rig, draw],
  );

  useDrawLoop(animating, draw, [revision]);

  useEffect(
    () => () => {
      stage.current?.walk.dispose();
      stage.current?.renderer.dispose();
      stage.current = null;
    },
    [],
  );

  return (
    <View style={[styles.frame, { height }]} role="img" aria-label={label} testID="walk-view">
      <GLView key={`${course.rows}x${course.cols}-${rig.name}`} style={StyleSheet.absoluteFill} onContextCreate={onContextCreate} {...webContextProps} />
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { borderRadius: radius.lg, overflow: 'hidden', backgroundColor: colors.paperDeep, borderWidth: 1, borderColor: colors.rule },
});
