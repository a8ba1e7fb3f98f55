// The north arrow: the map is drawn north-up in the local east/north/up frame, so the arrow points straight up.
// Units: pixels, in a box of the given size with its origin at the top left (SVG and canvas convention, y down).

export interface NorthArrow {
  /** Flat [x0, y0, ...] of the arrow head polygon, tip first. */
  headPoints: number[];
  /** The half of the head shaded dark (tip, centre notch, right corner). */
  shadedPoints: number[];
  tip: { xPixels: number; yPixels: number };
  /** Centre of the "N" above the tip. */
  label: { text: 'N'; xPixels: number; yPixels: number };
}

/** North arrow in a square box of `sizePixels`; `upDegrees` turns it clockwise on screen for a rotated map (0 = north up). */
export function northArrow(sizePixels: number, upDegrees = 0): NorthArrow {
  const cx = sizePixels / 2;
  const cy = sizePixels * 0.62;
  const length = sizePixels * 0.3;
  const halfWidth = sizePixels * 0.16;
  const turn = (upDegrees * Math.PI) / 180;
  // Screen y is down: a point `along` the arrow and `across` it (to the right) sits at these pixels.
  const at = (along: number, across: number): [number, number] => [
    cx + across * Math.cos(turn) + along * Math.sin(turn),
    cy - along * Math.cos(turn) + across * Math.sin(turn),
  ];
  const tip = at(length, 0);
  const left = at(-length * 0.55, -halfWidth);
  const notch = at(-length * 0.2, 0);
  const right = at(-length * 0.55, halfWidth);
  const label = at(length + sizePixels * 0.16, 0);
  return {
    headPoints: [...tip, ...right, ...notch, ...left],
    shadedPoints: [...tip, ...notch, ...right],
    tip: { xPixels: tip[0], yPixels: tip[1] },
    label: { text: 'N', xPixels: label[0], yPixels: label[1] },
  };
}
