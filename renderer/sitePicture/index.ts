// Public face of renderer/sitePicture: choosing, placing and showing a picture of the site under the map.
export { SitePictureControl } from './SitePictureControl';
export { useSitePictureImage } from './useSitePictureImage';
export { placePicture, guessFrame, type PictureCandidate, type PlacementChoice, type PinInput } from './placePicture';
export { pictureHeader, type PictureHeader } from './pictureHeader';
export { bytesToBase64, base64ToBytes } from './base64';
