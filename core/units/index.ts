// Unit conversions with the unit in every name (design.md, house style).
// Angles are branded so that degrees and radians cannot be mixed silently.

export type Radians = number & { readonly __unit: 'radians' };
export type Degrees = number & { readonly __unit: 'degrees' };

export function degreesToRadians(angleDegrees: number): Radians {
  return ((angleDegrees * Math.PI) / 180) as Radians;
}

export function radiansToDegrees(angleRadians: number): Degrees {
  return ((angleRadians * 180) / Math.PI) as Degrees;
}

export function secondsToFrames(durationSeconds: number, sampleRateHz: number): number {
  return durationSeconds * sampleRateHz;
}

export function framesToSeconds(frameCount: number, sampleRateHz: number): number {
  return frameCount / sampleRateHz;
}

export function celsiusToKelvin(temperatureCelsius: number): number {
  return temperatureCelsius + 273.15;
}

export { maxOf, minOf } from './extremes';
