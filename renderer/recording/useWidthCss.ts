// The width of an element in whole CSS pixels (at least 320), kept current by a ResizeObserver; 1200 until measured.
// Shared by the recording view and the recorders time line, so their time axes measure alike.
import { useLayoutEffect, useState, type RefObject } from 'react';

export function useWidthCss(ref: RefObject<HTMLElement | null>): number {
  const [widthCss, setWidthCss] = useState(1200);
  useLayoutEffect(() => {
    const element = ref.current;
    if (!element) return;
    const measure = () => setWidthCss(Math.max(320, Math.floor(element.clientWidth)));
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    return () => observer.disconnect();
  }, []);
  return widthCss;
}
