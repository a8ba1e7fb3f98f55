// ESRI world file (.pgw, .jgw, .tfw, .wld): six numbers A, D, B, E, C, F, one a line, of the affine from pixel to map.
// Map units are the image's CRS's (metres or degrees); column and row count from 0 at the centre of the top-left pixel.

import { WhenceError } from '../errors';
import { printableText } from '../text';

/** x = A·column + B·row + C, y = D·column + E·row + F, for the centre of pixel (column, row) (ESRI world file convention). */
export interface PixelAffine {
  /** A: map x per column. */
  xPerColumn: number;
  /** D: map y per column. */
  yPerColumn: number;
  /** B: map x per row. */
  xPerRow: number;
  /** E: map y per row (negative for a north-up image). */
  yPerRow: number;
  /** C: map x of the centre of the top-left pixel. */
  xOfFirstPixel: number;
  /** F: map y of the centre of the top-left pixel. */
  yOfFirstPixel: number;
}

const WORLD_FILE_MAX_CHARS = 4096;
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Reads a world file's six lines; WhenceError 'world-file-invalid' naming the line that is wrong. */
export function parseWorldFile(text: string, fileName: string): PixelAffine {
  const name = printableText(fileName, 120);
  if (text.length > WORLD_FILE_MAX_CHARS) throw new WhenceError('world-file-invalid', `${name} is ${text.length} characters long; a world file has six short lines of numbers. Check that you chose the world file (.pgw, .jgw or .wld) beside the image.`);
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/).map((line) => line.trim()).filter((line) => line !== '');
  if (lines.length !== 6) throw new WhenceError('world-file-invalid', `${name} has ${lines.length} non-empty line${lines.length === 1 ? '' : 's'}; a world file has exactly six (A, D, B, E, C, F: pixel size and rotation terms, then the map position of the top-left pixel's centre).`);
  const names = ['A (x pixel size)', 'D (rotation term)', 'B (rotation term)', 'E (y pixel size, negative)', 'C (x of the top-left pixel)', 'F (y of the top-left pixel)'];
  const values = lines.map((line, index) => {
    const value = NUMBER.test(line) ? Number(line) : Number.NaN;
    if (!Number.isFinite(value)) throw new WhenceError('world-file-invalid', `${name} line ${index + 1}, ${names[index]}, is "${printableText(line, 40)}", not a number. A world file holds six plain numbers with a decimal point (e.g. 0.25).`);
    return value;
  });
  const [xPerColumn, yPerColumn, xPerRow, yPerRow, xOfFirstPixel, yOfFirstPixel] = values as [number, number, number, number, number, number];
  const affine = { xPerColumn, yPerColumn, xPerRow, yPerRow, xOfFirstPixel, yOfFirstPixel };
  if (affineDeterminant(affine) === 0) throw new WhenceError('world-file-invalid', `${name} maps every pixel onto one line (its A, D, B, E give a zero area per pixel). Check the file: A and E are the pixel size, usually A > 0 and E < 0.`);
  return affine;
}

/** Map position of the centre of pixel (column, row). */
export function affinePoint(affine: PixelAffine, column: number, row: number): { x: number; y: number } {
  return { x: affine.xPerColumn * column + affine.xPerRow * row + affine.xOfFirstPixel, y: affine.yPerColumn * column + affine.yPerRow * row + affine.yOfFirstPixel };
}

/** Map area of one pixel (signed: negative for an image with rows going down the map, as usual). */
export function affineDeterminant(affine: PixelAffine): number {
  return affine.xPerColumn * affine.yPerRow - affine.xPerRow * affine.yPerColumn;
}
