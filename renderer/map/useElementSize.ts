// The content-box size of an element, kept current by a ResizeObserver; null until it has a non-zero size.
// Units: CSS pixels, rounded down to whole pixels so sub-pixel jitter does not re-render.

import { useLayoutEffect, useState, type RefObject } from 'react';

export interface ElementSize {
  widthPixels: number;
  heightPixels: number;
}

export function useElementSize(ref: RefObject<HTMLElement | null>): ElementSize | null {
  const [size, setSize] = useState<ElementSize | null>(null);
  useLayoutEffect(() => {
    const element = ref.current;
    if (element === null) return undefined;
    const update = (widthPixels: number, heightPixels: number): void => {
      const w = Math.floor(widthPixels);
      const h = Math.floor(heightPixels);
      if (w <= 0 || h <= 0) return;
      setSize((previous) => (previous !== null && previous.widthPixels === w && previous.heightPixels === h ? previous : { widthPixels: w, heightPixels: h }));
    };
    const box = element.getBoundingClientRect();
    update(box.width, box.height);
    if (typeof ResizeObserver === 'undefined') return undefined;
    const observer = new ResizeObserver((entries) => {
      const rect = entries[entries.length - 1]?.contentRect;
      if (rect) update(rect.width, rect.height);
    });
    observer.observe(element);
    return () => observer.disconnect();
  }, [ref]);
  return size;
}
