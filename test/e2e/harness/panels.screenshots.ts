// Screenshots of the panels harness at 1440 x 900 in headless Chromium (test only), each view also checked (exit 1 naming
// what is wrong): the invented data as loaded, wrong cells, lat/lon mode and an export. Serve the harness first
// (panels.vite.config.ts), then:   npx tsx test/e2e/harness/panels.screenshots.ts OUT_DIR
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
page.on('console', (message) => { if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) errors.push(message.text()); });
// A missing favicon is the dev server's business; any other missing file is a fault.
page.on('response', (response) => { if (response.status() >= 400 && !response.url().endsWith('/favicon.ico')) errors.push(`${response.status()} ${response.url()}`); });
const failures: string[] = [];
/** Records a failed check of the view (the script ends with exit code 1 listing them). */
const check = (ok: boolean, what: string): void => { if (!ok) failures.push(what); };
const text = async (testId: string): Promise<string> => ((await page.getByTestId(testId).count()) > 0 ? page.getByTestId(testId).innerText() : '');
const shot = async (name: string, options: { fullPage?: boolean } = {}) => page.screenshot({ path: join(out, `${name}.png`), ...options });

await page.goto(url);
await page.getByTestId('microphones-panel').waitFor();
check(await page.getByTestId('microphone-cell-6-east').count() === 1 && await page.getByTestId('microphone-cell-7-east').count() === 0, '01: the invented array shows six microphones');
check(await page.getByTestId('fixlog-row-fix-3').count() === 1, '01: the fix log lists the invented fixes');
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
for (const [testId, what] of [['microphone-message-2', 'text in a number'], ['microphone-message-4', 'a duplicate channel'], ['microphone-message-7', 'a channel beyond the recording'], ['settings-temperature-message', 'a temperature outside Cramer'], ['settings-band-high-message', 'reversed band edges']] as const) {
  check((await text(testId)).trim() !== '', `02: ${testId} explains ${what}`);
}
check(await page.getByTestId('settings-speed').getAttribute('data-stale') === 'true', '02: the speed is marked stale while the temperature is wrong');
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
// Mackenzie (1981) check value at 25 °C, 35 ppt, 1000 m: 1550.744 m/s (check-values.md), shown to 0.01 m/s.
check((await text('settings-speed')).startsWith('1550.74 m/s'), `03: seawater at 25 °C, 35 ppt, 1000 m shows 1550.74 m/s (shows "${await text('settings-speed')}")`);
check(await page.getByTestId('microphone-cell-1-lat').count() === 1, '03: lat/lon mode shows latitude cells');
check(!(await page.getByTestId('fixlog-accept-fix-2').isChecked()), '03: the unticked fix stays unticked');
check((await text('harness-exported')).includes('blackbird'), '03: the exported log carries the edited label');
await shot('03-geodetic-export', { fullPage: true });

// Collinear layout, and a narrower window.
await page.getByTestId('microphones-mode-local').click();
for (const row of [1, 2, 3, 4, 5, 6]) await page.getByTestId(`microphone-cell-${row}-north`).fill(String(row * 0.1));
check(/microphones lie on one line/.test(await text('microphones-messages')), `04: a message says the microphones lie on one line (shows "${await text('microphones-messages')}")`);
await shot('04-collinear');

// Import an invented GNSS table (the harness hands it back as the host would): lat/lon mode; then export it.
await page.getByTestId('microphones-import').click();
await page.getByTestId('microphone-cell-4-lat').waitFor();
await page.getByTestId('microphones-export').click();
await shot('05-imported');
const exportedArray = await page.getByTestId('harness-exported').innerText();
check(exportedArray.includes('channel,label,lat,lon,alt_m,sigma_m\n') && exportedArray.trim().split('\n').filter((line) => /^\d+,/.test(line)).length === 4, '05: the imported GNSS table exports as four lat/lon rows');

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

check(noOrigin.geodeticDisabled && noOrigin.geojsonDisabled, '06: without an origin, lat/lon mode and GeoJSON export are disabled');
check(/broken\.csv was not imported: .*missing column 'lon'/.test(noOrigin.messages), '06: the failed import names the file and the missing column');
check(/beyond the recording's 5 channels/.test(noOrigin.row6), '06: microphone 6 is marked beyond a 5-channel recording');

// A fixed speed starts from the speed in use.
await page.getByTestId('settings-medium').selectOption('fixed-speed');
const fixedSpeed = await page.getByTestId('settings-fixed-speed').inputValue();
const speed = await page.getByTestId('settings-speed').innerText();
check(Math.abs(Number(fixedSpeed) - Number.parseFloat(speed)) < 0.05, `07: the fixed speed ${fixedSpeed} starts from the speed in use (${speed.split('\n')[0]})`);
check(errors.length === 0, `no page errors (${errors.join('; ')})`);

console.log(JSON.stringify({ errors, fixedSpeed, speed, exportedArray, noOrigin }, null, 1));
await browser.close();
if (failures.length > 0) {
  console.error(`${failures.length} check(s) of the views failed:\n${failures.map((failure) => `  - ${failure}`).join('\n')}`);
  process.exit(1);
}
console.log('All checks of the views passed.');
