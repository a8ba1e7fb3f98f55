// The site picture under the map: one Konva shape that draws the decoded picture through its canvas matrix.
// Units: the picture's own pixels in, map pixels out through the one MapScale.
import { Shape } from 'react-konva';
import type { MapScale } from './mapScale';
import { sitePictureMatrix, type MapSitePicture } from './sitePictureTransform';

export function SitePictureImage({ picture, scale }: { picture: MapSitePicture; scale: MapScale }) {
  const matrix = sitePictureMatrix(picture.affine, scale);
  return (
    <Shape
      listening={false}
      opacity={picture.opacity}
      sceneFunc={(context) => {
        context.transform(...matrix);
        context.drawImage(picture.image, 0, 0);
      }}
    />
  );
}
