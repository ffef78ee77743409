import { useEffect } from 'react';

/**
 * Draws once when still, or every display frame while `animating`; `redrawOn` lists what else should
 * restart the loop (a new scene revision, a new focus).
 */
export function useDrawLoop(animating: boolean, draw: () => void, redrawOn: readonly unknown[]): void {
  useEffect(() => {
    if (!animating) {
      draw();
      return;
    }
    let handle = 0;
    const loop = () => {
      draw();
      handle = requestAnimationFrame(loop);
    };
    handle = requestAnimationFrame(loop);
    return () => cancelAnimationFrame(handle);
  }, [animating, draw, ...redrawOn]);
}
