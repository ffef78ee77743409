import { useEffect, useMemo, useRef } from 'react';
import { PanResponder, Platform, type View } from 'react-native';

/** What a gesture asks of the camera, in view pixels. */
export interface OrbitGestureHandlers {
  rotate(dx: number, dy: number): void;
  pan(dx: number, dy: number): void;
  /** Factor on the distance: below 1 comes closer. */
  zoom(factor: number): void;
}

interface Pointer {
  x: number;
  y: number;
}

/**
 * Orbit by one finger or the left mouse button, pan by two fingers, the right mouse button or shift-drag,
 * pinch and the mouse wheel to zoom. On the web it listens to pointer events on the view's element (mouse,
 * touch and pen alike); on native it uses PanResponder's touches.
 */
export function useOrbitGestures(handlers: OrbitGestureHandlers) {
  const ref = useRef<View>(null);
  const h = useRef(handlers);
  h.current = handlers;

  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const el = ref.current as unknown as HTMLElement | null;
    if (!el) return;
    const pointers = new Map<number, Pointer & { button: number; shift: boolean }>();
    let pinch: { distance: number; mid: Pointer } | null = null;
    const pair = () => {
      const [a, b] = [...pointers.values()];
      return { distance: Math.hypot(a.x - b.x, a.y - b.y), mid: { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 } };
    };
    const down = (e: PointerEvent) => {
      el.setPointerCapture?.(e.pointerId);
      pointers.set(e.pointerId, { x: e.clientX, y: e.clientY, button: e.button, shift: e.shiftKey });
      pinch = pointers.size === 2 ? pair() : null;
      e.preventDefault();
    };
    const move = (e: PointerEvent) => {
      const p = pointers.get(e.pointerId);
      if (!p) return;
      const dx = e.clientX - p.x;
      const dy = e.clientY - p.y;
      p.x = e.clientX;
      p.y = e.clientY;
      if (pointers.size >= 2 && pinch) {
        const now = pair();
        if (now.distance > 0 && pinch.distance > 0) h.current.zoom(pinch.distance / now.distance);
        h.current.pan(now.mid.x - pinch.mid.x, now.mid.y - pinch.mid.y);
        pinch = now;
      } else if (pointers.size === 1) {
        if (p.button === 2 || p.button === 1 || e.shiftKey) h.current.pan(dx, dy);
        else h.current.rotate(dx, dy);
      }
      e.preventDefault();
    };
    const up = (e: PointerEvent) => {
      pointers.delete(e.pointerId);
      pinch = pointers.size === 2 ? pair() : null;
    };
    const wheel = (e: WheelEvent) => {
      e.preventDefault();
      h.current.zoom(Math.exp(e.deltaY * 0.0015));
    };
    const menu = (e: Event) => e.preventDefault();
    el.style.touchAction = 'none';
    el.addEventListener('pointerdown', down);
    el.addEventListener('pointermove', move);
    el.addEventListener('pointerup', up);
    el.addEventListener('pointercancel', up);
    el.addEventListener('wheel', wheel, { passive: false });
    el.addEventListener('contextmenu', menu);
    return () => {
      el.removeEventListener('pointerdown', down);
      el.removeEventListener('pointermove', move);
      el.removeEventListener('pointerup', up);
      el.removeEventListener('pointercancel', up);
      el.removeEventListener('wheel', wheel);
      el.removeEventListener('contextmenu', menu);
    };
  }, []);

  const panHandlers = useMemo(() => {
    if (Platform.OS === 'web') return {};
    let last: Pointer | null = null;
    let pinch: { distance: number; mid: Pointer } | null = null;
    return PanResponder.create({
      onStartShouldSetPanResponder: () => true,
      onMoveShouldSetPanResponder: () => true,
      onPanResponderGrant: (e) => {
        last = { x: e.nativeEvent.pageX, y: e.nativeEvent.pageY };
        pinch = null;
      },
      onPanResponderMove: (e) => {
        const touches = e.nativeEvent.touches;
        if (touches.length >= 2) {
          const [a, b] = touches;
          const now = { distance: Math.hypot(a.pageX - b.pageX, a.pageY - b.pageY), mid: { x: (a.pageX + b.pageX) / 2, y: (a.pageY + b.pageY) / 2 } };
          if (pinch) {
            h.current.zoom(pinch.distance / Math.max(1, now.distance));
            h.current.pan(now.mid.x - pinch.mid.x, now.mid.y - pinch.mid.y);
          }
          pinch = now;
          last = null;
          return;
        }
        const p = { x: e.nativeEvent.pageX, y: e.nativeEvent.pageY };
        if (last) h.current.rotate(p.x - last.x, p.y - last.y);
        last = p;
        pinch = null;
      },
      onPanResponderRelease: () => {
        last = null;
        pinch = null;
      },
    }).panHandlers;
  }, []);

  return { ref, panHandlers };
}
