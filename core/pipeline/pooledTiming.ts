// Second pass of a locate run: the timing-noise model fitted to all events of the recording (./timingNoise), then every
// event solved again with it. Only the solve is repeated (about a millisecond per event), not the correlation. Seconds.
import { applyReductionCheck } from './reductionCheck';
import { eventTimes, lagMarginSeconds, solveOptions, solveWithTimingModel, toSolverMicrophones, type LocateContext, type LocatedEvent } from './locateEvent';
import { estimateTimingNoise, explainableArrivalSigmaSeconds, MIN_POOLED_DEGREES_OF_FREEDOM, MIN_POOLED_EVENTS, type TimingEvidence, type TimingNoiseModel } from './timingNoise';

export interface PooledTiming {
  located: LocatedEvent[];
  /** The model of all events together (used for band classes with too few events of their own). */
  model: TimingNoiseModel;
  /** Per band class (see bandClassOf), when the class had enough events for its own fit. */
  classModels: Map<string, TimingNoiseModel>;
  /** One sentence for the run's notes: the model and where it came from. */
  note: string;
}

/** A band class gets its own model from this many events (three parameters); smaller classes use the model of all events. */
const MIN_CLASS_EVENTS = 20;

function microseconds(seconds: number): string {
  return `${(seconds * 1e6).toPrecision(3)} µs`;
}

function describeTimingModel(model: TimingNoiseModel): string {
  if (model.source === 'prior') {
    return `timing noise: the correlation sigma (floor 0.1 sample) as it is, without pooling: ${model.eventsUsed} event(s) with ${model.degreesOfFreedomUsed} redundant arrival(s), pooling needs ${MIN_POOLED_EVENTS} events and ${MIN_POOLED_DEGREES_OF_FREEDOM}; each fix's own residuals still widen it when they scatter more`;
  }
  return `timing noise pooled over ${model.eventsUsed} event(s) (${model.degreesOfFreedomUsed} redundant arrivals${model.eventsTrimmed > 0 ? `, ${model.eventsTrimmed} event(s) beyond the model at 0.1 %, each on its own residuals` : ''}): ` +
    `arrival sigma of clean sounds ${model.scale.toPrecision(3)} x correlation sigma` +
    (model.reflectedShare > 0 ? `; about ${Math.round(100 * model.reflectedShare)} % of sounds test as reflected (likelihood ratio of their residuals) and carry a floor: sqrt((${model.reflectedScale.toPrecision(3)} x correlation sigma)² + (${microseconds(model.reflectionFloorSeconds)})²)` : '') +
    ', moderated by each fix\'s own residuals';
}

/**
 * Solves one located event again under `model` (its delays, geometry and settings as given); keeps everything else.
 * `evidence`: the event's timing evidence when it was read under this same context (the pipeline's second pass), else re-read.
 */
export function solveLocatedEvent(located: LocatedEvent, context: LocateContext, sampleRateHz: number, model: TimingNoiseModel, evidence?: TimingEvidence): LocatedEvent {
  if (located.reduced.delays.length === 0) return located;
  const marginSeconds = lagMarginSeconds(context.geometry, sampleRateHz, context.settings.speedMetersPerSecond);
  const { solve, timing } = solveWithTimingModel(toSolverMicrophones(context.geometry), located.reduced, solveOptions(context.settings, marginSeconds), model, evidence);
  // A pooled model also judges the event: scatter beyond what its larger class allows, at the test level, makes the fix inconsistent (./reductionCheck).
  const modelSigmaSeconds = model.source === 'prior' ? undefined : explainableArrivalSigmaSeconds(model, timing.evidence.priorArrivalSigmaSeconds);
  const checked = applyReductionCheck(solve, located.reduced, undefined, modelSigmaSeconds);
  return { ...located, solve: checked, timing, ...eventTimes(located.event, context, checked) };
}

/**
 * Band class of an event: the octave of its correlation band's centre (geometric mean of the edges) relative to 1 kHz.
 * Sounds of one kind land in one class; their echoes and the correlation's small-error bound fail alike.
 */
function bandClassOf(located: Pick<LocatedEvent, 'bandHz'>): string {
  const centreHz = Math.sqrt(Math.max(1, located.bandHz.lowHz) * Math.max(1, located.bandHz.highHz));
  const octave = Math.round(Math.log2(centreHz / 1000));
  return `${(1000 * 2 ** octave).toFixed(0)} Hz`;
}

/**
 * Fits the recording's timing-noise model to the events' first solves, per band class where a class has enough events
 * (else the model of all events), and solves each event again with its class's model. The events must have been
 * located under `context` (their timing evidence is reused).
 */
export function poolTimingNoise(located: readonly LocatedEvent[], context: LocateContext, sampleRateHz: number): PooledTiming {
  const withTiming = located.filter((event) => event.timing !== undefined);
  const model = estimateTimingNoise(withTiming.map((event) => event.timing!.evidence));
  const evidenceByClass = new Map<string, TimingEvidence[]>();
  for (const event of withTiming) {
    const key = bandClassOf(event);
    const members = evidenceByClass.get(key);
    if (members === undefined) evidenceByClass.set(key, [event.timing!.evidence]);
    else members.push(event.timing!.evidence);
  }
  const classModels = new Map<string, TimingNoiseModel>();
  for (const [key, members] of evidenceByClass) {
    if (members.length < MIN_CLASS_EVENTS) continue;
    const classModel = estimateTimingNoise(members);
    if (classModel.source === 'pooled') classModels.set(key, classModel);
  }
  const modelOf = (event: LocatedEvent) => (classModels.size === 0 ? model : classModels.get(bandClassOf(event)) ?? model);
  const classes = [...classModels.entries()].map(([key, m]) => `band class ${key}: ${describeTimingModel(m)}`);
  const note = classes.length === 0 ? describeTimingModel(model) : `${classes.join('; ')}${classModels.size < evidenceByClass.size ? `; other sounds: ${describeTimingModel(model)}` : ''}`;
  // Same context as the first pass: each event's timing evidence is reused, only the final solve is repeated.
  return { located: located.map((event) => solveLocatedEvent(event, context, sampleRateHz, modelOf(event), event.timing?.evidence)), model, classModels, note };
}
