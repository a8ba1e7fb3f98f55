import { describe, expect, it } from 'vitest';
import { encodeWavFile, memoryByteSource, readWavInfo } from '../../../core/audio';
import { deploymentRecording, describeStartSources, layoutDeployment, nameTimePattern, parseDeploymentCsv, type DeploymentFileHeader } from '../../../core/deployment';
import { expectWhenceError } from '../../helpers/expectWhenceError';

const FS = 1000;

/** A mono float file whose samples are (recorder frame + 1) / 10000, with a bext start `secondsOfDay` after midnight of 2026-05-14 (or none). */
function file(firstRecorderFrame: number, frames: number, secondsOfDay: number | undefined): Uint8Array {
  const samples = Float32Array.from({ length: frames }, (_, i) => (firstRecorderFrame + i + 1) / 10000);
  const bext = secondsOfDay === undefined ? undefined : { description: '', originator: '', originationDate: '2026-05-14', originationTime: '05:00:00', timeReferenceFrames: Math.round(secondsOfDay * FS) };
  return encodeWavFile([samples], { channelCount: 1, sampleRateHz: FS, bitsPerSample: 32, sampleFormat: 'ieee-float', ...(bext ? { bext } : {}) });
}

const T0 = 5 * 3600;
const files: Record<string, Uint8Array> = {
  'a1.wav': file(0, 1000, T0), 'a2.wav': file(1000, 1000, T0 + 1.0004), // joined: stamped 0.4 ms after a1 ends
  'b1.wav': file(0, 1000, T0 + 0.5), 'b2.wav': file(1500, 1000, T0 + 2.0), // gap from 1.5 s to 2.0 s
};
const TABLE = 'recorder,file,file_channel,microphone\nA,a1.wav,1,MA\nA,a2.wav,1,MA\nB,b1.wav,1,MB\nB,b2.wav,1,MB\n';

async function layout(table = TABLE, pattern?: string, overrides: Record<string, Uint8Array> = {}) {
  const all = { ...files, ...overrides };
  const headers: DeploymentFileHeader[] = await Promise.all(Object.entries(all).filter(([name]) => table.includes(name)).map(async ([name, bytes]) => ({ file: name, baseName: name, info: await readWavInfo(memoryByteSource(bytes, name)) })));
  return { layout: layoutDeployment(parseDeploymentCsv(table, 'd.csv'), headers, pattern === undefined ? undefined : nameTimePattern(pattern)), open: (name: string) => Promise.resolve(memoryByteSource(all[name]!, name)) };
}

describe('layoutDeployment()', () => {
  it('joins a file stamped within the stamp resolution of the previous end, keeps a gap, and says where each start came from', async () => {
    const { layout: l } = await layout();
    const [a, b] = l.recorders;
    expect(a!.files.map((f) => [f.recorderFrame, f.joined])).toEqual([[0, false], [1000, true]]);
    expect(b!.clockStartSeconds).toBeCloseTo(0.5, 12);
    expect(b!.gaps).toEqual([{ fromSeconds: 1.5, toSeconds: 2.0 }]);
    expect(l.durationSeconds).toBeCloseTo(3.0, 9);
    expect(describeStartSources(l)[0]).toMatch(/a1\.wav starts 2026-05-14T05:00:00\.000000 \(bext TimeReference\)/);
  });

  it('takes start_time over bext, the file name when there is no bext, and refuses a file with no start at all', async () => {
    const noBext = { 'c1.wav': file(0, 100, undefined) };
    const overridden = await layout('recorder,file,file_channel,microphone,start_time\nA,a1.wav,1,MA,2026-05-14T04:59:59.5\n');
    expect(overridden.layout.recorders[0]!.files[0]!.startSource).toBe('start_time column');
    const named = await layout('recorder,file,file_channel,microphone\nC,c1.wav,1,MC\n', 'c1.wav', noBext).catch((error: Error) => error);
    expect(String(named)).toMatch(/YYYY/); // a pattern without tokens is refused
    const { layout: l } = await layout('recorder,file,file_channel,microphone\nC,20260514_050001_c1.wav,1,MC\n', 'YYYYMMDD_hhmmss_*', { '20260514_050001_c1.wav': file(0, 100, undefined) });
    expect(l.recorders[0]!.files[0]!.startSource).toBe('file name');
    await expect(layout('recorder,file,file_channel,microphone\nC,c1.wav,1,MC\n', undefined, noBext)).rejects.toThrow(/no BWF start time.*--name-time/);
  });

  it('refuses overlapping files of one recorder and mixed sample rates', async () => {
    const overlap = { 'a3.wav': file(0, 1000, T0 + 0.5) };
    await expect(layout('recorder,file,file_channel,microphone\nA,a1.wav,1,MA\nA,a3.wav,1,MA\n', undefined, overlap)).rejects.toThrow(/before a1\.wav ends/);
    const info = (sampleRateHz: number) => ({ sampleRateHz, channelCount: 1, frameCount: 10 }) as unknown as DeploymentFileHeader['info'];
    const table = parseDeploymentCsv('recorder,file,file_channel,microphone\nA,a1.wav,1,MA\nX,x.wav,1,MX\n', 'd.csv');
    expectWhenceError(() => layoutDeployment(table, [{ file: 'a1.wav', baseName: 'a1.wav', info: info(1000) }, { file: 'x.wav', baseName: 'x.wav', info: info(2000) }]), 'mixed-sample-rates', ['resample']);
  });
});

describe('deploymentRecording()', () => {
  it('reads a window across a file split as one continuous stream, and a gap as silence flagged in the alignment', async () => {
    const { layout: l, open } = await layout();
    const recording = deploymentRecording(l, open);
    const [a, b] = await recording.readFrames(990, 20);
    expect(Array.from(a!)).toEqual(Array.from({ length: 20 }, (_, i) => Math.fround((990 + i + 1) / 10000))); // continuous across a1/a2
    expect(b![0]).toBeCloseTo((490 + 1) / 10000, 7); // B starts 0.5 s after the origin
    const [, gapped] = await recording.readFrames(1990, 20);
    // deployment frames 1990..1999 are B's recorder frames 1490..1499, in its gap (1000..1500); then b2 begins
    expect(Array.from(gapped!.subarray(0, 10))).toEqual(new Array(10).fill(0));
    expect(gapped![10]).toBeCloseTo(1501 / 10000, 7);
    expect(recording.windowAlignment(1985, 15, 1.99).silentChannels).toEqual([1]); // A still records (to 2.0 s), B is in its gap
    expect(recording.windowAlignment(1990, 20, 1.995).silentChannels).toEqual([0, 1]); // A's recording ends at 2.0 s
    expect(recording.windowAlignment(100, 20, 0.105).silentChannels).toEqual([1]); // B had not started yet
    expect(recording.windowAlignment(600, 20, 0.605).silentChannels).toEqual([]);
  });

  it('puts each microphone of a multichannel recorder on its own deployment channel, whatever the table order', async () => {
    const ramp = Float32Array.from({ length: 1000 }, (_, i) => (i + 1) / 10000);
    const stereo = encodeWavFile([ramp, ramp.map((v) => -v)], { channelCount: 2, sampleRateHz: FS, bitsPerSample: 32, sampleFormat: 'ieee-float', bext: { description: '', originator: '', originationDate: '2026-05-14', originationTime: '05:00:00', timeReferenceFrames: T0 * FS } });
    const { layout: l, open } = await layout('recorder,file,file_channel,microphone\nC,c.wav,2,MX\nA,a1.wav,1,MA\nC,c.wav,1,MY\n', undefined, { 'c.wav': stereo });
    const channels = await deploymentRecording(l, open).readFrames(10, 1);
    const at = (label: string) => channels[l.microphones.findIndex((m) => m.label === label)]![0];
    // the samples written above: frame 10 is 11/10000 on file channel 1, its negative on channel 2
    expect(at('MX')).toBeCloseTo(-11 / 10000, 7);
    expect(at('MY')).toBeCloseTo(11 / 10000, 7);
    expect(at('MA')).toBeCloseTo(11 / 10000, 7);
  });

  it('decodes only into the caller\'s arrays, the file channels no microphone takes into a scratch it drops', async () => {
    const ramp = Float32Array.from({ length: 1000 }, (_, i) => (i + 1) / 10000);
    const stereo = encodeWavFile([ramp.map((v) => 2 * v), ramp.map((v) => -v)], { channelCount: 2, sampleRateHz: FS, bitsPerSample: 32, sampleFormat: 'ieee-float', bext: { description: '', originator: '', originationDate: '2026-05-14', originationTime: '05:00:00', timeReferenceFrames: T0 * FS } });
    const { layout: l, open } = await layout('recorder,file,file_channel,microphone\nC,c.wav,2,MX\nA,a1.wav,1,MA\n', undefined, { 'c.wav': stereo });
    const recording = deploymentRecording(l, open);
    const out = [new Float32Array(8), new Float32Array(8)];
    const channels = await recording.readFrames(10, 8, out);
    expect(channels.map((c) => c.buffer)).toEqual(out.map((c) => c.buffer)); // the caller's arrays, not copies
    const x = channels[l.microphones.findIndex((m) => m.label === 'MX')]!;
    // the samples written above: file channel 2 holds -(frame + 1)/10000; channel 1 (twice the ramp) is in no window
    expect(Array.from(x)).toEqual(Array.from({ length: 8 }, (_, i) => Math.fround(-(10 + i + 1) / 10000)));
  });

  it('keeps at most two files of each recorder open while it reads through many', async () => {
    const many: Record<string, Uint8Array> = {};
    const rows = ['recorder,file,file_channel,microphone'];
    for (const [recorder, startSeconds] of [['P', 0], ['Q', 0.25]] as const) {
      for (let f = 0; f < 6; f++) {
        const name = `${recorder.toLowerCase()}${f}.wav`;
        many[name] = file(200 * f, 200, T0 + startSeconds + 0.2 * f);
        rows.push(`${recorder},${name},1,M${recorder}`);
      }
    }
    const { layout: l, open } = await layout(`${rows.join('\n')}\n`, undefined, many);
    const opened = new Set<string>();
    let most = 0;
    const counting = async (name: string) => {
      const source = await open(name);
      opened.add(name);
      for (const recorder of ['p', 'q']) most = Math.max(most, [...opened].filter((n) => n.startsWith(recorder)).length);
      return { ...source, close: () => { opened.delete(name); return Promise.resolve(); } };
    };
    const recording = deploymentRecording(l, counting);
    for (let frame = 0; frame + 50 <= 1450; frame += 50) {
      const [p, q] = await recording.readFrames(frame, 50);
      // P's sample at deployment frame n is (n + 1)/10000 until it ends at 1.2 s; Q starts 0.25 s (250 frames) later
      if (frame + 50 <= 1200) expect(p![49]).toBeCloseTo((frame + 49 + 1) / 10000, 7);
      if (frame >= 250) expect(q![0]).toBeCloseTo((frame - 250 + 1) / 10000, 7);
    }
    expect(most).toBe(2);
    await recording.close();
    expect(opened.size).toBe(0);
  });

  it('maps deployment time through each clock to the nearest whole frame and reports the fractional remainder as a shift', async () => {
    const { layout: l, open } = await layout();
    const recording = deploymentRecording(l, open, [{ clockStartSeconds: 0, offsetSeconds: 0, drift: 0 }, { clockStartSeconds: 0.5, offsetSeconds: 0.0103, drift: 1e-3 }]);
    const [, b] = await recording.readFrames(700, 10);
    // true time t = n + 0.0103 + 1e-3 (n - 0.5) for nominal n: at t = 0.7 s, n = 0.5 + (0.2 - 0.0103) / 1.001 = 0.689510... s,
    // recorder frame 189.51 -> whole frame 190 (value 191/10000); computed by hand from the model's definition
    expect(b![0]).toBeCloseTo(191 / 10000, 7);
    const shift = recording.windowAlignment(700, 10, 0.7).shiftSeconds[1]!;
    // true time of recorder frame 190 (n = 0.69 s): 0.69 + 0.0103 + 1e-3 * 0.19 = 0.70049 s; minus 0.7 s nominal
    expect(shift).toBeCloseTo(0.00049, 9);
    expect(recording.windowAlignment(700, 10, 0.7).shiftSeconds[0]).toBe(0);
    // Taken at the channel's own arrival 5 ms later, the shift has drifted on: recorder frame 195 (n = 0.695 s) is true time
    // 0.695 + 0.0103 + 1e-3 * 0.195 = 0.705495 s, minus 0.705 s nominal (computed by hand from the model's definition)
    expect(recording.windowAlignment(700, 10, 0.7, [undefined, 0.705]).shiftSeconds[1]).toBeCloseTo(0.000495, 9);
    expect(recording.windowAlignment(700, 10, 0.7, [0.705, undefined]).shiftSeconds[1]).toBeCloseTo(0.00049, 9);
  });
});
