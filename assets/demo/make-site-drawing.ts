// Writes an invented site drawing of the demo's pond (no real place's imagery): a PNG and its world file in the demo
// array's local metres (0.2 m a pixel). Run: npx tsx assets/demo/make-site-drawing.ts [outFolder] (default assets/demo/out/).
// PNG per ISO/IEC 15948 (one IDAT, filter 0, zlib), world file per the ESRI convention (top-left pixel centre).
import { writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { deflateSync } from 'node:zlib';

export const SITE_DRAWING_FILES = Object.freeze({ picture: 'demo-site-drawing.png', worldFile: 'demo-site-drawing.pgw' });

const METERS_PER_PIXEL = 0.2;
const WEST = -80;
const NORTH = 65;
const WIDTH = 800;
const HEIGHT = 650;

type Rgb = readonly [number, number, number];
const MEADOW: Rgb = [226, 234, 204];
const WATER: Rgb = [170, 205, 222];
const SHORE: Rgb = [132, 176, 196];
const REEDS: Rgb = [128, 164, 94];
const TREES: Rgb = [98, 140, 92];
const PATH: Rgb = [214, 196, 160];
const TIMBER: Rgb = [150, 110, 72];
const STONE: Rgb = [150, 150, 146];

/** The colour of the invented scene at a ground point (east, north metres about the array origin). */
function sceneColour(east: number, north: number): Rgb {
  // Pond: a wobbly ellipse around the array's middle, with a darker shore line.
  const angle = Math.atan2(north, east);
  const radius = Math.hypot(east / 27, north / 21) / (1 + 0.08 * Math.sin(3 * angle) + 0.05 * Math.cos(5 * angle));
  const boardwalk = north > -26 && north < -22 && east > 8 && east < 60;
  const sluice = Math.abs(east + 2.5) < 2.5 && north > -42 && north < -19;
  const hide = Math.abs(east + 30) < 3 && Math.abs(north - 27) < 2.5;
  if (boardwalk) return Math.round(east * 2) % 3 === 0 ? [120, 86, 56] : TIMBER;
  if (sluice) return STONE;
  if (hide) return TIMBER;
  if (radius < 0.97) return WATER;
  if (radius < 1.03) return SHORE;
  // Reeds on the north shore, willow carr to the south-west, a path round the pond.
  const reeds = north > 18 && north < 48 && east > -18 && east < 28 && radius < 1.9;
  if (reeds) return (Math.round(east * 3) + Math.round(north * 5)) % 4 === 0 ? [96, 132, 70] : REEDS;
  const carr = Math.hypot(east + 40, north + 16) < 14 || Math.hypot(east + 30, north + 28) < 9 || Math.hypot(east - 38, north - 19) < 5;
  if (carr) return TREES;
  if (Math.abs(radius - 2.05) < 0.05) return PATH;
  return MEADOW;
}

function crc32(bytes: Uint8Array): number {
  let crc = 0xffffffff;
  for (const byte of bytes) {
    crc ^= byte;
    for (let k = 0; k < 8; k += 1) crc = crc & 1 ? (crc >>> 1) ^ 0xedb88320 : crc >>> 1;
  }
  return (crc ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Uint8Array): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, 'latin1');
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0);
  return Buffer.concat([head, data, crc]);
}

/** The drawing as PNG bytes (RGB, 8 bits). */
export function siteDrawingPng(): Buffer {
  const raw = Buffer.alloc(HEIGHT * (1 + 3 * WIDTH));
  for (let row = 0; row < HEIGHT; row += 1) {
    const offset = row * (1 + 3 * WIDTH);
    for (let column = 0; column < WIDTH; column += 1) {
      const colour = sceneColour(WEST + (column + 0.5) * METERS_PER_PIXEL, NORTH - (row + 0.5) * METERS_PER_PIXEL);
      raw.set(colour, offset + 1 + 3 * column);
    }
  }
  const header = Buffer.alloc(13);
  header.writeUInt32BE(WIDTH, 0);
  header.writeUInt32BE(HEIGHT, 4);
  header.set([8, 2, 0, 0, 0], 8);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', header), chunk('IDAT', deflateSync(raw)), chunk('IEND', new Uint8Array(0))]);
}

/** The world file: A, D, B, E, C, F with C, F the centre of the top-left pixel, in the array's local metres. */
export function siteDrawingWorldFile(): string {
  return [METERS_PER_PIXEL, 0, 0, -METERS_PER_PIXEL, WEST + METERS_PER_PIXEL / 2, NORTH - METERS_PER_PIXEL / 2].map((value) => value.toFixed(4)).join('\n') + '\n';
}

if (process.argv[1] !== undefined && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const folder = resolve(process.argv[2] ?? join(fileURLToPath(new URL('.', import.meta.url)), 'out'));
  writeFileSync(join(folder, SITE_DRAWING_FILES.picture), siteDrawingPng());
  writeFileSync(join(folder, SITE_DRAWING_FILES.worldFile), siteDrawingWorldFile());
  process.stdout.write(`Wrote ${SITE_DRAWING_FILES.picture} and ${SITE_DRAWING_FILES.worldFile} in ${folder}\n`);
}
