import { describe, expect, it } from 'vitest';
import { clampPanelLayout, COLLAPSED_PIXELS, defaultPanelLayout, panelGridTracks } from '../../../renderer/workspace/panelLayout';

// Expected values: the limits are this project's choices (issue 10, defect 7): the map keeps at least 36 % of the width and
// 40 % of the height; side panels at least 260 px, the bottom panel at least 160 px.
describe('panel layout', () => {
  it('defaultPanelLayout() leaves the map the largest panel at 1440 x 900 and at 1280 x 720', () => {
    for (const [w, h] of [[1440, 900], [1280, 720]] as const) {
      const layout = defaultPanelLayout(w, h);
      const mapWidth = w - layout.leftPixels - layout.rightPixels - 12;
      expect(mapWidth).toBeGreaterThan(layout.leftPixels);
      expect(mapWidth).toBeGreaterThan(layout.rightPixels);
      expect(layout.bottomPixels).toBeLessThan(0.6 * h);
    }
  });

  it('clampPanelLayout() keeps a dragged side panel from squeezing the map below its share', () => {
    const layout = clampPanelLayout({ ...defaultPanelLayout(1440, 900), leftPixels: 1200 }, 1440, 900);
    expect(1440 - layout.leftPixels - layout.rightPixels - 12).toBeGreaterThanOrEqual(0.36 * 1440 - 1);
    expect(clampPanelLayout({ ...layout, rightPixels: 10, bottomPixels: 5000 }, 1440, 900)).toMatchObject({ rightPixels: 260, bottomPixels: 540 });
  });

  it('panelGridTracks() gives a collapsed panel only its title bar', () => {
    const tracks = panelGridTracks({ ...defaultPanelLayout(1440, 900), leftOpen: false, bottomOpen: false });
    expect(tracks.columns.startsWith(`${COLLAPSED_PIXELS}px 6px minmax(0, 1fr)`)).toBe(true);
    expect(tracks.rows).toBe(`minmax(0, 1fr) 6px ${COLLAPSED_PIXELS}px`);
  });
});
