import { useEffect, useRef } from 'react';
import { Platform } from 'react-native';

const FORWARD = ['w', 'arrowup'];
const LEFT = ['a', 'arrowleft'];
const RIGHT = ['d', 'arrowright'];
const ALL = new Set([...FORWARD, ...LEFT, ...RIGHT]);

/** Keys held now (WASD or arrows), read by the draw loop; typing in a field is left alone. */
export function useDriveKeys(active: boolean): { current: Set<string> } {
  const held = useRef(new Set<string>());
  useEffect(() => {
    if (!active || Platform.OS !== 'web' || typeof window === 'undefined') return;
    const typing = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      return !!t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.isContentEditable);
    };
    const down = (e: KeyboardEvent) => {
      const k = e.key.toLowerCase();
      if (!ALL.has(k) || typing(e)) return;
      held.current.add(k);
      // Arrow keys would scroll the page while the character walks.
      e.preventDefault();
    };
    const up = (e: KeyboardEvent) => held.current.delete(e.key.toLowerCase());
    const clear = () => held.current.clear();
    window.addEventListener('keydown', down);
    window.addEventListener('keyup', up);
    window.addEventListener('blur', clear);
    return () => {
      window.removeEventListener('keydown', down);
      window.removeEventListener('keyup', up);
      window.removeEventListener('blur', clear);
      clear();
    };
  }, [active]);
  return held;
}

/** Forward share (0–1) and turn (−1 right … 1 left) from the keys held. */
export function keysToDrive(held: Set<string>): { forward: number; turn: number } {
  const any = (names: string[]) => names.some((k) => held.has(k));
  return { forward: any(FORWARD) ? 1 : 0, turn: (any(LEFT) ? 1 : 0) - (any(RIGHT) ? 1 : 0) };
}
