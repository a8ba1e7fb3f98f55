// Harness page for the map view (test only): an invented 6-microphone array, two events (one ok fix, one ambiguous),
// the array's precision map as overlay. Dragging a microphone re-solves the fix in core/locate and redraws.
import { StrictMode, useCallback, useEffect, useLayoutEffect, useMemo, useState } from 'react';
import { createRoot } from 'react-dom/client';
import { precisionMap, seededRandom, solveFix, type DelayMeasurement, type Microphone } from '../../../core/locate';
import { MapView, type MapFix, type MapHyperbola, type MapMicrophone, type MapOverlay } from '../../../renderer/map';
import '../../../renderer/styles.css';

const speedMetersPerSecond = 343;
const planeUpMeters = 1.5;
const timingSigmaSeconds = 1e-4;

// ?array=8 adds two microphones and draws every pair of call 1 (28 hyperbolae), the drag-speed case of the brief.
const eightMicrophones = new URLSearchParams(window.location.search).get('array') === '8';
const surveyedArray: MapMicrophone[] = [
  { label: 'M1', channel: 1, eastMeters: 0, northMeters: 0, upMeters: 1.5 },
  { label: 'M2', channel: 2, eastMeters: 38, northMeters: 4, upMeters: 1.5 },
  { label: 'M3', channel: 3, eastMeters: 52, northMeters: 36, upMeters: 1.5 },
  { label: 'M4', channel: 4, eastMeters: 30, northMeters: 62, upMeters: 1.5 },
  { label: 'M5', channel: 5, eastMeters: -6, northMeters: 50, upMeters: 1.5 },
  { label: 'M6', channel: 6, eastMeters: 20, northMeters: 28, upMeters: 1.5 },
  ...(eightMicrophones
    ? [
        { label: 'M7', channel: 7, eastMeters: 64, northMeters: 8, upMeters: 1.5 },
        { label: 'M8', channel: 8, eastMeters: -20, northMeters: 18, upMeters: 1.5 },
      ]
    : []),
];

function everyPair(count: number): Array<[number, number, number]> {
  const pairs: Array<[number, number, number]> = [];
  for (let a = 0; a < count; a += 1) for (let b = a + 1; b < count; b += 1) pairs.push([a, b, ((a * 7 + b * 3) % 10) / 9]);
  return pairs;
}

interface HarnessEvent {
  id: string;
  label: string;
  /** Measured pair delays with a quality 0..1 (lower quality: larger error added). */
  pairs: Array<MapHyperbola & { sigmaSeconds: number }>;
}

/** Delays a source at (east, north) gives the surveyed array, with seeded errors scaled by (1 − quality). */
function measuredPairs(source: [number, number], pairList: Array<[number, number, number]>, seed: number): HarnessEvent['pairs'] {
  const random = seededRandom(seed);
  const range = (index: number): number =>
    Math.hypot(source[0] - surveyedArray[index].eastMeters, source[1] - surveyedArray[index].northMeters, planeUpMeters - surveyedArray[index].upMeters);
  return pairList.map(([indexA, indexB, quality]) => {
    const sigmaSeconds = timingSigmaSeconds * (0.3 + 4 * (1 - quality));
    const delaySeconds = (range(indexA) - range(indexB)) / speedMetersPerSecond + sigmaSeconds * random.normal();
    return { indexA, indexB, delaySeconds, quality, sigmaSeconds };
  });
}

const events: HarnessEvent[] = [
  {
    id: 'call-1',
    label: 'call 1',
    pairs: measuredPairs(
      [31, 19],
      eightMicrophones ? everyPair(8) : [[0, 1, 0.95], [0, 2, 0.85], [0, 3, 0.7], [0, 4, 0.55], [0, 5, 0.9], [1, 3, 0.35], [2, 4, 0.12]],
      11,
    ),
  },
  { id: 'call-2', label: 'call 2', pairs: measuredPairs([95, 80], [[0, 1, 0.8], [0, 2, 0.6]], 12) },
];

function solve(event: HarnessEvent, mics: MapMicrophone[], selected: boolean): MapFix {
  const microphones: Microphone[] = mics.map((m) => ({ label: m.label, eastMeters: m.eastMeters, northMeters: m.northMeters, upMeters: m.upMeters }));
  const delays: DelayMeasurement[] = event.pairs.map((p) => ({ indexA: p.indexA, indexB: p.indexB, delaySeconds: p.delaySeconds, sigmaSeconds: p.sigmaSeconds }));
  const result = solveFix(microphones, delays, { speedMetersPerSecond, dimensions: 2, sourceUpMeters: planeUpMeters, rejectOutliers: false });
  const fix = result.fix;
  return {
    id: event.id,
    label: event.label,
    status: result.status,
    eastMeters: fix?.eastMeters ?? Number.NaN,
    northMeters: fix?.northMeters ?? Number.NaN,
    upMeters: fix?.upMeters ?? planeUpMeters,
    ellipse: fix?.ellipse,
    alternative: fix?.alternative ? { eastMeters: fix.alternative.eastMeters, northMeters: fix.alternative.northMeters } : undefined,
    selected,
  };
}

function precisionOverlay(mics: MapMicrophone[]): MapOverlay {
  const grid = { firstEastMeters: -90, stepEastMeters: 1, countEast: 241, firstNorthMeters: -80, stepNorthMeters: 1, countNorth: 221 };
  const output = { horizontalErrorMeters: new Float64Array(grid.countEast * grid.countNorth), gdop: new Float64Array(grid.countEast * grid.countNorth) };
  precisionMap(
    mics,
    { eastStartMeters: grid.firstEastMeters, northStartMeters: grid.firstNorthMeters, eastStepMeters: 1, northStepMeters: 1, columns: grid.countEast, rows: grid.countNorth, upMeters: planeUpMeters },
    { speedMetersPerSecond, timingSigmaSeconds, dimensions: 2 },
    output,
  );
  return { kind: 'precision', grid, values: output.horizontalErrorMeters, unitLabel: 'expected 1-σ error, m' };
}

declare global {
  interface Window {
    mapHarness: { latenciesMs: number[]; moves: number };
  }
}
window.mapHarness = { latenciesMs: [], moves: 0 };
let lastInputMs = 0;
window.addEventListener('pointermove', (event) => (lastInputMs = event.timeStamp), { capture: true });

function Harness() {
  const [microphones, setMicrophones] = useState(surveyedArray);
  const [selectedId, setSelectedId] = useState('call-1');
  const [showOverlay, setShowOverlay] = useState(true);
  const [editable, setEditable] = useState(true);

  // A fix the solver could not place (no position) is not drawn.
  const fixes = useMemo(
    () => events.map((event) => solve(event, microphones, event.id === selectedId)).filter((fix) => Number.isFinite(fix.eastMeters)),
    [microphones, selectedId],
  );
  const hyperbolae = useMemo(() => events.find((event) => event.id === selectedId)?.pairs ?? [], [selectedId]);
  const [overlay, setOverlay] = useState(() => precisionOverlay(surveyedArray));
  // The precision map is a planning aid: recomputed once the array has stopped moving, not on every drag step.
  useEffect(() => {
    if (!showOverlay) return undefined;
    const timer = window.setTimeout(() => setOverlay(precisionOverlay(microphones)), 150);
    return () => window.clearTimeout(timer);
  }, [microphones, showOverlay]);

  const onMoveMicrophone = useCallback((index: number, eastMeters: number, northMeters: number) => {
    window.mapHarness.moves += 1;
    setMicrophones((current) => current.map((mic, i) => (i === index ? { ...mic, eastMeters, northMeters } : mic)));
  }, []);
  // Input-to-redraw: from the last pointer move to the end of the animation frame that draws the new props.
  useLayoutEffect(() => {
    if (window.mapHarness.moves === 0) return;
    const input = lastInputMs;
    requestAnimationFrame(() => window.mapHarness.latenciesMs.push(performance.now() - input));
  }, [microphones]);

  return (
    <div style={{ display: 'flex', flexDirection: 'column', height: '100vh', boxSizing: 'border-box', padding: '12px 16px', gap: 8 }}>
      <div style={{ display: 'flex', gap: 16, alignItems: 'center', fontSize: 14 }}>
        <strong>Map harness</strong>
        <label>
          <input type="checkbox" checked={showOverlay} onChange={(e) => setShowOverlay(e.target.checked)} data-testid="harness-overlay" /> precision map
        </label>
        <label>
          <input type="checkbox" checked={editable} onChange={(e) => setEditable(e.target.checked)} data-testid="harness-editable" /> microphones editable
        </label>
        <span data-testid="harness-selected">selected: {selectedId}</span>
        <button type="button" onClick={() => setMicrophones(surveyedArray)}>
          reset array
        </button>
      </div>
      <div style={{ flex: 1, minHeight: 0 }}>
        <MapView
          microphones={microphones}
          hyperbolae={hyperbolae}
          speedMetersPerSecond={speedMetersPerSecond}
          planeUpMeters={planeUpMeters}
          fixes={fixes}
          overlay={showOverlay ? overlay : undefined}
          origin={{ latitudeDegrees: 46.52, longitudeDegrees: 6.63, heightMeters: 420 }}
          editable={editable}
          onMoveMicrophone={onMoveMicrophone}
          onSelectFix={setSelectedId}
        />
      </div>
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
