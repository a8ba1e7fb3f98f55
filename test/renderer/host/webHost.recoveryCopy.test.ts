import { afterEach, describe, expect, it } from 'vitest';
import { emptyProjectDocument, type SitePicture } from '../../../core/project';
import { createWebHost } from '../../../renderer/host/webHost';

// Expected behaviour: this project's choice (the recovery copy keeps the work without the picture when storage is full).
/** A localStorage stand-in that refuses values longer than `limitChars`, as a browser's quota does. */
function limitedStorage(limitChars: number) {
  const items = new Map<string, string>();
  return {
    getItem: (key: string) => items.get(key) ?? null,
    setItem: (key: string, value: string) => {
      if (value.length > limitChars) throw new Error('QuotaExceededError');
      items.set(key, value);
    },
    removeItem: (key: string) => void items.delete(key),
  };
}

const PICTURE: SitePicture = {
  name: 'plan.png', mediaType: 'image/png', dataBase64: 'A'.repeat(40_000), widthPixels: 300, heightPixels: 200,
  affine: { xPerColumn: 0.5, yPerColumn: 0, xPerRow: 0, yPerRow: -0.5, xOfFirstPixel: -75, yOfFirstPixel: 50 },
  placedBy: 'two-points', frameText: 'two pinned points', opacity: 0.7,
};

describe('web host writeRecoveryCopy()', () => {
  afterEach(() => {
    delete (globalThis as { localStorage?: unknown }).localStorage;
  });

  it('keeps the work without the site picture when the picture does not fit in the browser’s storage', async () => {
    (globalThis as { localStorage?: unknown }).localStorage = limitedStorage(20_000);
    const host = createWebHost();
    await host.writeRecoveryCopy({ ...emptyProjectDocument('pond'), sitePicture: PICTURE });
    const copy = await host.takeRecoveryCopy();
    expect(copy?.document.name).toBe('pond');
    expect(copy?.document.sitePicture).toBeUndefined();
  });

  it('keeps the picture when it fits', async () => {
    (globalThis as { localStorage?: unknown }).localStorage = limitedStorage(1_000_000);
    const host = createWebHost();
    await host.writeRecoveryCopy({ ...emptyProjectDocument('pond'), sitePicture: PICTURE });
    expect((await host.takeRecoveryCopy())?.document.sitePicture?.name).toBe('plan.png');
  });
});
