// Harness page for the recording and correlations views (test only): a 6-channel, 48 kHz recording synthesized in the page
// (seeded background noise plus clicks, calls and a noise burst from invented positions, each heard with its true delay
// and 1/r level), its envelope computed in the page, the spectrogram and the correlation plots from core/overview.
import { StrictMode, useCallback, useEffect, useMemo, useState } from 'react';
import { createRoot } from 'react-dom/client';
import { encodeWavFile, memoryByteSource, readWavInfo, type ByteSource, type WavInfo } from '../../../core/audio';
import { correlationPlots, envelopeFromSource, spectrogramFromSource, type EnvelopePyramid } from '../../../core/overview';
import { CorrelationsView } from '../../../renderer/correlations';
import { RecordingView } from '../../../renderer/recording';
import { mulberry32 } from '../../helpers/signals';
import '../../../renderer/styles.css';

const params = new URLSearchParams(window.location.search);
const sampleRateHz = 48_000;
const durationSeconds = Number(params.get('seconds') ?? 40);
const speedMetersPerSecond = 343;
const band = { lowHz: 500, highHz: 12_000 };
const weighting = 'phat' as const;

const allMicrophones = [
  { label: 'North post', eastMeters: 2, northMeters: 31, upMeters: 1.5 },
  { label: 'Oak', eastMeters: 27, northMeters: 18, upMeters: 2.0 },
  { label: 'Fence east', eastMeters: 29, northMeters: -9, upMeters: 1.2 },
  { label: 'Gate', eastMeters: 1, northMeters: -24, upMeters: 1.5 },
  { label: 'Reed bed', eastMeters: -26, northMeters: -12, upMeters: 0.8 },
  { label: 'Hide', eastMeters: -24, northMeters: 15, upMeters: 2.5 },
  { label: 'Willow', eastMeters: 14, northMeters: 4, upMeters: 3.0 },
  { label: 'Pond edge', eastMeters: -10, northMeters: -2, upMeters: 0.5 },
];
/** ?channels=N (2..8, default 6). */
const microphones = allMicrophones.slice(0, Math.max(2, Math.min(8, Number(params.get('channels') ?? 6))));

type Kind = 'click' | 'call' | 'burst' | 'clicks' | 'hoot';
interface SourceEvent { kind: Kind; emitSeconds: number; east: number; north: number; level: number; status?: string }

const sourceEvents: SourceEvent[] = [
  { kind: 'click', emitSeconds: 3.2, east: 60, north: 40, level: 30, status: 'ok' },
  { kind: 'call', emitSeconds: 8.5, east: -35, north: 70, level: 12, status: 'ok' },
  { kind: 'burst', emitSeconds: 15.0, east: 10, north: -80, level: 14, status: 'ambiguous' },
  { kind: 'call', emitSeconds: 22.3, east: 45, north: -30, level: 8, status: 'ok' },
  { kind: 'clicks', emitSeconds: 30.7, east: -50, north: -45, level: 20 },
  { kind: 'hoot', emitSeconds: 35.6, east: 5, north: 5, level: 1.2, status: 'insufficient' },
];

function gaussian(seed: number): () => number {
  const uniform = mulberry32(seed);
  return () => Math.sqrt(-2 * Math.log(Math.max(1e-300, uniform()))) * Math.cos(2 * Math.PI * uniform());
}

const burstNoise = (() => {
  const normal = gaussian(99);
  return Float32Array.from({ length: Math.ceil(0.12 * sampleRateHz * 4) + 8 }, () => normal());
})();

/** The source waveform at time t (seconds after emission); zero outside its length. */
function sourceLength(kind: Kind): number {
  return { click: 0.01, call: 0.26, burst: 0.1, clicks: 0.08, hoot: 0.5 }[kind];
}

function sourceAt(kind: Kind, t: number): number {
  if (t < 0 || t > sourceLength(kind)) return 0;
  switch (kind) {
    case 'click': {
      const u = (t - 0.002) / 0.0004;
      return Math.exp(-0.5 * u * u) * Math.cos(2 * Math.PI * 3200 * t);
    }
    case 'clicks': {
      let v = 0;
      for (const start of [0.002, 0.032, 0.062]) {
        const u = (t - start) / 0.0003;
        v += Math.exp(-0.5 * u * u) * Math.cos(2 * Math.PI * 4500 * (t - start));
      }
      return v;
    }
    case 'call': {
      // downsweep 4.6 -> 2.4 kHz with two harmonics under a raised-cosine envelope
      const length = 0.26;
      const envelope = 0.5 - 0.5 * Math.cos((2 * Math.PI * t) / length);
      const phase = 2 * Math.PI * (4600 * t - (2200 / (2 * length)) * t * t);
      return envelope * (Math.sin(phase) + 0.35 * Math.sin(2 * phase) + 0.12 * Math.sin(3 * phase));
    }
    case 'burst': {
      const length = 0.1;
      const envelope = Math.sin((Math.PI * t) / length) ** 2;
      const at = t * sampleRateHz * 4;
      const i = Math.floor(at);
      const u = at - i;
      return envelope * 0.5 * (burstNoise[i]! * (1 - u) + burstNoise[i + 1]! * u);
    }
    case 'hoot': {
      const length = 0.5;
      const envelope = Math.sin((Math.PI * t) / length) ** 1.5;
      return envelope * (Math.sin(2 * Math.PI * 420 * t) + 0.5 * Math.sin(2 * Math.PI * 840 * t) + 0.2 * Math.sin(2 * Math.PI * 1260 * t));
    }
  }
}

interface Synth {
  channels: Float32Array[];
  events: Array<{ index: number; startSeconds: number; endSeconds: number; status?: string }>;
}

function synthesize(): Synth {
  const frames = Math.round(durationSeconds * sampleRateHz);
  const channels = microphones.map((_, c) => {
    const normal = gaussian(1000 + c);
    const out = new Float32Array(frames);
    let low = 0;
    for (let n = 0; n < frames; n++) {
      const w = normal();
      low = 0.995 * low + 0.1 * normal(); // a little rumble under the hiss
      out[n] = 0.004 * w + 0.006 * low;
    }
    return out;
  });
  const events: Synth['events'] = [];
  sourceEvents.forEach((event, e) => {
    const distances = microphones.map((m) => Math.hypot(event.east - m.eastMeters, event.north - m.northMeters, 1.5 - m.upMeters));
    const arrivals = distances.map((d) => event.emitSeconds + d / speedMetersPerSecond);
    const length = sourceLength(event.kind);
    channels.forEach((samples, c) => {
      const gain = (event.level * 0.03 * 10) / Math.max(5, distances[c]!);
      const first = Math.floor(arrivals[c]! * sampleRateHz);
      const last = Math.min(frames - 1, Math.ceil((arrivals[c]! + length) * sampleRateHz));
      for (let n = Math.max(0, first); n <= last; n++) samples[n] = samples[n]! + gain * sourceAt(event.kind, n / sampleRateHz - arrivals[c]!);
    });
    events.push({ index: e + 1, startSeconds: Math.min(...arrivals) - 0.01, endSeconds: Math.max(...arrivals) + length + 0.01, status: event.status });
  });
  return { channels, events };
}

interface Loaded {
  synth: Synth;
  source: ByteSource;
  info: WavInfo;
}

function Harness() {
  const [loaded, setLoaded] = useState<Loaded | undefined>();
  const [envelope, setEnvelope] = useState<EnvelopePyramid | undefined>();
  const [progress, setProgress] = useState(0);
  const [selectedIndex, setSelectedIndex] = useState<number | undefined>(params.has('select') ? Number(params.get('select')) : undefined);
  const [selection, setSelection] = useState<{ startSeconds: number; endSeconds: number } | undefined>();
  const [located, setLocated] = useState('');
  const show = params.get('show') ?? 'both';

  useEffect(() => {
    let stopped = false;
    const synth = synthesize();
    const bytes = encodeWavFile(synth.channels, {
      channelCount: synth.channels.length,
      sampleRateHz,
      bitsPerSample: 32,
      sampleFormat: 'ieee-float',
      bext: { description: 'Harness dawn', originator: 'harness', originationDate: '2026-05-03', originationTime: '05:12:00', timeReferenceFrames: (5 * 3600 + 12 * 60) * sampleRateHz },
    });
    const source = memoryByteSource(bytes, `harness-dawn-${microphones.length}ch.wav`);
    void readWavInfo(source).then(async (info) => {
      if (stopped) return;
      setLoaded({ synth, source, info });
      const pyramid = await envelopeFromSource(source, info, {
        blockFrames: 1 << 17,
        // ?bucket=N forces a coarse overview, to see the exact detail that comes with the spectrogram at deep zoom
        baseBucketFrames: params.has('bucket') ? Number(params.get('bucket')) : undefined,
        onProgress: (f) => setProgress(f),
      });
      if (!stopped) setEnvelope(pyramid);
    });
    return () => { stopped = true; };
  }, []);

  const requestSpectrogram = useCallback(
    (startSeconds: number, endSeconds: number, widthPixels: number, heightPixels: number) => {
      if (!loaded) return Promise.reject(new Error('not loaded'));
      return spectrogramFromSource(loaded.source, loaded.info, { startSeconds, endSeconds, widthPixels, heightPixels });
    },
    [loaded],
  );

  const events = useMemo(
    () => (loaded?.synth.events ?? []).map((e) => ({ ...e, selected: e.index === selectedIndex })),
    [loaded, selectedIndex],
  );

  const plots = useMemo(() => {
    const event = loaded?.synth.events.find((e) => e.index === selectedIndex);
    if (!loaded || !event) return { pairs: [], autocorrelations: [] };
    const from = Math.max(0, Math.floor((event.startSeconds - 0.02) * sampleRateHz));
    const to = Math.min(loaded.synth.channels[0]!.length, Math.ceil((event.endSeconds + 0.02) * sampleRateHz));
    const window = loaded.synth.channels.map((c) => c.subarray(from, to));
    return correlationPlots(window, microphones.map((m) => m.label), microphones, speedMetersPerSecond, sampleRateHz, band, weighting, {
      isPairUsed: (a, b) => !(event.status === 'ambiguous' && a === 0 && b === 3),
    });
  }, [loaded, selectedIndex]);

  if (!loaded) return <p style={{ padding: '1rem' }}>Synthesizing the harness recording…</p>;
  return (
    <div style={{ padding: '0.75rem 1rem', display: 'flex', flexDirection: 'column', gap: '0.75rem' }}>
      {show !== 'correlations' && (
        <RecordingView
          info={{
            name: loaded.source.name,
            channelCount: loaded.info.channelCount,
            sampleRateHz: loaded.info.sampleRateHz,
            frameCount: loaded.info.frameCount,
            durationSeconds: loaded.info.durationSeconds,
            startTimeIso: loaded.info.startTime?.isoLocal,
          }}
          channelLabels={microphones.map((m) => m.label)}
          envelope={envelope}
          envelopeProgress={progress}
          events={events}
          selection={selection}
          requestSpectrogram={requestSpectrogram}
          onSelectSpan={(startSeconds, endSeconds) => setSelection({ startSeconds, endSeconds })}
          onLocateSpan={(startSeconds, endSeconds) => setLocated(`Locate asked for ${startSeconds.toFixed(3)}–${endSeconds.toFixed(3)} s`)}
          onSelectEvent={setSelectedIndex}
        />
      )}
      <p data-testid="harness-status" style={{ margin: 0, fontSize: '0.8rem', color: '#5d6b70' }}>
        {located || 'Harness: drag across the lanes to select, click an event, wheel to zoom.'}
      </p>
      {show !== 'recording' && <CorrelationsView pairs={plots.pairs} autocorrelations={plots.autocorrelations} bandHz={band} weighting={weighting} />}
    </div>
  );
}

const rootElement = document.getElementById('root');
if (rootElement === null) throw new Error('The harness page has no #root element.');
createRoot(rootElement).render(
  <StrictMode>
    <Harness />
  </StrictMode>,
);
