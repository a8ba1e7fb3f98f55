// Input checks for core/geo: finite numbers, latitude within ±90°, longitude within ±360°.
// Throws WhenceError 'geo-invalid-position' naming the argument and field.

import { WhenceError } from '../errors';
import type { EcefPosition, EnuPosition, GeodeticPosition } from './types';

function requireFinite(argumentName: string, fieldName: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new WhenceError(
      'geo-invalid-position',
      `${argumentName}.${fieldName} is ${String(value)}, not a finite number; give it in ${unitOf(fieldName)}.`,
    );
  }
  return value;
}

function unitOf(fieldName: string): string {
  return fieldName.endsWith('Degrees') ? 'decimal degrees' : 'metres';
}

export function requireGeodetic(argumentName: string, p: GeodeticPosition): void {
  if (p === null || typeof p !== 'object') {
    throw new WhenceError('geo-invalid-position', `${argumentName} is missing; give latitudeDegrees, longitudeDegrees and heightMeters.`);
  }
  const latitude = requireFinite(argumentName, 'latitudeDegrees', p.latitudeDegrees);
  const longitude = requireFinite(argumentName, 'longitudeDegrees', p.longitudeDegrees);
  requireFinite(argumentName, 'heightMeters', p.heightMeters);
  if (latitude < -90 || latitude > 90) {
    throw new WhenceError(
      'geo-invalid-position',
      `${argumentName}.latitudeDegrees = ${latitude} is outside -90..90; check that latitude and longitude are not swapped.`,
    );
  }
  if (longitude < -360 || longitude > 360) {
    throw new WhenceError(
      'geo-invalid-position',
      `${argumentName}.longitudeDegrees = ${longitude} is outside -360..360; give the longitude in decimal degrees.`,
    );
  }
}

export function requireEcef(argumentName: string, p: EcefPosition): void {
  if (p === null || typeof p !== 'object') {
    throw new WhenceError('geo-invalid-position', `${argumentName} is missing; give xMeters, yMeters and zMeters.`);
  }
  requireFinite(argumentName, 'xMeters', p.xMeters);
  requireFinite(argumentName, 'yMeters', p.yMeters);
  requireFinite(argumentName, 'zMeters', p.zMeters);
}

export function requireEnu(argumentName: string, p: EnuPosition): void {
  if (p === null || typeof p !== 'object') {
    throw new WhenceError('geo-invalid-position', `${argumentName} is missing; give eastMeters, northMeters and upMeters.`);
  }
  requireFinite(argumentName, 'eastMeters', p.eastMeters);
  requireFinite(argumentName, 'northMeters', p.northMeters);
  requireFinite(argumentName, 'upMeters', p.upMeters);
}
