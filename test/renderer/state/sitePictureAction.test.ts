import { describe, expect, it } from 'vitest';
import { emptyProjectDocument, type SitePicture } from '../../../core/project';
import { initialWorkspace, workspaceReducer } from '../../../renderer/state/workspace';

// Expected values: the behaviour this project specifies (the picture is part of the saved document); no outside reference.
const PICTURE: SitePicture = {
  name: 'plan.png', mediaType: 'image/png', dataBase64: 'iVBORw0KGgo=', widthPixels: 300, heightPixels: 200,
  affine: { xPerColumn: 0.5, yPerColumn: 0, xPerRow: 0, yPerRow: -0.5, xOfFirstPixel: -75, yOfFirstPixel: 50 },
  placedBy: 'two-points', frameText: 'two pinned points', opacity: 0.7,
};

describe("workspaceReducer 'sitePicture/set'", () => {
  it('puts the picture in the project document (unsaved), changes its opacity and takes it out again', () => {
    const placed = workspaceReducer(initialWorkspace(emptyProjectDocument('site')), { type: 'sitePicture/set', sitePicture: PICTURE });
    expect(placed.document.sitePicture).toEqual(PICTURE);
    expect(placed.dirty).toBe(true);
    const fainter = workspaceReducer(placed, { type: 'sitePicture/set', sitePicture: { ...PICTURE, opacity: 0.3 } });
    expect(fainter.document.sitePicture?.opacity).toBe(0.3);
    const removed = workspaceReducer(fainter, { type: 'sitePicture/set', sitePicture: undefined });
    expect('sitePicture' in removed.document).toBe(false);
    expect(removed.document.array).toBe(fainter.document.array);
  });
});
