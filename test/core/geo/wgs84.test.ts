import { describe, expect, it } from 'vitest';
import { WGS84 } from '../../../core/geo';

describe('WGS84', () => {
  it('has a = 6378137 m and 1/f = 298.257223563, and the derived b and e² of the standard', () => {
    // NIMA TR8350.2 (check-values.md): a = 6378137 m, 1/f = 298.257223563
    expect(WGS84.semiMajorAxisMeters).toBe(6378137);
    expect(WGS84.inverseFlattening).toBe(298.257223563);
    // NIMA TR8350.2 Table 3.3 (from memory): b = 6356752.3142 m, e² = 6.69437999014e-3, e'² = 6.73949674228e-3
    expect(WGS84.semiMinorAxisMeters).toBeCloseTo(6356752.3142, 4);
    expect(WGS84.eccentricitySquared).toBeCloseTo(6.69437999014e-3, 14);
    expect(WGS84.secondEccentricitySquared).toBeCloseTo(6.73949674228e-3, 14);
  });
});
