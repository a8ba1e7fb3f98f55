// Seeded pseudo-random numbers for Monte Carlo: uniform in [0, 1) and standard normal deviates (unitless).
// Generator: mulberry32 (T. Ettinger, public domain); normals by the Box-Muller transform (1958).

export interface SeededRandom {
  /** Uniform in [0, 1). */
  uniform(): number;
  /** Standard normal (mean 0, sigma 1). */
  normal(): number;
}

/** A replayable generator: the same seed gives the same sequence. */
export function seededRandom(seed: number): SeededRandom {
  let state = (Math.trunc(seed) ^ 0x9e3779b9) >>> 0;
  let spare: number | undefined;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (): number => {
    if (spare !== undefined) {
      const value = spare;
      spare = undefined;
      return value;
    }
    let u = uniform();
    while (u === 0) u = uniform();
    const v = uniform();
    const radius = Math.sqrt(-2 * Math.log(u));
    spare = radius * Math.sin(2 * Math.PI * v);
    return radius * Math.cos(2 * Math.PI * v);
  };
  return { uniform, normal };
}
