// The locate settings: medium and its inputs with the live speed of sound, correlation weighting and band, 2-D/3-D, confidence,
// detection threshold and channels. Fields keep what was typed; only a wholly valid medium or settings block is applied.
import { useState, type ReactNode } from 'react';
import { MEDIUM_DEFAULTS } from '../../core/medium';
import type { GccWeighting } from '../../core/dsp';
import { describeSpeed, type SpeedDescription } from './describeSpeed';
import {
  CONFIDENCE_PRESETS,
  DEFAULT_THRESHOLD_DB,
  formFromValue,
  readConfidence,
  readSettingsForm,
  type MediumKind,
  type SettingsForm,
  type SettingsReading,
  type SettingsTextField,
  type SettingsValue,
} from './settingsForm';
import { WEIGHTING_CHOICES, weightingChoice } from './weightingHints';
import './settings.css';

export interface SettingsPanelProps {
  /** The project's medium and settings (the last good ones). */
  value: SettingsValue;
  /** Called with the next medium and settings after an edit that leaves them valid. */
  onChange(next: SettingsValue): void;
  /** Mean height of the microphones, shown as the 2-D source height used when none is typed. */
  meanMicrophoneUpMeters?: number;
}

interface FormState {
  form: SettingsForm;
  syncedKey: string;
  emittedKey?: string;
}

const MEDIUM_NAMES: Record<MediumKind, string> = { air: 'air', seawater: 'seawater', freshwater: 'fresh water', 'fixed-speed': 'fixed speed of sound' };

function keyOf(value: SettingsValue): string {
  return JSON.stringify(value);
}

function nextValue(reading: SettingsReading, value: SettingsValue): SettingsValue {
  return { medium: reading.medium ?? value.medium, settings: reading.settings };
}

export function SettingsPanel({ value, onChange, meanMicrophoneUpMeters }: SettingsPanelProps) {
  const propsKey = keyOf(value);
  const [state, setState] = useState<FormState>(() => ({ form: formFromValue(value), syncedKey: propsKey }));
  let current = state;
  if (propsKey !== state.syncedKey) {
    current = propsKey === state.emittedKey ? { ...state, syncedKey: propsKey } : { form: formFromValue(value), syncedKey: propsKey };
    setState(current);
  }
  const form = current.form;
  const reading = readSettingsForm(form, value);
  const inUse = describeSpeed(value.medium);

  /** A choice (select, radio, preset) applies at once; typing in a field waits for Enter or leaving it (`typing`). */
  function edit(patch: Partial<SettingsForm>, typing = false): void {
    const nextForm = { ...form, ...patch };
    if (typing) {
      setState({ form: nextForm, syncedKey: current.syncedKey, ...(current.emittedKey !== undefined ? { emittedKey: current.emittedKey } : {}) });
      return;
    }
    const next = nextValue(readSettingsForm(nextForm, value), value);
    const key = keyOf(next);
    let emittedKey = current.emittedKey;
    if (key !== propsKey && key !== current.emittedKey) {
      emittedKey = key;
      onChange(next);
    }
    setState({ form: nextForm, syncedKey: current.syncedKey, emittedKey });
  }

  /** Switching to a fixed speed starts from the speed in use, so the fix does not jump while the measured value is typed. */
  function chooseMedium(kind: MediumKind): void {
    const start = kind === 'fixed-speed' && form.speed.trim() === '' && inUse.ok
      ? { speed: inUse.speedMetersPerSecond.toFixed(1), speedSigma: inUse.speedSigmaMetersPerSecond.toFixed(2) }
      : {};
    edit({ medium: kind, ...start });
  }

  const messages = reading.messages;
  const field = (name: SettingsTextField, label: ReactNode, unit: string, options: { testId?: string; placeholder?: string; title?: string; disabled?: boolean; width?: string } = {}) => (
    <NumberField name={name} label={label} unit={unit} text={form[name]} message={messages[name]} onText={(text) => edit({ [name]: text }, true)} {...options} />
  );

  const choice = weightingChoice(form.weighting);
  const typedConfidence = readConfidence(form.confidence);

  return (
    <section className="panel set-panel" data-testid="settings-panel" aria-labelledby="settings-title"
      onBlur={() => edit({})} onKeyDown={(event) => { if (event.key === 'Enter' && event.target instanceof HTMLInputElement) edit({}); }}>
      <h2 id="settings-title">Settings</h2>

      <fieldset className="set-group">
        <legend>Speed of sound</legend>
        <div className="set-grid">
          <label className="set-row">
            <span className="set-label">Medium</span>
            <select data-testid="settings-medium" value={form.medium} onChange={(event) => chooseMedium(event.target.value as MediumKind)}>
              {(Object.keys(MEDIUM_NAMES) as MediumKind[]).map((kind) => <option key={kind} value={kind}>{MEDIUM_NAMES[kind]}</option>)}
            </select>
          </label>
          {form.medium !== 'air' && <span aria-hidden="true" />}
          {form.medium === 'air' && (
            <label className="set-row" title="Cramer (1993) includes humidity, pressure and CO₂; the ideal gas only the temperature">
              <span className="set-label">Model</span>
              <select data-testid="settings-air-model" value={form.airModel} onChange={(event) => edit({ airModel: event.target.value as SettingsForm['airModel'] })}>
                <option value="cramer">Cramer (1993)</option>
                <option value="ideal-gas">ideal gas (dry)</option>
              </select>
            </label>
          )}
          {form.medium === 'fixed-speed' ? (
            <>
              {field('speed', 'Speed', 'm/s', { testId: 'settings-fixed-speed', title: 'A speed of sound measured on site, e.g. by a calibration shot' })}
              {field('speedSigma', 'its σ', 'm/s', { placeholder: '0' })}
            </>
          ) : (
            <>
              {field('temperature', 'Temperature', '°C', { testId: 'settings-temperature' })}
              {field('temperatureSigma', 'its σ', 'K', { testId: 'settings-temperature-sigma', title: 'Uncertainty of the temperature along the sound paths; it sets the speed\'s σ' })}
              {form.medium === 'air' && form.airModel === 'cramer' && (
                <>
                  {field('humidity', 'Humidity', '% RH', { testId: 'settings-humidity', placeholder: String(MEDIUM_DEFAULTS.relativeHumidityPercent) })}
                  {field('pressure', 'Pressure', 'kPa', { testId: 'settings-pressure', placeholder: String(MEDIUM_DEFAULTS.pressureKilopascals), title: 'Station pressure; 1 hPa = 0.1 kPa' })}
                  {field('co2', 'CO₂', 'ppm', { testId: 'settings-co2', placeholder: String(MEDIUM_DEFAULTS.co2PartsPerMillion) })}
                </>
              )}
              {form.medium === 'seawater' && (
                <>
                  {field('salinity', 'Salinity', 'ppt', { testId: 'settings-salinity', placeholder: String(MEDIUM_DEFAULTS.salinityPartsPerThousand) })}
                  {field('depth', 'Depth', 'm', { testId: 'settings-depth', placeholder: String(MEDIUM_DEFAULTS.depthMeters), title: 'Depth below the surface, metres (positive down)' })}
                </>
              )}
            </>
          )}
        </div>
        <SpeedReadout typed={reading.speed} applied={reading.medium !== undefined} inUse={inUse} />
      </fieldset>

      <fieldset className="set-group">
        <legend>Correlation</legend>
        <div className="set-grid">
          <label className="set-row">
            <span className="set-label">Weighting</span>
            <select data-testid="settings-weighting" value={form.weighting} onChange={(event) => edit({ weighting: event.target.value as GccWeighting })}>
              {WEIGHTING_CHOICES.map((c) => <option key={c.value} value={c.value}>{c.name}</option>)}
            </select>
          </label>
          <p className="set-hint set-span" data-testid="settings-weighting-hint">{choice.hint}</p>
          <div className="set-row set-span" role="radiogroup" aria-label="Correlation band">
            <span className="set-label">Band</span>
            <span className="set-choices">
              <label><input type="radio" name="set-band" data-testid="settings-band-automatic" checked={form.bandMode === 'automatic'} onChange={() => edit({ bandMode: 'automatic' })} /> automatic, per event</label>
              <label><input type="radio" name="set-band" data-testid="settings-band-fixed" checked={form.bandMode === 'fixed'} onChange={() => edit({ bandMode: 'fixed' })} /> fixed</label>
            </span>
          </div>
          <BandFields form={form} messages={messages} onEdit={edit} />
        </div>
      </fieldset>

      <fieldset className="set-group">
        <legend>Fix</legend>
        <div className="set-grid">
          <label className="set-row">
            <span className="set-label">Solve in</span>
            <select data-testid="settings-dims" value={String(form.dimensions)} onChange={(event) => edit({ dimensions: event.target.value === '3' ? 3 : 2 })}>
              <option value="2">2-D, known height</option>
              <option value="3">3-D</option>
            </select>
          </label>
          {field('height', 'Source height', 'm', {
            testId: 'settings-height',
            disabled: form.dimensions === 3,
            placeholder: form.dimensions === 3 ? 'solved' : meanMicrophoneUpMeters !== undefined ? `${meanMicrophoneUpMeters.toFixed(2)} (mics' mean)` : 'mics\' mean',
            title: form.dimensions === 3 ? 'A 3-D fix finds the height itself' : 'Height of the source in the local frame (metres up); blank: the microphones\' mean height',
          })}
          {field('heightSigma', 'Height ± (1σ)', 'm', {
            testId: 'settings-height-sigma',
            disabled: form.dimensions === 3,
            placeholder: form.dimensions === 3 ? 'solved' : '0',
            title: form.dimensions === 3 ? 'A 3-D fix finds the height itself' : 'How uncertain the source height is (one sigma, metres); it widens the ellipses. A source anywhere between LOW and HIGH: (HIGH - LOW) / 3.46',
          })}
          <div className="set-row set-span">
            <span className="set-label">Confidence</span>
            <span className="set-input">
              <input type="text" inputMode="decimal" spellCheck={false} className={`set-num ${messages.confidence ? 'set-error' : ''}`} style={{ width: '4.5em' }} data-testid="settings-confidence" value={form.confidence}
                aria-invalid={messages.confidence ? true : undefined} onChange={(event) => edit({ confidence: event.target.value }, true)} aria-label="Confidence level of the ellipse" />
              <span className="set-presets">
                {CONFIDENCE_PRESETS.map((preset) => (
                  <button key={preset} type="button" className={'value' in typedConfidence && Math.abs(typedConfidence.value - preset) < 1e-9 ? 'set-on' : ''} data-testid={`settings-confidence-${Math.round(preset * 100)}`} onClick={() => edit({ confidence: String(preset) })}>
                    {Math.round(preset * 100)} %
                  </button>
                ))}
              </span>
            </span>
            {messages.confidence && <span className="set-message" data-testid="settings-confidence-message">{messages.confidence}</span>}
          </div>
        </div>
      </fieldset>

      <fieldset className="set-group">
        <legend>Detection</legend>
        <div className="set-grid">
          {field('threshold', 'Threshold', 'dB', { testId: 'settings-threshold', placeholder: String(DEFAULT_THRESHOLD_DB), title: 'Energy above the noise floor that starts an event; blank: 10 dB' })}
          {field('minChannels', 'Min. channels', '', { testId: 'settings-min-channels', placeholder: 'auto', title: 'How many channels must hear a sound for it to count; blank: half the microphones, at least 3' })}
        </div>
      </fieldset>
    </section>
  );
}

interface NumberFieldProps {
  name: SettingsTextField;
  label: ReactNode;
  unit: string;
  text: string;
  message: string | undefined;
  onText(text: string): void;
  testId?: string;
  placeholder?: string;
  title?: string;
  disabled?: boolean;
  width?: string;
}

function NumberField({ name, label, unit, text, message, onText, testId, placeholder, title, disabled, width }: NumberFieldProps) {
  return (
    <label className="set-row" title={title}>
      <span className="set-label">{label}</span>
      <span className="set-input">
        <input type="text" inputMode="decimal" spellCheck={false} className={`set-num ${message ? 'set-error' : ''}`} style={width ? { width } : undefined} value={text} placeholder={placeholder} disabled={disabled}
          aria-invalid={message ? true : undefined} data-testid={testId ?? `settings-${name}`} onChange={(event) => onText(event.target.value)} />
        <span className="set-unit">{unit}</span>
      </span>
      {message && <span className="set-message" data-testid={`${testId ?? `settings-${name}`}-message`}>{message}</span>}
    </label>
  );
}

function BandFields({ form, messages, onEdit }: { form: SettingsForm; messages: SettingsReading['messages']; onEdit(patch: Partial<SettingsForm>, typing?: boolean): void }) {
  // Typing an edge chooses the fixed band, so the edges are never locked away.
  const edge = (name: 'bandLow' | 'bandHigh', label: string, testId: string) => (
    <label className="set-row">
      <span className="set-label">{label}</span>
      <span className="set-input">
        <input type="text" inputMode="decimal" spellCheck={false} className={`set-num ${messages[name] && form.bandMode === 'fixed' ? 'set-error' : ''} ${form.bandMode === 'automatic' ? 'set-idle' : ''}`} value={form[name]}
          placeholder={form.bandMode === 'automatic' ? 'auto' : ''} data-testid={testId} aria-invalid={messages[name] ? true : undefined}
          onChange={(event) => onEdit({ [name]: event.target.value, bandMode: 'fixed' }, true)} />
        <span className="set-unit">Hz</span>
      </span>
      {messages[name] && <span className="set-message" data-testid={`${testId}-message`}>{messages[name]}</span>}
    </label>
  );
  return (
    <>
      {edge('bandLow', 'Low edge', 'settings-band-low')}
      {edge('bandHigh', 'High edge', 'settings-band-high')}
    </>
  );
}

function SpeedReadout({ typed, applied, inUse }: { typed: SpeedDescription | undefined; applied: boolean; inUse: SpeedDescription }) {
  const stale = !applied;
  const shown = applied && typed !== undefined && typed.ok ? typed : inUse.ok ? inUse : undefined;
  if (shown === undefined || !shown.ok) {
    return (
      <div className="set-speed set-stale" data-testid="settings-speed" data-stale="true">
        <strong>— m/s</strong>
        <span className="set-speed-note">No usable speed yet: correct the marked field.</span>
      </div>
    );
  }
  const sensitivity = shown.sensitivityMetersPerSecondPerKelvin;
  return (
    <div className={`set-speed ${stale ? 'set-stale' : ''}`} data-testid="settings-speed" data-stale={stale ? 'true' : 'false'} title={shown.reference}>
      <strong>{shown.speedMetersPerSecond.toFixed(2)} m/s</strong>
      <span className="set-speed-sigma">± {shown.speedSigmaMetersPerSecond.toFixed(2)} m/s (1σ)</span>
      {stale && <span className="set-chip" data-testid="settings-speed-stale">stale</span>}
      <span className="set-speed-note">
        {stale
          ? 'The typed inputs are not applied; this is the speed still in use.'
          : sensitivity !== undefined
            ? `${shown.sourceLabel}; ${Math.abs(sensitivity).toFixed(2)} m/s per K of temperature error`
            : 'given by you'}
      </span>
    </div>
  );
}
