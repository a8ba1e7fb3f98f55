// Second pass of a locate run: the timing-noise model fitted to the timing evidence of all events of the recording
// (./timingNoise), then each measured event solved once with it (no correlation again). Seconds.
import { solveMeasuredEvent, type LocateContext, type LocatedEvent, type MeasuredEvent } from './locateEvent';
import { estimateTimingNoise, MIN_POOLED_DEGREES_OF_FREEDOM, MIN_POOLED_EVENTS, type TimingEvidence, type TimingNoiseModel } from './timingNoise';

/** The recording's timing-noise models (fitTimingModels) and which one solves a given event. */
export interface PooledTimingModels {
  /** The model of all events together (used for band classes with too few events of their own). */
  model: TimingNoiseModel;
  /** Per band class (see bandClassOf), when the class had enough events for its own fit. */
  classModels: Map<string, TimingNoiseModel>;
  /** One sentence for the run's notes: the model and where it came from. */
  note: string;
  /** The model an event is solved with: its band class's, else the model of all events. */
  modelOf(event: Pick<MeasuredEvent, 'bandHz'>): TimingNoiseModel;
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
 * `evidence`: the event's timing evidence when it was read under this same context, else re-read.
 */
export function solveLocatedEvent(located: LocatedEvent, context: LocateContext, sampleRateHz: number, model: TimingNoiseModel, evidence?: TimingEvidence): LocatedEvent {
  if (located.reduced.delays.length === 0) return located;
  const { solve: _solve, timing: _timing, emissionTimeSeconds: _emission, firstArrivalSeconds: _arrival, ...measured } = located;
  return solveMeasuredEvent({ ...measured, timingEvidence: evidence }, context, sampleRateHz, model, evidence);
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
 * Fits the recording's timing-noise model to the events' timing evidence, per band class where a class has enough events
 * (else the model of all events). Reads only each event's evidence and band.
 */
export function fitTimingModels(measured: ReadonlyArray<Pick<MeasuredEvent, 'bandHz' | 'timingEvidence'>>): PooledTimingModels {
  const evidence = measured.flatMap((event) => (event.timingEvidence === undefined ? [] : [{ key: bandClassOf(event), evidence: event.timingEvidence }]));
  const model = estimateTimingNoise(evidence.map((member) => member.evidence));
  const evidenceByClass = new Map<string, TimingEvidence[]>();
  for (const { key, evidence: member } of evidence) {
    const members = evidenceByClass.get(key);
    if (members === undefined) evidenceByClass.set(key, [member]);
    else members.push(member);
  }
  const classModels = new Map<string, TimingNoiseModel>();
  for (const [key, members] of evidenceByClass) {
    if (members.length < MIN_CLASS_EVENTS) continue;
    const classModel = estimateTimingNoise(members);
    if (classModel.source === 'pooled') classModels.set(key, classModel);
  }
  const modelOf = (event: Pick<MeasuredEvent, 'bandHz'>) => (classModels.size === 0 ? model : classModels.get(bandClassOf(event)) ?? model);
  const classes = [...classModels.entries()].map(([key, m]) => `band class ${key}: ${describeTimingModel(m)}`);
  const note = classes.length === 0 ? describeTimingModel(model) : `${classes.join('; ')}${classModels.size < evidenceByClass.size ? `; other sounds: ${describeTimingModel(model)}` : ''}`;
  return { model, classModels, note, modelOf };
}
