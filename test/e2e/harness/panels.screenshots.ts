// Screenshots of the panels harness at 1440 x 900 in headless Chromium (test only): the invented data as loaded, then with
// wrong cells typed, a stale speed, lat/lon mode and an export. Serve the harness first (panels.vite.config.ts), then:
//   npx tsx test/e2e/harness/panels.screenshots.ts OUT_DIR
import { chromium } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';

const out = process.argv[2] ?? '.tmp/panels-shots';
mkdirSync(out, { recursive: true });
const url = 'http://127.0.0.1:5361/panels.html';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu'] });
const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
const errors: string[] = [];
page.on('pageerror', (error) => errors.push(String(error)));
page.on('console', (message) => { if (message.type() === 'error') errors.push(message.text()); });
const shot = async (name: string, options: { fullPage?: boolean } = {}) => page.screenshot({ path: join(out, `${name}.png`), ...options });

await page.goto(url);
await page.getByTestId('microphones-panel').waitFor();
await shot('01-loaded');

// Wrong cells: text in a number, a duplicate channel, a copied position, a channel beyond the recording.
await page.getByTestId('microphone-cell-2-east').fill('38,42');
await page.getByTestId('microphone-cell-4-channel').fill('3');
await page.getByTestId('microphone-add').click();
await page.getByTestId('microphone-cell-7-channel').fill('9');
await page.getByTestId('microphone-cell-7-east').fill('20');
await page.getByTestId('microphone-cell-7-north').fill('28.15');
await page.getByTestId('microphone-cell-7-up').fill('1.5');
// Settings: out-of-range temperature for Cramer, a band with its edges reversed, a typed confidence.
await page.getByTestId('settings-temperature').fill('41');
await page.getByTestId('settings-band-low').fill('6000');
await page.getByTestId('settings-band-high').fill('2000');
await page.getByTestId('settings-confidence').fill('0.9');
await shot('02-messages');

// Lat/Lon mode after correcting the table; then the fix log: reject one, edit a label, export CSV.
await page.getByTestId('microphone-cell-2-east').fill('38.42');
await page.getByTestId('microphone-cell-4-channel').fill('4');
await page.getByTestId('microphone-remove-7').click();
await page.getByTestId('microphones-mode-geodetic').click();
await page.getByTestId('settings-medium').selectOption('seawater');
await page.getByTestId('settings-temperature').fill('25');
await page.getByTestId('settings-salinity').fill('35');
await page.getByTestId('settings-depth').fill('1000');
await page.getByTestId('fixlog-accept-fix-2').uncheck();
await page.getByTestId('fixlog-label-fix-3').fill('blackbird');
await page.getByTestId('fixlog-label-fix-3').press('Enter');
await page.getByTestId('fixlog-row-fix-3').click({ position: { x: 60, y: 8 } });
await page.getByTestId('fixlog-export-csv').click();
await shot('03-geodetic-export', { fullPage: true });

// Collinear layout, and a narrower window.
await page.getByTestId('microphones-mode-local').click();
for (const row of [1, 2, 3, 4, 5, 6]) await page.getByTestId(`microphone-cell-${row}-north`).fill(String(row * 0.1));
await shot('04-collinear');

// Import an invented GNSS table (the harness hands it back as the host would): lat/lon mode; then export it.
await page.getByTestId('microphones-import').click();
await page.getByTestId('microphone-cell-4-lat').waitFor();
await page.getByTestId('microphones-export').click();
await shot('05-imported');
const exportedArray = await page.getByTestId('harness-exported').innerText();

// Without an origin, and an import that fails: the reader's message in the table's messages.
await page.goto(`${url}?origin=none&import=bad&channels=5`);
await page.getByTestId('microphones-import').click();
await page.getByTestId('microphones-messages').waitFor();
await shot('06-no-origin-bad-import');
const noOrigin = {
  geodeticDisabled: await page.getByTestId('microphones-mode-geodetic').isDisabled(),
  geojsonDisabled: await page.getByTestId('fixlog-export-geojson').isDisabled(),
  messages: await page.getByTestId('microphones-messages').innerText(),
  row6: await page.getByTestId('microphone-message-6').innerText(),
};

// A fixed speed starts from the speed in use.
await page.getByTestId('settings-medium').selectOption('fixed-speed');
const fixedSpeed = await page.getByTestId('settings-fixed-speed').inputValue();

console.log(JSON.stringify({ errors, fixedSpeed, speed: await page.getByTestId('settings-speed').innerText(), exportedArray, noOrigin }, null, 1));
await browser.close();
