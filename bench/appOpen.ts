// Benchmark: the web app (Debian's Chromium via playwright-core) opening the 2-hour, 8-channel, 48 kHz, 24-bit recording
// of bench/longRecording.ts: time to the first overview and to the exact one, peak memory of the tab (renderer
// process RSS, with its Web Worker; and the page's JS heap), and whether Find & locate shows progress. Targets: overview
// <= 5 s, tab memory <= 500 MB. Skipped when /usr/bin/chromium is missing.
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import type { Page } from 'playwright-core';
import { chromiumAvailable, openPage, startWebApp } from '../test/helpers/webApp';
import { ensureLongRecording, LONG_RECORDING_MICROPHONES, LONG_RECORDING_PATH } from './longRecording';

const PORT = 5397;
const ARRAY_PATH = '/tmp/whence-bench-2h-8ch-array.csv';

/** Process ids under `root` (from /proc), so the renderers of our browser are told from other Chromiums on the machine. */
function descendants(root: number): number[] {
  const parentOf = new Map<number, number>();
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = readFileSync(`/proc/${name}/stat`, 'utf8');
      parentOf.set(Number(name), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
    } catch {
      // Gone meanwhile.
    }
  }
  const found: number[] = [];
  const queue = [root];
  while (queue.length > 0) {
    const pid = queue.pop()!;
    for (const [child, parent] of parentOf) if (parent === pid) { found.push(child); queue.push(child); }
  }
  return found;
}

/** CPU seconds (user + system) used so far by the renderer processes under `browserPid`. */
function rendererCpuSeconds(browserPid: number): number {
  let ticks = 0;
  for (const pid of descendants(browserPid)) {
    try {
      if (!readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('--type=renderer')) continue;
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      ticks += Number(fields[11]) + Number(fields[12]);
    } catch {
      // Gone meanwhile.
    }
  }
  return ticks / 100;
}

function rendererRssMegabytes(browserPid: number): number {
  let largest = 0;
  for (const pid of descendants(browserPid)) {
    try {
      if (!readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('--type=renderer')) continue;
      const kb = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0);
      largest = Math.max(largest, kb / 1024);
    } catch {
      // Gone meanwhile.
    }
  }
  return largest;
}

async function pageHeapMegabytes(page: Page): Promise<number> {
  const session = await page.context().newCDPSession(page);
  await session.send('Performance.enable');
  const { metrics } = await session.send('Performance.getMetrics');
  await session.detach();
  return (metrics.find((m) => m.name === 'JSHeapUsedSize')?.value ?? 0) / 1048576;
}

async function main(): Promise<void> {
  if (!chromiumAvailable()) {
    console.log('app-open: skipped (no /usr/bin/chromium; apt-get install chromium)');
    return;
  }
  const fileBytes = await ensureLongRecording(LONG_RECORDING_PATH, (line) => console.log(`  ${line}`));
  writeFileSync(ARRAY_PATH, 'channel,label,x_m,y_m,z_m,sigma_m\n' + LONG_RECORDING_MICROPHONES.map(([e, n, u], i) => `${i + 1},M${i + 1},${e},${n},${u},0.02`).join('\n') + '\n');
  const app = await startWebApp(PORT);
  try {
    const page = await openPage(app);
    // Chromium runs as a child of this process: its renderers are found among our descendants.
    const browser = process.pid;
    // Let the demo the page opens with settle, so the figures are of the big file alone.
    await page.waitForFunction(() => document.querySelectorAll('[data-testid^="event-row-"]').length >= 15, undefined, { timeout: 120_000 });
    const idleRss = rendererRssMegabytes(browser);
    let started = performance.now();
    let peakRss = idleRss;
    const verbose = process.env.WHENCE_BENCH_VERBOSE === '1';
    let samples = 0;
    const sampler = setInterval(() => {
      const rss = rendererRssMegabytes(browser);
      peakRss = Math.max(peakRss, rss);
      if (verbose && ++samples % 25 === 0) {
        void Promise.all([page.locator('[data-testid="busy"] span').first().textContent({ timeout: 1000 }).catch(() => ''), pageHeapMegabytes(page).catch(() => Number.NaN)])
          .then(([busy, heap]) => console.log(`  ${((performance.now() - started) / 1000).toFixed(0)} s: renderer RSS ${rss.toFixed(0)} MB, page JS heap ${heap.toFixed(0)} MB; ${busy ?? ''}`));
      }
    }, 200);
    const name = LONG_RECORDING_PATH.split('/').pop()!;

    const chooser = page.waitForEvent('filechooser');
    await page.locator('[data-testid="open-recording"]').click();
    started = performance.now();
    const cpuAtOpen = rendererCpuSeconds(browser);
    const loadAtOpen = readFileSync('/proc/loadavg', 'utf8').split(' ')[0];
    await (await chooser).setFiles(LONG_RECORDING_PATH);
    await page.locator(`[data-testid="recording-view"][aria-label="Recording ${name}"]`).waitFor({ timeout: 60_000 });
    const headerSeconds = (performance.now() - started) / 1000;
    // The overview is drawn once the "Building the overview" overlay has gone (a sampled preview first on long files).
    await page.locator('[data-testid="recording-view"] .rv-progress').waitFor({ state: 'detached', timeout: 600_000 });
    const firstOverviewSeconds = (performance.now() - started) / 1000;
    const firstOverviewCpu = rendererCpuSeconds(browser) - cpuAtOpen;
    if (verbose) console.log(`  first overview after ${firstOverviewSeconds.toFixed(2)} s`);
    const rssAtFirst = rendererRssMegabytes(browser);
    // The exact overview: the busy line ("Overview of ...") has gone.
    await page.waitForFunction(() => !(document.querySelector('[data-testid="busy"]')?.textContent ?? '').startsWith('Overview'), undefined, { timeout: 900_000, polling: 200 });
    const exactOverviewSeconds = (performance.now() - started) / 1000;
    const exactOverviewCpu = rendererCpuSeconds(browser) - cpuAtOpen;
    const peakRssOverview = Math.max(peakRss, rendererRssMegabytes(browser));
    const heapAfterOverview = await pageHeapMegabytes(page);
    await page.screenshot({ path: 'test-output/screenshots/bench-app-open-2h.png' });

    // Find & locate with the recording's own array: the busy line must move, then Stop ends it.
    const arrayChooser = page.waitForEvent('filechooser');
    await page.locator('[data-testid="open-array"]').click();
    await (await arrayChooser).setFiles(ARRAY_PATH);
    await page.waitForFunction(() => !(document.querySelector('[data-testid="locate-all"]') as HTMLButtonElement | null)?.disabled, undefined, { timeout: 30_000 });
    await page.locator('[data-testid="locate-all"]').click();
    const locateStarted = performance.now();
    const progress: string[] = [];
    let firstProgressSeconds = Number.NaN;
    while (performance.now() - locateStarted < 30_000) {
      const busy = page.locator('[data-testid="busy"]');
      if ((await busy.count()) > 0) {
        const text = ((await busy.locator('span').first().textContent()) ?? '').trim();
        const value = Number(await busy.locator('progress').getAttribute('value'));
        if (value > 0 && Number.isNaN(firstProgressSeconds)) firstProgressSeconds = (performance.now() - locateStarted) / 1000;
        const line = `${((performance.now() - locateStarted) / 1000).toFixed(1)} s: ${(value * 100).toFixed(1)} % ${text}`;
        if (progress.at(-1)?.replace(/^[\d.]+ s: /, '') !== line.replace(/^[\d.]+ s: /, '')) progress.push(line);
      }
      await page.waitForTimeout(1000);
    }
    if ((await page.locator('[data-testid="cancel-work"]').count()) > 0) await page.locator('[data-testid="cancel-work"]').click();
    await page.locator('[data-testid="busy"]').waitFor({ state: 'detached', timeout: 60_000 });
    const stoppedSeconds = (performance.now() - locateStarted) / 1000;
    clearInterval(sampler);
    peakRss = Math.max(peakRss, rendererRssMegabytes(browser));

    console.log(`app-open: web app in Chromium opening a 2-hour 8-channel 48 kHz 24-bit recording (${(fileBytes / 1e9).toFixed(2)} GB)`);
    console.log(`  header read:       ${headerSeconds.toFixed(2)} s`);
    console.log(`  machine load:      ${loadAtOpen} (1-minute load average at the open, ${cpus().length} cores); CPU figures are the renderer's own`);
    console.log(`  first overview:    ${firstOverviewSeconds.toFixed(2)} s wall, ${firstOverviewCpu.toFixed(2)} s renderer CPU (target <= 5 s)`);
    console.log(`  exact overview:    ${exactOverviewSeconds.toFixed(1)} s wall (${(fileBytes / 1e6 / exactOverviewSeconds).toFixed(0)} MB/s), ${exactOverviewCpu.toFixed(1)} s renderer CPU (${(fileBytes / 1e6 / exactOverviewCpu).toFixed(0)} MB per CPU second)`);
    console.log(`  tab memory:        renderer RSS ${idleRss.toFixed(0)} MB with the demo, ${rssAtFirst.toFixed(0)} MB at the first overview, peak ${peakRssOverview.toFixed(0)} MB until the exact one, ${peakRss.toFixed(0)} MB with locating (target <= 500 MB); page JS heap ${heapAfterOverview.toFixed(0)} MB`);
    console.log(`  locate progress:   first movement after ${firstProgressSeconds.toFixed(1)} s; ${progress.length} distinct readings in 30 s; stopped ${(stoppedSeconds - 30).toFixed(1)} s after Stop`);
    for (const line of progress.slice(0, 4).concat(progress.length > 6 ? ['...'] : [], progress.slice(Math.max(4, progress.length - 2)))) console.log(`    ${line}`);
  } finally {
    await app.close();
  }
}

await main();
