import { describe, expect, it } from 'vitest';
import type { FixLogEntry } from '../../../core/project';
import { clockOf, fixLogRows, formatAxis, formatResidual, signed } from '../../../renderer/fixlog/fixLogRows';

const entry: FixLogEntry = {
  id: 'x', recording: { name: 'site.wav', sizeBytes: 1000 }, eventIndex: 4, emissionTimeSeconds: 12.41849, firstArrivalSeconds: 12.5, localTime: '2024-05-18T04:12:12.460', status: 'ambiguous',
  // IOGP Guidance Note 7-2 (EPSG 9837 example): E -189013.869, N -128642.040, U -4220.171 m about 55°N 5°E h 200 m
  // is 53°48'33.82"N 2°07'46.38"E (53.809394°, 2.129550°).
  eastMeters: -189013.869, northMeters: -128642.04, upMeters: -4220.171,
  ellipse: { semiMajorMeters: 5.261984, semiMinorMeters: 1.506269, majorAxisDegreesFromEast: 22.5, confidence: 0.95 },
  residualRmsSeconds: 8.52e-5, pairsUsed: 6, label: '', note: '', accepted: false, warnings: ['mirror solution'],
  verdict: { grade: 'doubtful', reason: 'Two spots fit equally: check the other one.' },
};

describe('fixLogRows()', () => {
  it('fixLogRows() shows times, the local and WGS84 position, the ellipse and the quality of an entry', () => {
    const [row] = fixLogRows([entry], { latitudeDegrees: 55, longitudeDegrees: 5, heightMeters: 200 });
    expect(row).toMatchObject({
      eventNumber: 5, emissionText: '12.418', clockText: '04:12:12.460', eastText: '−189013.87', northText: '−128642.04',
      latLonText: '53.809394, 2.129550', axesText: '5.26 × 1.51', angleText: '23', confidenceText: '95 %',
      statusText: 'ambiguous', statusTone: 'doubtful', residualText: '85.2 µs', pairsText: '6', peakRatioText: '—', accepted: false,
      // The verdict kept with the entry, its symbol and Okabe-Ito colour (renderer/verdict).
      verdict: 'doubtful', verdictText: '△ doubtful', verdictColour: '#e69f00', verdictReason: 'Two spots fit equally: check the other one.',
    });
    expect(row!.warnings).toEqual(['mirror solution']);
  });

  it('fixLogRows() shows dashes for what a failed fix lacks, and no latitude/longitude without an origin', () => {
    const failed: FixLogEntry = { id: 'y', recording: { name: 'site.wav', sizeBytes: 1000 }, eventIndex: 0, firstArrivalSeconds: 3.25, status: 'insufficient', verdict: { grade: 'unusable', reason: 'Too few usable time differences to place it.' }, pairsUsed: 0, label: '', note: '', accepted: false };
    const [row] = fixLogRows([failed], undefined);
    expect(row).toMatchObject({ emissionText: '—', arrivalText: '3.250', clockText: '—', eastText: '—', latLonText: '—', axesText: '—', residualText: '—', statusTone: 'failed', verdictText: '× unusable' });
  });
});

describe('number texts of the fix log', () => {
  it('signed() writes a true minus and no negative zero', () => {
    expect(signed(-1.234, 2)).toBe('−1.23');
    expect(signed(-0.001, 2)).toBe('0.00');
  });

  it('formatResidual() writes µs below a millisecond and never an exponent', () => {
    expect(formatResidual(5.1e-5)).toBe('51.0 µs');
    expect(formatResidual(1.2345e-3)).toBe('1.23 ms');
    expect(formatResidual(9.8e-18)).toBe('0.00 µs');
  });

  it('formatAxis() keeps about three figures without exponents', () => {
    expect([formatAxis(0.0712), formatAxis(12.345), formatAxis(1843.6)]).toEqual(['0.07', '12.3', '1844']);
  });

  it('clockOf() shows the time of day and keeps the date for the title', () => {
    expect(clockOf('2024-05-18T04:12:12.460')).toEqual({ text: '04:12:12.460', title: 'Local clock time of the first arrival: 2024-05-18 04:12:12.460' });
  });
});
