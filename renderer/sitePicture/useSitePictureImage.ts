// Decodes the project's site picture (base64 PNG/JPEG) into an image the map can draw, once per picture, not per opacity change.
import { useEffect, useMemo, useState } from 'react';
import type { SitePicture } from '../../core/project';
import type { MapSitePicture } from '../map';
import { base64ToBytes } from './base64';

export function useSitePictureImage(picture: SitePicture | undefined): MapSitePicture | undefined {
  const [decoded, setDecoded] = useState<{ data: string; image: HTMLImageElement } | undefined>(undefined);
  const data = picture?.dataBase64;
  const mediaType = picture?.mediaType;
  useEffect(() => {
    if (data === undefined || mediaType === undefined) {
      setDecoded(undefined);
      return undefined;
    }
    const url = URL.createObjectURL(new Blob([base64ToBytes(data)], { type: mediaType }));
    const image = new Image();
    let live = true;
    image.onload = () => { if (live) setDecoded({ data, image }); };
    image.src = url;
    return () => {
      live = false;
      URL.revokeObjectURL(url);
    };
  }, [data, mediaType]);
  return useMemo(() => {
    if (picture === undefined || decoded === undefined || decoded.data !== picture.dataBase64) return undefined;
    return { image: decoded.image, widthPixels: picture.widthPixels, heightPixels: picture.heightPixels, affine: picture.affine, opacity: picture.opacity };
  }, [picture, decoded]);
}
