// End-to-end helper: builds the web renderer with the demo, serves it on 127.0.0.1 with Vite's preview server and
// drives it with playwright-core in Debian's Chromium (no GPU, no network).
import { existsSync, mkdirSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { chromium, type Browser, type Page } from 'playwright-core';
import { preview, type PreviewServer } from 'vite';

export const CHROMIUM_PATH = '/usr/bin/chromium';
export const SCREENSHOT_FOLDER = 'test-output/screenshots';

export function chromiumAvailable(): boolean {
  return existsSync(CHROMIUM_PATH);
}

export interface WebApp { server: PreviewServer; browser: Browser; url: string; close(): Promise<void> }

export async function startWebApp(port: number): Promise<WebApp> {
  if (!existsSync('assets/demo/out/demo-recording.wav')) execFileSync(process.execPath, ['--import', 'tsx', 'assets/demo/make-demo.ts'], { stdio: 'pipe' });
  execFileSync(process.execPath, ['scripts/build.mjs', 'web'], { stdio: 'pipe' });
  const server = await preview({ configFile: 'vite.config.ts', logLevel: 'error', preview: { host: '127.0.0.1', port, strictPort: true } });
  const browser = await chromium.launch({
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  mkdirSync(SCREENSHOT_FOLDER, { recursive: true });
  return {
    server, browser, url: `http://127.0.0.1:${port}/`,
    async close() {
      await browser.close();
      await new Promise<void>((resolve) => server.httpServer.close(() => resolve()));
    },
  };
}

export async function openPage(app: WebApp): Promise<Page> {
  const context = await app.browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true });
  const page = await context.newPage();
  page.on('pageerror', (error) => { throw error; });
  await page.goto(app.url);
  return page;
}

/** Screenshots of the page at 1440×900 and at 1280×720, named `<name>-<width>x<height>.png`, back at 1440×900 after. */
export async function shots(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `${SCREENSHOT_FOLDER}/${name}-1440x900.png` });
  await page.setViewportSize({ width: 1280, height: 720 });
  await page.waitForTimeout(300);
  await page.screenshot({ path: `${SCREENSHOT_FOLDER}/${name}-1280x720.png` });
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.waitForTimeout(300);
}
