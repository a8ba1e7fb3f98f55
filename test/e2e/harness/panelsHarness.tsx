// Harness page for the Microphones, Settings and Fix log panels (test only): an invented 6-microphone array with a WGS84
// origin, air at 12 °C, and five invented events solved by core/locate from seeded delays. Exports land in a <pre>.
import { StrictMode, useMemo, useState } from 'react';
import { createRoot } from 'react-dom/client';
import type { WavStartTime } from '../../../core/audio';
import type { GeodeticPosition } from '../../../core/geo';
import { seededRandom, solveFix, type DelayMeasurement, type SolveResult } from '../../../core/locate';
import { locatedVerdict, type LocatedEvent, type PairMeasurement } from '../../../core/pipeline';
import type { ArrayMicrophone, FixLogEntry, ProjectMedium, ProjectSettings } from '../../../core/project';
import { FixLogPanel, fixLogContextFor, fixLogEntryFromLocated } from '../../../renderer/fixlog';
import { MicrophonesPanel, type ArrayImportText } from '../../../renderer/microphones';
import { describeSpeed, SettingsPanel, type SettingsValue } from '../../../renderer/settings';
import '../../../renderer/styles.css';

const params = new URLSearchParams(window.location.search);

// Invented: a hedgerow survey site; heights are metres up in the local frame.
const inventedOrigin: GeodeticPosition = { latitudeDegrees: 52.204512, longitudeDegrees: -1.621834, heightMeters: 84.2 };
const inventedArray: ArrayMicrophone[] = [
  { channel: 1, label: 'gate', eastMeters: 0, northMeters: 0, upMeters: 1.5, surveySigmaMeters: 0.03 },
  { channel: 2, label: 'oak', eastMeters: 38.42, northMeters: 4.1, upMeters: 1.62, surveySigmaMeters: 0.03 },
  { channel: 3, label: 'pond', eastMeters: 52.05, northMeters: 36.77, upMeters: 1.4, surveySigmaMeters: 0.05 },
  { channel: 4, label: 'stile', eastMeters: 30.3, northMeters: 61.9, upMeters: 1.55, surveySigmaMeters: 0.03 },
  { channel: 5, label: 'ditch', eastMeters: -6.25, northMeters: 49.6, upMeters: 1.2, surveySigmaMeters: 0.05 },
  { channel: 6, label: 'post', eastMeters: 20.0, northMeters: 28.15, upMeters: 1.5, surveySigmaMeters: 0.02 },
];
const inventedMedium: ProjectMedium = { medium: 'air', temperatureCelsius: 12, relativeHumidityPercent: 70, model: 'cramer', temperatureSigmaKelvin: 1 };
const inventedSettings: ProjectSettings = { dimensions: 2, sourceUpMeters: 2, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' };
const startTime: WavStartTime = { isoLocal: '2024-05-18T04:12:00.000', originationDate: '2024-05-18', originationTime: '04:12:00', timeReferenceFrames: 4 * 3600 * 48000 + 12 * 60 * 48000, basis: 'time-reference', dateIso: '2024-05-18', framesSinceMidnight: 4 * 3600 * 48000 + 12 * 60 * 48000, sampleRateHz: 48000 };
const sampleRateHz = 48000;

interface InventedEvent { source: [number, number]; emittedSeconds: number; timingSigmaSeconds: number; label: string; note: string; accepted?: boolean; pairCount?: number }
const inventedEvents: InventedEvent[] = [
  { source: [31, 19], emittedSeconds: 12.418, timingSigmaSeconds: 6e-5, label: 'wren', note: 'song start' },
  { source: [95, 80], emittedSeconds: 47.902, timingSigmaSeconds: 2e-4, label: 'pheasant', note: 'outside the array: long ellipse' },
  { source: [14, 44], emittedSeconds: 63.151, timingSigmaSeconds: 8e-5, label: '', note: '' },
  { source: [-40, 120], emittedSeconds: 121.77, timingSigmaSeconds: 4e-4, label: 'dog?', note: 'far, probably a farm dog', accepted: false },
  { source: [25, 30], emittedSeconds: 150.03, timingSigmaSeconds: 1e-4, label: 'clap', note: 'calibration clap at the post', pairCount: 2 },
];

function locate(event: InventedEvent, index: number, c: number): LocatedEvent {
  const random = seededRandom(100 + index);
  const range = (m: ArrayMicrophone) => Math.hypot(event.source[0] - m.eastMeters, event.source[1] - m.northMeters, 2 - m.upMeters);
  const pairs: PairMeasurement[] = [];
  for (let a = 0; a < inventedArray.length; a++) {
    for (let b = a + 1; b < inventedArray.length; b++) {
      if (event.pairCount !== undefined && pairs.length >= event.pairCount) break;
      const delaySeconds = (range(inventedArray[a]!) - range(inventedArray[b]!)) / c + event.timingSigmaSeconds * random.normal();
      pairs.push({ indexA: a, indexB: b, delaySeconds, sigmaSeconds: event.timingSigmaSeconds, peakToSecondRatio: 1.3 + 3 * random.uniform(), peakValue: 0.5, snrDb: 12 + 10 * random.uniform(), maxLagSeconds: 0.2 });
    }
  }
  const delays: DelayMeasurement[] = pairs.map((p) => ({ indexA: p.indexA, indexB: p.indexB, delaySeconds: p.delaySeconds, sigmaSeconds: p.sigmaSeconds }));
  const solve: SolveResult = solveFix(inventedArray, delays, { speedMetersPerSecond: c, dimensions: 2, sourceUpMeters: 2, confidence: 0.95 });
  const firstArrivalSeconds = event.emittedSeconds + Math.min(...inventedArray.map(range)) / c;
  return {
    event: { index, startSeconds: firstArrivalSeconds - 0.05, endSeconds: firstArrivalSeconds + 0.4, onsetSeconds: inventedArray.map(() => firstArrivalSeconds), peakSnrDb: 20, channelsTriggered: 6, flags: [] },
    windowStartSeconds: firstArrivalSeconds - 0.05, windowEndSeconds: firstArrivalSeconds + 0.4,
    bandHz: { lowHz: 1800 + 100 * index, highHz: 7400 }, bandSnrDb: 18.4, pairs,
    reduced: { delays, referenceIndex: 0, arrivalSigmaSeconds: event.timingSigmaSeconds, droppedPairs: [], scatterFactor: 1, closure: { cost: 0, degreesOfFreedom: 0, unitArrivalSigmaSeconds: event.timingSigmaSeconds }, warnings: [] },
    solve, emissionTimeSeconds: solve.fix !== undefined ? event.emittedSeconds : undefined, firstArrivalSeconds, warnings: [],
  };
}

const exampleArrayCsv = `# an invented array surveyed by GNSS
channel,label,lat,lon,alt_m,sigma_m
1,north gate,52.2051,-1.6221,85.6,0.02
2,barn,52.20525,-1.62152,86.1,0.02
3,willow,52.20488,-1.62131,85.2,0.04
4,track,52.20462,-1.62188,85.9,0.02
`;

function Harness() {
  const [microphones, setMicrophones] = useState(inventedArray);
  const [origin, setOrigin] = useState<GeodeticPosition | undefined>(params.get('origin') === 'none' ? undefined : inventedOrigin);
  const [settingsValue, setSettingsValue] = useState<SettingsValue>({ medium: inventedMedium, settings: inventedSettings });
  const speed = describeSpeed(inventedMedium);
  const located = useMemo(() => {
    const c = speed.ok ? speed.speedMetersPerSecond : 343;
    return new Map(inventedEvents.map((event, index) => [`fix-${index + 1}`, locate(event, index, c)] as const));
  }, [speed]);
  const [entries, setEntries] = useState<FixLogEntry[]>(() => inventedEvents.map((event, index) => {
    const entry = fixLogEntryFromLocated(located.get(`fix-${index + 1}`)!, { id: `fix-${index + 1}`, recording: { name: 'hedgerow-dawn.wav', sizeBytes: 34_560_044 }, verdict: locatedVerdict(located.get(`fix-${index + 1}`)!, { microphones: inventedArray }), recordingStartTime: startTime, sampleRateHz, label: event.label, note: event.note });
    return event.accepted === undefined ? entry : { ...entry, accepted: event.accepted };
  }));
  const [selectedId, setSelectedId] = useState<string | undefined>('fix-1');
  const [exported, setExported] = useState<string>('');
  const context = useMemo(() => {
    try {
      return fixLogContextFor({ recordingName: 'hedgerow-dawn.wav', recordingStartTime: startTime, sampleRateHz, microphones, origin, medium: settingsValue.medium, settings: settingsValue.settings, located });
    } catch {
      return undefined;
    }
  }, [microphones, origin, settingsValue, located]);
  const meanUp = microphones.reduce((sum, m) => sum + m.upMeters, 0) / Math.max(1, microphones.length);

  return (
    <div className="workspace">
      <main style={{ display: 'grid', gridTemplateColumns: 'minmax(0, 1.15fr) minmax(0, 1fr)', gap: '12px', padding: '12px 16px', alignItems: 'start' }}>
        <MicrophonesPanel
          microphones={microphones}
          origin={origin}
          recordingChannelCount={params.get('channels') === null ? 6 : Number(params.get('channels'))}
          onChange={(next, nextOrigin) => { setMicrophones(next); setOrigin(nextOrigin); }}
          onImportArray={async (): Promise<ArrayImportText | null> => (params.get('import') === 'bad' ? { name: 'broken.csv', text: 'channel,lat\n1,52.2\n' } : { name: 'gnss-survey.csv', text: exampleArrayCsv })}
          onExportArray={(text) => setExported(`array.csv\n${text}`)}
        />
        <SettingsPanel value={settingsValue} onChange={setSettingsValue} meanMicrophoneUpMeters={meanUp} />
        <div style={{ gridColumn: '1 / -1' }}>
          <FixLogPanel entries={entries} context={context} selectedId={selectedId} onChange={setEntries} onSelect={setSelectedId} onExport={(kind, text) => setExported(`fixes.${kind}\n${text}`)} />
        </div>
        <pre data-testid="harness-exported" style={{ gridColumn: '1 / -1', margin: 0, maxHeight: '16rem', overflow: 'auto', fontSize: 11, background: '#fffdf8', border: '1px solid #d9d2c3', padding: 8, display: exported === '' ? 'none' : 'block' }}>{exported}</pre>
      </main>
    </div>
  );
}

createRoot(document.getElementById('root')!).render(<StrictMode><Harness /></StrictMode>);
