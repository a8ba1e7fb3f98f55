import { describe, expect, it } from 'vitest';
import { emptyProjectDocument, readProjectText, serializeProjectDocument, SITE_PICTURE_LIMITS, sitePictureSchema } from '../../../core/project';

const PICTURE = {
  name: 'plan.png',
  mediaType: 'image/png',
  dataBase64: 'iVBORw0KGgo=',
  widthPixels: 300,
  heightPixels: 200,
  affine: { xPerColumn: 0.5, yPerColumn: 0, xPerRow: 0, yPerRow: -0.5, xOfFirstPixel: -75, yOfFirstPixel: 50 },
  placedBy: 'two-points',
  frameText: 'two pinned points',
  opacity: 0.8,
} as const;

describe('sitePictureSchema', () => {
  it('accepts a placed picture and refuses one whose bytes are not base64, too many or whose placement has no area', () => {
    expect(sitePictureSchema.parse(PICTURE)).toEqual(PICTURE);
    expect(sitePictureSchema.safeParse({ ...PICTURE, dataBase64: 'not base64!' }).success).toBe(false);
    expect(sitePictureSchema.safeParse({ ...PICTURE, mediaType: 'image/gif' }).success).toBe(false);
    expect(sitePictureSchema.safeParse({ ...PICTURE, opacity: 1.5 }).success).toBe(false);
    expect(sitePictureSchema.safeParse({ ...PICTURE, affine: { ...PICTURE.affine, yPerRow: 0 } }).success).toBe(false);
    // 20 MiB of bytes is 4/3 as many base64 characters (RFC 4648); one group more is refused with the limit in words.
    const limitChars = Math.ceil(SITE_PICTURE_LIMITS.maxBytes / 3) * 4;
    expect(sitePictureSchema.safeParse({ ...PICTURE, dataBase64: 'A'.repeat(limitChars) }).success).toBe(true);
    const over = sitePictureSchema.safeParse({ ...PICTURE, dataBase64: 'A'.repeat(limitChars + 4) });
    expect(over.success).toBe(false);
    expect(over.error?.issues[0]?.message).toBe('a site picture is at most 20 MiB');
    const tooMany = sitePictureSchema.safeParse({ ...PICTURE, widthPixels: 10_000, heightPixels: 5_000 });
    expect(tooMany.error?.issues[0]?.message).toBe('a site picture has at most 40 million pixels');
  });
});

describe('a project with a site picture', () => {
  it('saves the picture with the project and reads it back; a project without one loads without one', () => {
    const document = { ...emptyProjectDocument('site'), sitePicture: { ...PICTURE } };
    const text = serializeProjectDocument(document);
    expect(readProjectText(text, 'site.whence').document.sitePicture).toEqual(PICTURE);
    expect(readProjectText(serializeProjectDocument(emptyProjectDocument('bare')), 'bare.whence').document.sitePicture).toBeUndefined();
    const broken = text.replace('"opacity": 0.8', '"opacity": 2');
    expect(() => readProjectText(broken, 'site.whence')).toThrow(/sitePicture\.opacity/);
  });
});
