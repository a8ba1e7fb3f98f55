import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { SettingsPanel } from '../../../renderer/settings';

describe('SettingsPanel', () => {
  it('SettingsPanel shows the seawater speed of the Mackenzie (1981) check value and its fields by test id', () => {
    const html = renderToStaticMarkup(
      <SettingsPanel value={{ medium: { medium: 'seawater', temperatureCelsius: 25, salinityPartsPerThousand: 35, depthMeters: 1000, temperatureSigmaKelvin: 1 }, settings: { dimensions: 2, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' } }} onChange={() => undefined} />,
    );
    const speed = /data-testid="settings-speed"[^>]*>(.*?)<\/div>/.exec(html)?.[1] ?? '';
    expect(speed).toContain('1550.74 m/s'); // Mackenzie (1981): 1550.744 m/s
    expect(speed).toContain('Mackenzie (1981)');
    expect(html).toContain('data-stale="false"');
    for (const id of ['settings-panel', 'settings-medium', 'settings-temperature', 'settings-dims', 'settings-height', 'settings-confidence', 'settings-weighting', 'settings-band-low', 'settings-band-high', 'settings-salinity', 'settings-depth']) {
      expect(html).toContain(`data-testid="${id}"`);
    }
  });

  it('SettingsPanel marks the speed stale when the document\'s medium is outside its model', () => {
    const html = renderToStaticMarkup(
      <SettingsPanel value={{ medium: { medium: 'air', temperatureCelsius: 45, model: 'cramer', temperatureSigmaKelvin: 1 }, settings: { dimensions: 3, confidence: 0.9, weighting: 'scot', bandHz: 'automatic' } }} onChange={() => undefined} />,
    );
    expect(html).toContain('data-stale="true"');
    expect(html).toMatch(/data-testid="settings-temperature-message"[^>]*>Temperature = 45 °C is outside/);
  });
});
