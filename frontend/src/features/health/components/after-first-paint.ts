import { startTransition, useEffect, useState } from 'react';

/**
 * False when a component first renders, true once the browser has painted that first frame: what can wait (the
 * charts further down, the hover layers) is drawn after the first chart is on screen, as work React may interrupt.
 */
export function useAfterFirstPaint(): boolean {
  const [painted, setPainted] = useState(false);
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | undefined;
    // a frame callback runs just before the paint; a task queued from it runs after the paint
    const frame = requestAnimationFrame(() => {
      timer = setTimeout(() => startTransition(() => setPainted(true)), 0);
    });
    return () => {
      cancelAnimationFrame(frame);
      if (timer !== undefined) clearTimeout(timer);
    };
  }, []);
  return painted;
}
