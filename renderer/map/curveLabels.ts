// Places one label per curve where the curve enters the view from an edge, inset from it, skipping places where
// the label would overlap one already placed. Units: pixels. Greedy placement, best curves first (common practice).

export interface LabelBox {
  xPixels: number;
  yPixels: number;
  widthPixels: number;
  heightPixels: number;
}

export interface LabelRequest {
  text: string;
  /** Flat [x0, y0, ...] pixel polylines of the curve. */
  polylinesPixels: readonly (readonly number[])[];
  /** Higher first. */
  priority: number;
}

export interface LabelPlacementOptions {
  widthPixels: number;
  heightPixels: number;
  /** Labels sit at least this far inside the view edges. */
  insetPixels: number;
  /** Rough text size: width per character and height of a line, pixels (default 6.5 and 14, an 11 px sans-serif). */
  characterWidthPixels?: number;
  lineHeightPixels?: number;
  /** Boxes to keep clear of (e.g. panels over the map). */
  avoid?: readonly LabelBox[];
}

/** Offset of the label's top-left corner from its anchor on the curve (mirrored where the label would leave the view). */
export const LABEL_OFFSET_PIXELS = { x: 4, y: 2 } as const;

export interface PlacedLabel {
  /** The point on the curve the label belongs to. */
  anchorXPixels: number;
  anchorYPixels: number;
  /** Top-left corner of the label text, inside the view. */
  xPixels: number;
  yPixels: number;
}

/** Where a walk along the polyline (from its start, or from its end) first reaches the inner box. */
export function curveEntryPoint(
  flat: readonly number[],
  fromEnd: boolean,
  box: { minX: number; maxX: number; minY: number; maxY: number },
): { xPixels: number; yPixels: number } | undefined {
  const count = flat.length / 2;
  const at = (i: number): [number, number] => {
    const k = fromEnd ? count - 1 - i : i;
    return [flat[2 * k], flat[2 * k + 1]];
  };
  const inside = (x: number, y: number): boolean => x >= box.minX && x <= box.maxX && y >= box.minY && y <= box.maxY;
  for (let i = 0; i < count; i += 1) {
    const [ax, ay] = at(i);
    if (inside(ax, ay)) return { xPixels: ax, yPixels: ay };
    if (i + 1 >= count) break;
    const [bx, by] = at(i + 1);
    // Liang–Barsky: the parameter where segment a→b enters the box, if it does.
    let enter = 0;
    let leave = 1;
    const dx = bx - ax;
    const dy = by - ay;
    const clip = (p: number, q: number): boolean => {
      if (p === 0) return q >= 0;
      const r = q / p;
      if (p < 0) enter = Math.max(enter, r);
      else leave = Math.min(leave, r);
      return true;
    };
    const ok =
      clip(-dx, ax - box.minX) && clip(dx, box.maxX - ax) && clip(-dy, ay - box.minY) && clip(dy, box.maxY - ay) && enter <= leave;
    if (ok) return { xPixels: ax + enter * dx, yPixels: ay + enter * dy };
  }
  return undefined;
}

function overlaps(a: LabelBox, b: LabelBox): boolean {
  return a.xPixels < b.xPixels + b.widthPixels && b.xPixels < a.xPixels + a.widthPixels && a.yPixels < b.yPixels + b.heightPixels && b.yPixels < a.yPixels + a.heightPixels;
}

/** Each request's label (in input order), or undefined where no clear place was found. */
export function placeCurveLabels(requests: readonly LabelRequest[], options: LabelPlacementOptions): Array<PlacedLabel | undefined> {
  const { widthPixels, heightPixels, insetPixels } = options;
  const characterWidth = options.characterWidthPixels ?? 6.5;
  const lineHeight = options.lineHeightPixels ?? 14;
  const box = { minX: insetPixels, maxX: widthPixels - insetPixels, minY: insetPixels, maxY: heightPixels - insetPixels };
  const placed: LabelBox[] = [...(options.avoid ?? [])];
  const result: Array<PlacedLabel | undefined> = requests.map(() => undefined);
  const order = requests.map((_, i) => i).sort((i, j) => requests[j].priority - requests[i].priority || i - j);
  for (const i of order) {
    const request = requests[i];
    const width = characterWidth * request.text.length + 4;
    for (const flat of request.polylinesPixels) {
      if (flat.length < 4 || result[i] !== undefined) continue;
      for (const fromEnd of [false, true]) {
        const anchor = curveEntryPoint(flat, fromEnd, box);
        if (anchor === undefined) continue;
        let x = anchor.xPixels + LABEL_OFFSET_PIXELS.x;
        let y = anchor.yPixels + LABEL_OFFSET_PIXELS.y;
        if (x + width > widthPixels) x = anchor.xPixels - LABEL_OFFSET_PIXELS.x - width;
        if (y + lineHeight > heightPixels) y = anchor.yPixels - LABEL_OFFSET_PIXELS.y - lineHeight;
        const label: LabelBox = { xPixels: x, yPixels: y, widthPixels: width, heightPixels: lineHeight };
        if (x < 0 || y < 0 || placed.some((other) => overlaps(label, other))) continue;
        placed.push(label);
        result[i] = { anchorXPixels: anchor.xPixels, anchorYPixels: anchor.yPixels, xPixels: x, yPixels: y };
        break;
      }
    }
  }
  return result;
}
