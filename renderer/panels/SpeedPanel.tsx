// Speed of sound for the site: medium and conditions in, metres per second and its temperature sensitivity out.
import { useMemo, useState } from 'react';
import { MEDIUM_DEFAULTS, speedOfSound, type MediumSpec } from '../../core/medium';

type MediumName = MediumSpec['medium'];

export function SpeedPanel() {
  const [medium, setMedium] = useState<MediumName>('air');
  const [temperature, setTemperature] = useState(String(MEDIUM_DEFAULTS.temperatureCelsius));
  const [humidity, setHumidity] = useState(String(MEDIUM_DEFAULTS.relativeHumidityPercent));
  const [salinity, setSalinity] = useState(String(MEDIUM_DEFAULTS.salinityPartsPerThousand));
  const [depth, setDepth] = useState(String(MEDIUM_DEFAULTS.depthMeters));

  const result = useMemo(() => {
    const numbers = { temperature: Number(temperature), humidity: Number(humidity), salinity: Number(salinity), depth: Number(depth) };
    const blank = Object.entries({ temperature, humidity, salinity, depth }).find(([, text]) => text.trim() === '');
    if (blank) return { error: `Enter a number for ${blank[0]}.` };
    const spec: MediumSpec = medium === 'air'
      ? { medium, temperatureCelsius: numbers.temperature, relativeHumidityPercent: numbers.humidity }
      : medium === 'seawater'
        ? { medium, temperatureCelsius: numbers.temperature, salinityPartsPerThousand: numbers.salinity, depthMeters: numbers.depth }
        : { medium, temperatureCelsius: numbers.temperature };
    try {
      return { speed: speedOfSound(spec) };
    } catch (error) {
      return { error: error instanceof Error ? error.message : String(error) };
    }
  }, [medium, temperature, humidity, salinity, depth]);

  return (
    <section className="panel" aria-labelledby="speed-title">
      <h2 id="speed-title">Speed of sound</h2>
      <div className="form-grid">
        <label>Medium
          <select value={medium} onChange={(event) => setMedium(event.target.value as MediumName)}>
            <option value="air">air</option>
            <option value="seawater">seawater</option>
            <option value="freshwater">fresh water</option>
          </select>
        </label>
        <label>Temperature (°C)<input inputMode="decimal" value={temperature} onChange={(event) => setTemperature(event.target.value)} /></label>
        {medium === 'air' && <label>Relative humidity (%)<input inputMode="decimal" value={humidity} onChange={(event) => setHumidity(event.target.value)} /></label>}
        {medium === 'seawater' && <label>Salinity (ppt)<input inputMode="decimal" value={salinity} onChange={(event) => setSalinity(event.target.value)} /></label>}
        {medium === 'seawater' && <label>Depth (m)<input inputMode="decimal" value={depth} onChange={(event) => setDepth(event.target.value)} /></label>}
      </div>
      {'speed' in result && result.speed ? (
        <p className="result" data-testid="speed-result">
          <strong>{result.speed.speedMetersPerSecond.toFixed(2)} m/s</strong>
          <span className="muted"> ({result.speed.model}; {result.speed.sensitivityMetersPerSecondPerKelvin.toFixed(2)} m/s per K of temperature error)</span>
        </p>
      ) : (
        <p className="error" role="alert">{result.error}</p>
      )}
    </section>
  );
}
