// An invented test scene (core/simulate) shared by the CLI and browser tests: four microphones 40 m apart, two sounds
// inside the array, and the same microphones in WGS84 (east/north/up of M1 at 51.5° N, 2.5° W; test/reference/cli_reference.py).
import type { SceneSpec } from '../../core/simulate';

export const squareSiteScene: SceneSpec = {
  sampleRateHz: 48_000, durationSeconds: 6, seed: 21, speedMetersPerSecond: 343,
  microphones: [[0, 0, 1], [40, 0, 1.5], [40, 40, 1], [0, 40, 2]].map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: u! })),
  sources: [
    { id: 'a', kind: 'fm-call', eastMeters: 12, northMeters: 25, upMeters: 1.2, emissionTimeSeconds: 1.5, levelDb: -8, durationSeconds: 0.2, startFrequencyHz: 2000, endFrequencyHz: 3500 },
    { id: 'b', kind: 'chirp', eastMeters: 28, northMeters: 10, upMeters: 1.2, emissionTimeSeconds: 3.8, levelDb: -8, startFrequencyHz: 1000, endFrequencyHz: 6000, durationSeconds: 0.1 },
  ],
  background: { noiseLevelDb: -60, noiseColor: 'pink' },
};

/** The scene's microphones as a WGS84 array table. */
export const SQUARE_SITE_ARRAY_WGS84_CSV = 'channel,label,lat,lon,alt_m,sigma_m\n1,M1,51.5,-2.5,101,0.02\n2,M2,51.499999999,-2.499423977,101.5001,0.02\n3,M3,51.500359518,-2.499423972,101.0003,0.02\n4,M4,51.500359519,-2.5,102.0001,0.02\n';
