// Sizes of the workspace's panels around the map (left: array and settings, right: events and fix log, bottom: recording
// under the left panel and the map),
// their defaults for a window and their limits, so the map always keeps the larger share. Pixels (CSS). Pure.

export interface PanelLayout {
  leftPixels: number;
  rightPixels: number;
  bottomPixels: number;
  leftOpen: boolean;
  rightOpen: boolean;
  bottomOpen: boolean;
}

/** Width of a collapsed side panel and height of a collapsed bottom panel: room for its title bar. */
export const COLLAPSED_PIXELS = 30;
export const SPLITTER_PIXELS = 6;
const MIN_SIDE_PIXELS = 260;
const MIN_BOTTOM_PIXELS = 160;
/** The map keeps at least this share of the window's width and of the height below the toolbar. */
const MIN_MAP_WIDTH_SHARE = 0.36;
const MIN_MAP_HEIGHT_SHARE = 0.4;

function clamp(value: number, low: number, high: number): number {
  return Math.min(Math.max(value, low), Math.max(low, high));
}

/**
 * Defaults: the microphone table (label, east, north, up, sigma, remove) needs about 410 px, the fix log's key columns about
 * 380 px; the recording, under the map and the left panel, gets 40 % of the height up to 290 px (three lanes at 720 px), the map the rest: the largest panel.
 */
export function defaultPanelLayout(widthPixels: number, heightPixels: number): PanelLayout {
  return clampPanelLayout({
    leftPixels: widthPixels >= 1400 ? 410 : 330,
    rightPixels: widthPixels >= 1400 ? 380 : 340,
    bottomPixels: Math.round(clamp(0.4 * heightPixels, 250, 290)),
    leftOpen: true,
    rightOpen: true,
    bottomOpen: true,
  }, widthPixels, heightPixels);
}

/** The layout within its limits for a window: each panel at least its minimum, and the map at least its share. */
export function clampPanelLayout(layout: PanelLayout, widthPixels: number, heightPixels: number): PanelLayout {
  const minMapWidth = MIN_MAP_WIDTH_SHARE * widthPixels;
  const sideRoom = widthPixels - minMapWidth - 2 * SPLITTER_PIXELS;
  const other = (open: boolean, pixels: number) => (open ? pixels : COLLAPSED_PIXELS);
  const leftPixels = Math.round(clamp(layout.leftPixels, MIN_SIDE_PIXELS, sideRoom - other(layout.rightOpen, MIN_SIDE_PIXELS)));
  const rightPixels = Math.round(clamp(layout.rightPixels, MIN_SIDE_PIXELS, sideRoom - other(layout.leftOpen, leftPixels)));
  const bottomPixels = Math.round(clamp(layout.bottomPixels, MIN_BOTTOM_PIXELS, (1 - MIN_MAP_HEIGHT_SHARE) * heightPixels));
  return { ...layout, leftPixels, rightPixels, bottomPixels };
}

/** CSS grid tracks of the workspace body for a layout: columns left | splitter | map | splitter | right, rows map | splitter | bottom. */
export function panelGridTracks(layout: PanelLayout): { columns: string; rows: string } {
  const left = layout.leftOpen ? `${layout.leftPixels}px` : `${COLLAPSED_PIXELS}px`;
  const right = layout.rightOpen ? `${layout.rightPixels}px` : `${COLLAPSED_PIXELS}px`;
  const bottom = layout.bottomOpen ? `${layout.bottomPixels}px` : `${COLLAPSED_PIXELS}px`;
  return { columns: `${left} ${SPLITTER_PIXELS}px minmax(0, 1fr) ${SPLITTER_PIXELS}px ${right}`, rows: `minmax(0, 1fr) ${SPLITTER_PIXELS}px ${bottom}` };
}
