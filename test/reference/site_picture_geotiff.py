"""Writes the small GeoTIFF fixtures of test/fixtures/sitePicture with known georeferences (no GDAL: TIFF tags by hand).

TIFF 6.0 baseline (uncompressed RGB, one strip, little-endian) plus the GeoTIFF tags of OGC GeoTIFF 1.1 (19-008r4):
ModelPixelScale 33550, ModelTiepoint 33922, ModelTransformation 34264, GeoKeyDirectory 34735.
Run: python3 test/reference/site_picture_geotiff.py  (writes the .tif files; the tests read them with the geotiff package).
The picture is an invented pattern: four coloured quadrants and a black pixel at column 10, row 6.
"""
import os
import struct

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, '..', 'fixtures', 'sitePicture')
WIDTH, HEIGHT = 40, 30

SHORT, LONG, DOUBLE = 3, 4, 12
SIZES = {SHORT: 2, LONG: 4, DOUBLE: 8}
FORMATS = {SHORT: 'H', LONG: 'I', DOUBLE: 'd'}


def pixels():
    rows = []
    for row in range(HEIGHT):
        line = bytearray()
        for column in range(WIDTH):
            left, top = column < WIDTH // 2, row < HEIGHT // 2
            colour = (220, 40, 40) if top and left else (40, 160, 60) if top else (40, 80, 220) if left else (240, 200, 40)
            if (column, row) == (10, 6):
                colour = (0, 0, 0)
            line += bytes(colour)
        rows.append(bytes(line))
    return b''.join(rows)


def write_tiff(path, geo_tags):
    data = pixels()
    tags = {
        256: (LONG, [WIDTH]), 257: (LONG, [HEIGHT]), 258: (SHORT, [8, 8, 8]), 259: (SHORT, [1]), 262: (SHORT, [2]),
        273: (LONG, [0]), 277: (SHORT, [3]), 278: (LONG, [HEIGHT]), 279: (LONG, [len(data)]), 284: (SHORT, [1]),
    }
    tags.update(geo_tags)
    ordered = sorted(tags.items())
    ifd_offset = 8
    ifd_size = 2 + 12 * len(ordered) + 4
    extra_offset = ifd_offset + ifd_size
    extra = bytearray()
    entries = []
    # Pixel data goes after the out-of-line tag values; its offset is fixed up once their size is known.
    for tag, (kind, values) in ordered:
        payload = struct.pack('<' + FORMATS[kind] * len(values), *values)
        if len(payload) <= 4:
            entries.append([tag, kind, len(values), payload.ljust(4, b'\0'), None])
        else:
            if (extra_offset + len(extra)) % 2:
                extra += b'\0'
            entries.append([tag, kind, len(values), None, extra_offset + len(extra)])
            extra += payload
    strip_offset = extra_offset + len(extra)
    out = bytearray(b'II*\0' + struct.pack('<I', ifd_offset))
    out += struct.pack('<H', len(entries))
    for tag, kind, count, inline, offset in entries:
        if tag == 273:
            inline = struct.pack('<I', strip_offset)
        out += struct.pack('<HHI', tag, kind, count) + (inline if inline is not None else struct.pack('<I', offset))
    out += struct.pack('<I', 0)
    out += extra
    out += data
    with open(path, 'wb') as handle:
        handle.write(out)


def geokeys(*pairs):
    values = [1, 1, 0, len(pairs)]
    for key, value in pairs:
        values += [key, 0, 1, value]
    return (SHORT, values)


os.makedirs(OUT, exist_ok=True)
# UTM zone 33 north (EPSG:32633), PixelIsArea: raster (0, 0), the top-left corner of the first pixel, at E 437000, N 5753000; 0.5 m pixels.
write_tiff(os.path.join(OUT, 'site-utm33n.tif'), {
    33550: (DOUBLE, [0.5, 0.5, 0.0]),
    33922: (DOUBLE, [0.0, 0.0, 0.0, 437000.0, 5753000.0, 0.0]),
    34735: geokeys((1024, 1), (1025, 1), (3072, 32633), (3076, 9001)),
})
# WGS84 (EPSG:4326), PixelIsPoint, a ModelTransformation turned by 30 degrees: x = lon, y = lat of the first pixel's centre.
import math
c, s, step = math.cos(math.radians(30)), math.sin(math.radians(30)), 1e-5
write_tiff(os.path.join(OUT, 'site-wgs84-turned.tif'), {
    34264: (DOUBLE, [step * c, step * s, 0.0, 14.085, -step * s, -step * c, 0.0, 51.926, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 1.0]),
    34735: geokeys((1024, 2), (1025, 2), (2048, 4326), (2054, 9102)),
})
# British National Grid (EPSG:27700): a CRS Whence refuses, with a message naming it.
write_tiff(os.path.join(OUT, 'site-epsg27700.tif'), {
    33550: (DOUBLE, [1.0, 1.0, 0.0]),
    33922: (DOUBLE, [0.0, 0.0, 0.0, 530000.0, 180000.0, 0.0]),
    34735: geokeys((1024, 1), (1025, 1), (3072, 27700)),
})
print('wrote', sorted(os.listdir(OUT)))
