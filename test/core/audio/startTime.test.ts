import { describe, expect, it } from 'vitest';
import { formatStartTime, memoryByteSource, readWavInfo, type WavInfo } from '../../../core/audio';
import { bextBody, buildWav, chunk, type BextSpec } from '../../helpers/wavBuilder';

function withBext(bext: BextSpec, sampleRateHz = 48000): Promise<WavInfo> {
  return readWavInfo(memoryByteSource(buildWav({ channelCount: 1, sampleRateHz, bitsPerSample: 16, data: new Uint8Array(4), beforeFmt: [chunk('bext', bextBody(bext))] })));
}

describe('BWF start time (bext OriginationDate, OriginationTime, TimeReference)', () => {
  // Expected times: test/reference/wav_start_times.py (Python datetime, exact fractions), computed.
  it.each([
    ['2026-05-17', 48000, 727212000, '2026-05-17T04:12:30.250'],
    ['2024-02-28', 44100, 3810262050, '2024-02-29T00:00:00.500'],
    ['2025-12-31', 48000, 4147200000, '2026-01-01T00:00:00.000'],
    ['2023-03-09', 44100, 1906354567, '2023-03-09T12:00:27.995'],
  ])('readWavInfo() starts a %s recording at %i Hz with TimeReference %i at %s', async (date, rate, timeReference, expected) => {
    const info = await withBext({ originationDate: date, originationTime: '00:00:00', timeReferenceFrames: timeReference }, rate);
    expect(info.startTime).toMatchObject({ isoLocal: expected, basis: 'time-reference', timeReferenceFrames: timeReference, framesSinceMidnight: timeReference, sampleRateHz: rate });
  });

  it('readWavInfo() uses OriginationTime when TimeReference is 0', async () => {
    const info = await withBext({ originationDate: '2025-12-31', originationTime: '23:59:59', timeReferenceFrames: 0 });
    // test/reference/wav_start_times.py: 23:59:59 at 48 kHz
    expect(info.startTime).toMatchObject({ isoLocal: '2025-12-31T23:59:59.000', basis: 'origination-time', framesSinceMidnight: 4147152000, originationTime: '23:59:59' });
  });

  it.each([
    ['2026-05-17', '04:12:30'], ['2026_05_17', '04_12_30'], ['2026:05:17', '04:12:30'], ['2026.05.17', '04.12.30'], ['2026 05 17', '04 12 30'], ['2026/05/17', '04-12-30'],
  ])('readWavInfo() accepts the separators of %s %s', async (date, time) => {
    const info = await withBext({ originationDate: date, originationTime: time });
    expect(info.startTime?.isoLocal).toBe('2026-05-17T04:12:30.000');
    expect(info.startTime?.dateIso).toBe('2026-05-17');
  });

  it('formatStartTime() gives the local time of any frame, to the millisecond', async () => {
    const info = await withBext({ originationDate: '2026-07-01', timeReferenceFrames: 3600 * 96000 + 1 }, 96000);
    if (info.startTime === undefined) throw new Error('expected a start time');
    // test/reference/wav_start_times.py: 3600 s + 48000 frames at 96 kHz -> 01:00:00.500
    expect(formatStartTime(info.startTime, 47999)).toBe('2026-07-01T01:00:00.500');
    expect(formatStartTime(info.startTime, 96000 * 86400)).toBe('2026-07-02T01:00:00.000');
  });

  it('readWavInfo() warns and gives no start time for an impossible date, and says nothing for an empty bext', async () => {
    const bad = await withBext({ originationDate: '2026-02-30', originationTime: '10:00:00' });
    expect(bad.startTime).toBeUndefined();
    expect(bad.warnings.join(' ')).toMatch(/'2026-02-30' is not a date/);
    const leap = await withBext({ originationDate: '2024-02-29', originationTime: '10:00:00' });
    expect(leap.startTime?.isoLocal).toBe('2024-02-29T10:00:00.000');
    const empty = await withBext({ description: 'no clock' });
    expect(empty.startTime).toBeUndefined();
    expect(empty.warnings).toEqual([]);
    expect(empty.bextDescription).toBe('no clock');
  });

  it('readWavInfo() warns when a time is given without a date, or the time is not a time', async () => {
    const noDate = await withBext({ originationTime: '10:00:00', timeReferenceFrames: 48000 });
    expect(noDate.startTime).toBeUndefined();
    expect(noDate.warnings.join(' ')).toMatch(/no OriginationDate/);
    const badTime = await withBext({ originationDate: '2026-05-17', originationTime: '25:61:00' });
    expect(badTime.startTime).toBeUndefined();
    expect(badTime.warnings.join(' ')).toMatch(/'25:61:00' is not a time/);
  });

  it('readWavInfo() reads the date and time of a bext chunk too short to hold TimeReference', async () => {
    const info = await withBext({ originationDate: '2026-05-17', originationTime: '06:00:00', timeReferenceFrames: 999, truncateToBytes: 340 });
    expect(info.startTime).toMatchObject({ isoLocal: '2026-05-17T06:00:00.000', basis: 'origination-time', timeReferenceFrames: 0 });
  });
});

describe('BWF start time from untrusted bext fields', () => {
  // Expected times: test/reference/wav_start_times.py (Python datetime, exact fractions), computed. These need the high
  // 32-bit word of TimeReference: dropping it gives 2026-05-17T00:00:00.257 and 2026-05-17T00:00:00.000 instead.
  it.each([
    ['2026-05-17', 48000, 2 ** 32 + 12345, '2026-05-18T00:51:18.743'],
    ['2026-05-17', 192000, 3 * 2 ** 32 + 7, '2026-05-17T18:38:28.864'],
  ])('readWavInfo() reads a %s TimeReference at or above 2^32 (%i Hz, %i frames) with its high word: %s', async (date, rate, timeReference, expected) => {
    const info = await withBext({ originationDate: date, originationTime: '00:00:00', timeReferenceFrames: timeReference }, rate);
    expect(info.startTime).toMatchObject({ isoLocal: expected, timeReferenceFrames: timeReference, framesSinceMidnight: timeReference });
  });

  // Expected: this project's rule (issue 11): a start past 9999-12-31 (ISO 8601 four-digit years) is dropped with a warning.
  it.each([
    ['2026-05-17', 2 ** 63],
    ['2026-05-17', 2 ** 64 - 2 ** 12],
    ['9999-12-31', 86_400 * 48_000],
  ])('readWavInfo() drops the start time of a %s recording whose TimeReference is %d frames, with a warning, never NaN', async (date, timeReference) => {
    const info = await withBext({ originationDate: date, originationTime: '00:00:00', timeReferenceFrames: timeReference });
    expect(info.startTime).toBeUndefined();
    expect(info.warnings.join(' ')).toMatch(/TimeReference .* puts the start of the recording beyond the year 9999, so the start time was dropped/);
    expect(info.warnings.join(' ')).not.toMatch(/NaN/);
  });

  it('readWavInfo() keeps a start time on the last day of 9999', async () => {
    const info = await withBext({ originationDate: '9999-12-31', originationTime: '00:00:00', timeReferenceFrames: 86_399 * 48_000 });
    // 86399 s after midnight is 23:59:59 (common practice).
    expect(info.startTime?.isoLocal).toBe('9999-12-31T23:59:59.000');
  });

  it('readWavInfo() quotes a bext date holding control characters escaped', async () => {
    const info = await withBext({ originationDate: '\u001b[2J20-1', originationTime: '10:00:00' });
    expect(info.startTime).toBeUndefined();
    expect(info.warnings.join(' ')).toContain("OriginationDate '\\x1b[2J20-1' is not a date");
    expect(info.warnings.join(' ')).not.toContain('\u001b');
  });
});
