// Lag-axis ticks of the correlation plots: 1-2-5 steps about 55 px apart, labelled in µs below a millisecond, else ms.
import { niceStep125, ticksWithin } from '../recording';

export interface AxisTick {
  position: number;
  label: string;
}

/** Ticks whose label would run past the plot's edges (in pixels) are left out. */
export function lagAxisTicks(
  fromSeconds: number,
  toSeconds: number,
  innerWidthPixels: number,
  x: (lagSeconds: number) => number,
  edges?: { leftPixels: number; rightPixels: number },
): { ticks: AxisTick[]; unit: string } {
  const step = niceStep125((toSeconds - fromSeconds) / Math.max(1, innerWidthPixels / 55));
  const unitScale = Math.max(Math.abs(fromSeconds), Math.abs(toSeconds)) < 1e-3 ? 1e6 : 1e3;
  const decimals = Math.max(0, Math.ceil(-Math.log10(step * unitScale) - 1e-9));
  const ticks = ticksWithin(fromSeconds, toSeconds, step).map((lag) => {
    const value = lag * unitScale;
    const text = Math.abs(value).toFixed(decimals);
    return { position: x(lag), label: value < 0 && Number(text) !== 0 ? `−${text}` : text };
  });
  const halfLabel = (label: string) => 3 * label.length + 2; // about 6 px per character at 9 px type
  const inside = edges ? ticks.filter((t) => t.position - halfLabel(t.label) >= edges.leftPixels && t.position + halfLabel(t.label) <= edges.rightPixels) : ticks;
  return { ticks: inside, unit: unitScale === 1e6 ? 'µs' : 'ms' };
}
