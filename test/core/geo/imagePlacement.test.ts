import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { affinePoint, enuToGeodetic, geodeticToEnu, localToPixel, placeInLocalFrame, twoPointPlacement, WGS84, type GeodeticPosition, type PixelAffine } from '../../../core/geo';
import { expectWhenceError } from './geoTestHelpers';

// An invented site origin (no real place's imagery is used; the numbers only set the latitude).
const ORIGIN: GeodeticPosition = { latitudeDegrees: 51.92503, longitudeDegrees: 14.08512, heightMeters: 96.4 };
const SIZE = { widthPixels: 801, heightPixels: 601 };

describe('placeInLocalFrame()', () => {
  it('keeps a picture already in local metres as it is', () => {
    const affine: PixelAffine = { xPerColumn: 0.1, yPerColumn: 0, xPerRow: 0, yPerRow: -0.1, xOfFirstPixel: -40, yOfFirstPixel: 30 };
    const placed = placeInLocalFrame(affine, { kind: 'local' }, SIZE, undefined, 'plan.png');
    expect(placed.affine).toEqual(affine);
    expect(placed.cornerMisfitMeters).toBe(0);
  });

  it('turns WGS84 degrees into local metres: a degree of longitude is (π/180)·N·cos φ, a pixel lands where geodeticToEnu puts it', () => {
    const stepDegrees = 1e-6;
    const affine: PixelAffine = { xPerColumn: stepDegrees, yPerColumn: 0, xPerRow: 0, yPerRow: -stepDegrees, xOfFirstPixel: ORIGIN.longitudeDegrees - 400 * stepDegrees, yOfFirstPixel: ORIGIN.latitudeDegrees + 300 * stepDegrees };
    const placed = placeInLocalFrame(affine, { kind: 'wgs84' }, SIZE, ORIGIN, 'site.png');
    // Prime vertical radius N = a / sqrt(1 − e² sin² φ); east metres per degree of longitude = (π/180)·N·cos φ (common practice).
    const phi = (ORIGIN.latitudeDegrees * Math.PI) / 180;
    const primeVerticalMeters = WGS84.semiMajorAxisMeters / Math.sqrt(1 - WGS84.eccentricitySquared * Math.sin(phi) ** 2);
    const eastPerDegree = (Math.PI / 180) * primeVerticalMeters * Math.cos(phi);
    expect(placed.affine.xPerColumn / (stepDegrees * eastPerDegree)).toBeCloseTo(1, 4);
    // The centre pixel (400, 300) is the origin itself; any pixel agrees with geodeticToEnu to a millimetre (a 55 m picture).
    const centre = affinePoint(placed.affine, 400, 300);
    expect(Math.hypot(centre.x, centre.y)).toBeLessThan(1e-3);
    const corner = geodeticToEnu({ latitudeDegrees: affine.yOfFirstPixel - 600 * stepDegrees, longitudeDegrees: affine.xOfFirstPixel + 800 * stepDegrees, heightMeters: ORIGIN.heightMeters }, ORIGIN);
    const cornerPlaced = affinePoint(placed.affine, 800, 600);
    expect(Math.hypot(cornerPlaced.x - corner.eastMeters, cornerPlaced.y - corner.northMeters)).toBeLessThan(1e-3);
    expect(placed.cornerMisfitMeters).toBeLessThan(1e-3);
  });

  it('places a UTM picture so that a ground point proj4 puts at a pixel lands at that pixel (grid convergence included)', () => {
    // UTM zone 33 north (EPSG:32633); the site lies about 1° east of the central meridian (15°E), so grid north is turned.
    const utm = proj4('+proj=longlat +datum=WGS84 +no_defs', '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs');
    const [originEasting, originNorthing] = utm.forward([ORIGIN.longitudeDegrees, ORIGIN.latitudeDegrees]) as [number, number];
    const affine: PixelAffine = { xPerColumn: 0.25, yPerColumn: 0, xPerRow: 0, yPerRow: -0.25, xOfFirstPixel: Math.round(originEasting) - 100, yOfFirstPixel: Math.round(originNorthing) + 75 };
    const placed = placeInLocalFrame(affine, { kind: 'utm', zone: 33, hemisphere: 'north' }, SIZE, ORIGIN, 'site.jpg');
    let worst = 0;
    for (const [east, north] of [[30, -20], [-60, 55], [90, -70], [0, 0]] as const) {
      // Local point -> geodetic (ours, tested against IOGP) -> UTM (proj4) -> pixel through the file's affine -> placed local.
      const geodetic = enuToGeodetic({ eastMeters: east, northMeters: north, upMeters: 0 }, ORIGIN);
      const [easting, northing] = utm.forward([geodetic.longitudeDegrees, geodetic.latitudeDegrees]) as [number, number];
      const pixel = { column: (easting - affine.xOfFirstPixel) / 0.25, row: (affine.yOfFirstPixel - northing) / 0.25 };
      const back = affinePoint(placed.affine, pixel.column, pixel.row);
      worst = Math.max(worst, Math.hypot(back.x - east, back.y - north));
    }
    expect(worst).toBeLessThan(0.01);
    // Meridian convergence γ ≈ Δλ·sin φ ≈ −0.72° here (common practice): the picture's columns are turned by it.
    const turnDegrees = (Math.atan2(placed.affine.yPerColumn, placed.affine.xPerColumn) * 180) / Math.PI;
    expect(turnDegrees).toBeCloseTo(-(ORIGIN.longitudeDegrees - 15) * Math.sin((ORIGIN.latitudeDegrees * Math.PI) / 180), 2);
  });

  it('refuses geographic coordinates without an array origin, a frame that is not the file’s, and a picture far away', () => {
    const degrees: PixelAffine = { xPerColumn: 1e-6, yPerColumn: 0, xPerRow: 0, yPerRow: -1e-6, xOfFirstPixel: 14.08, yOfFirstPixel: 51.93 };
    expectWhenceError(() => placeInLocalFrame(degrees, { kind: 'wgs84' }, SIZE, undefined, 'site.png'), 'site-picture-no-origin', ['site.png', 'no WGS84 origin', 'Microphones tab']);
    const utmNumbers: PixelAffine = { xPerColumn: 0.25, yPerColumn: 0, xPerRow: 0, yPerRow: -0.25, xOfFirstPixel: 437000, yOfFirstPixel: 5753000 };
    expectWhenceError(() => placeInLocalFrame(utmNumbers, { kind: 'wgs84' }, SIZE, ORIGIN, 'site.png'), 'site-picture-frame', ['not a longitude and latitude']);
    expectWhenceError(() => placeInLocalFrame(utmNumbers, { kind: 'utm', zone: 31, hemisphere: 'north' }, SIZE, ORIGIN, 'site.png'), 'site-picture-far', ['km from the array', 'UTM zone 31 north (EPSG:32631)']);
    expectWhenceError(() => placeInLocalFrame(utmNumbers, { kind: 'local' }, SIZE, ORIGIN, 'site.png'), 'site-picture-far', ['local metres']);
  });
});

describe('twoPointPlacement()', () => {
  it('finds the similarity through two pinned pixels: scale, rotation and shift, rows going down the picture', () => {
    // Picture turned a quarter turn: its columns run north and its rows east (a proper rotation, no mirror).
    const placed = twoPointPlacement({ column: 0, row: 0, eastMeters: 10, northMeters: 20 }, { column: 100, row: 0, eastMeters: 10, northMeters: 70 }, SIZE, 'sketch.png');
    const down = affinePoint(placed.affine, 0, 100);
    expect(down.x).toBeCloseTo(60, 9);
    expect(down.y).toBeCloseTo(20, 9);
    // North-up, 0.5 m per pixel, shifted: a plain scale and shift.
    const plain = twoPointPlacement({ column: 100, row: 200, eastMeters: 0, northMeters: 0 }, { column: 300, row: 200, eastMeters: 100, northMeters: 0 }, SIZE, 'plan.png');
    expect(plain.affine.xPerColumn).toBeCloseTo(0.5, 12);
    expect(plain.affine.yPerRow).toBeCloseTo(-0.5, 12);
    expect(affinePoint(plain.affine, 100, 100).y).toBeCloseTo(50, 9);
    // Both pinned points come back exactly, and localToPixel inverts the placement.
    const turned = twoPointPlacement({ column: 12.5, row: 40, eastMeters: -3, northMeters: 8 }, { column: 700, row: 500, eastMeters: 150, northMeters: -60 }, SIZE, 'plan.png');
    const second = affinePoint(turned.affine, 700, 500);
    expect(second.x).toBeCloseTo(150, 9);
    expect(second.y).toBeCloseTo(-60, 9);
    const pixel = localToPixel(turned.affine, -3, 8);
    expect(pixel.column).toBeCloseTo(12.5, 9);
    expect(pixel.row).toBeCloseTo(40, 9);
  });

  it('refuses the same pixel twice and the same ground position twice', () => {
    expectWhenceError(() => twoPointPlacement({ column: 5, row: 5, eastMeters: 0, northMeters: 0 }, { column: 5, row: 5, eastMeters: 10, northMeters: 0 }, SIZE, 'p.png'), 'site-picture-points', ['the same pixel', 'far apart']);
    expectWhenceError(() => twoPointPlacement({ column: 5, row: 5, eastMeters: 3, northMeters: 4 }, { column: 90, row: 5, eastMeters: 3, northMeters: 4 }, SIZE, 'p.png'), 'site-picture-points', ['same ground position']);
  });
});
