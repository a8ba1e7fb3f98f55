// A drag handle between two panels: reports how far it was dragged (pixels) while the pointer is down; arrow keys step it.
import { useRef, type KeyboardEvent, type PointerEvent } from 'react';

export interface SplitterProps {
  orientation: 'vertical' | 'horizontal';
  label: string;
  testId: string;
  /** Pixels moved since the last call: right or down is positive. */
  onDrag(deltaPixels: number): void;
}

const KEY_STEP_PIXELS = 24;

export function Splitter({ orientation, label, testId, onDrag }: SplitterProps) {
  const last = useRef<number | undefined>(undefined);
  const vertical = orientation === 'vertical';
  const down = (event: PointerEvent<HTMLDivElement>) => {
    event.currentTarget.setPointerCapture(event.pointerId);
    last.current = vertical ? event.clientX : event.clientY;
  };
  const move = (event: PointerEvent<HTMLDivElement>) => {
    if (last.current === undefined) return;
    const now = vertical ? event.clientX : event.clientY;
    const delta = now - last.current;
    last.current = now;
    if (delta !== 0) onDrag(delta);
  };
  const up = () => { last.current = undefined; };
  const key = (event: KeyboardEvent<HTMLDivElement>) => {
    const step = { ArrowLeft: -1, ArrowUp: -1, ArrowRight: 1, ArrowDown: 1 }[event.key];
    if (step === undefined) return;
    event.preventDefault();
    onDrag(step * KEY_STEP_PIXELS);
  };
  return (
    <div className={`splitter splitter-${orientation}`} role="separator" aria-orientation={orientation} aria-label={label} title={label} tabIndex={0} data-testid={testId}
      onPointerDown={down} onPointerMove={move} onPointerUp={up} onPointerCancel={up} onKeyDown={key} />
  );
}
