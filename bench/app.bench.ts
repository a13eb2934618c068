// P4 and P6 of DEVELOPERS.md, benchmarks: the workbench's redraw and probe times in headless Chromium, and the size
// of what a browser downloads to start it.
import { spawn, spawnSync } from 'node:child_process';
import { readFileSync, readdirSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { chromium, type Page } from 'playwright-core';
import { medianOf, single, type Benchmark } from './benchmark.ts';
import { ROOT } from './root.ts';
import { radialStudy } from './radialStudy.ts';
import type { BenchHook } from '../src/app/lib/benchHook.ts';

const PORT = 4190;
const EDITS = 24;
const PROBES = 120;

let built: Promise<void> | undefined;
let measured:
  | Promise<{
      studies: StudyTimes[];
      probe: number[];
      windows: WindowTimes[];
      oneLine: StudyTimes & { opening: number[] };
    }>
  | undefined;

/** Builds dist/ once per run, from the sources as they are now. */
function build(): Promise<void> {
  built ??= new Promise((resolve, reject) => {
    const result = spawnSync(
      process.execPath,
      [`${ROOT}node_modules/vite/bin/vite.js`, 'build', '--logLevel', 'error'],
      {
        cwd: ROOT,
        stdio: 'inherit',
      },
    );
    if (result.status === 0) resolve();
    else reject(new Error(`vite build: expected exit code 0, got ${result.status}`));
  });
  return built;
}

/** The demo study with the most devices (the 25-device demo once it is in demo/). */
function largestDemo(): { fileName: string; devices: number } {
  return readdirSync(`${ROOT}demo`)
    .filter((f) => f.endsWith('.json'))
    .map((fileName) => {
      const study = JSON.parse(readFileSync(`${ROOT}demo/${fileName}`, 'utf8')) as { devices?: unknown[] };
      return { fileName, devices: study.devices?.length ?? 0 };
    })
    .sort((a, b) => b.devices - a.devices || a.fileName.localeCompare(b.fileName))[0];
}

interface StudyTimes {
  label: string;
  /** Milliseconds from the edit until the page's work on it is done and laid out, before the frame. */
  work: number[];
  paint: number[];
  findings: number[];
  /** Durations (ms) of the page's long tasks (over 50 ms) while editing. */
  longTasks: number[];
  path: string;
}

/**
 * Steps a setting of a device on the sheet `edits` times, each edit timed to the painted frame and to
 * the findings painted after the checks' worker replied, one edit at a time, with long tasks recorded.
 */
async function editTimes(page: Page, label: string, edits: number): Promise<StudyTimes> {
  const times = await page.evaluate(
    async ({ edits }) => {
      const hook = (window as unknown as { __discernBench: BenchHook }).__discernBench;
      const [setting] = hook.settingPaths();
      const longTasks = (window as unknown as { __longTasks: number[] }).__longTasks;
      longTasks.length = 0;
      const work: number[] = [];
      const paint: number[] = [];
      const findings: number[] = [];
      // Alternate between the setting and 5 % above it, as a user stepping it would. A keystroke
      // lands anywhere in a frame, not just after a paint (where the last measurement ends): each
      // edit waits a delay spread evenly over one 60 Hz frame (the golden-ratio sequence) first.
      for (let i = 0; i < edits; i++) {
        await new Promise((resolve) => setTimeout(resolve, ((i * 0.618034) % 1) * (1000 / 60)));
        const value = i % 2 === 0 ? setting.value * 1.05 : setting.value;
        const t = await hook.measureEdit(setting.path, value);
        work.push(t.work);
        paint.push(t.paint);
        findings.push(t.findings);
      }
      return { work, paint, findings, longTasks: [...longTasks], path: setting.path.join('.') };
    },
    { edits },
  );
  // The first edits warm the page's code up.
  return {
    label,
    work: times.work.slice(2),
    paint: times.paint.slice(2),
    findings: times.findings.slice(2),
    longTasks: times.longTasks,
    path: times.path,
  };
}

interface WindowTimes {
  label: string;
  /** Milliseconds from a click on a device in the tree until its setting window is shown. */
  shown: number[];
  /** Milliseconds from "Propose for the whole study" until the proposal is shown. */
  proposal: number;
  /** Durations (ms) of the page's long tasks (over 50 ms) meanwhile. */
  longTasks: number[];
}

/**
 * With the Window tab open, selects the first devices of the system tree in turn, each once its
 * window is shown, then proposes settings for the whole study; the page's long tasks are recorded.
 */
async function windowTimes(page: Page, label: string): Promise<WindowTimes> {
  await page.evaluate(() => ((window as unknown as { __longTasks: number[] }).__longTasks.length = 0));
  await page.getByTestId('tab-window').click();
  const rows = await page.evaluate(() =>
    [...document.querySelectorAll('[data-testid^="tree-device-"]')]
      .slice(0, 3)
      .map((row) => row.getAttribute('data-testid')!),
  );
  const now = () => page.evaluate(() => performance.now());
  const settled = (selector: string) =>
    page.waitForFunction(
      (shown) =>
        !!document.querySelector(shown) &&
        !document.querySelector('[data-testid="window-working"], [data-testid="proposal-working"], .updating'),
      selector,
    );
  const shown: number[] = [];
  for (const row of rows) {
    const start = await now();
    await page.getByTestId(row).click();
    await settled('[data-testid="window-status"], [data-testid="window-panel"] .hint, [data-testid="window-error"]');
    shown.push((await now()) - start);
  }
  const start = await now();
  await page.getByTestId('propose-study').click();
  await settled('[data-testid="proposal"], [data-testid="proposal-error"]');
  const proposal = (await now()) - start;
  const longTasks = await page.evaluate(() => [...(window as unknown as { __longTasks: number[] }).__longTasks]);
  await page.getByTestId('tab-work').click();
  return { label, shown, proposal, longTasks };
}

/**
 * Opens the workbench in Chromium and, on the largest demo and on generated 500- and 2,000-device
 * studies, steps a setting of a device on the sheet: each edit is timed to the painted frame and to the
 * findings painted after the checks' worker replied, one edit at a time, with long tasks recorded.
 */
function measure() {
  measured ??= (async () => {
    await build();
    const server = spawn(
      process.execPath,
      [
        `${ROOT}node_modules/vite/bin/vite.js`,
        'preview',
        '--host',
        '127.0.0.1',
        '--port',
        String(PORT),
        '--strictPort',
      ],
      { cwd: ROOT, stdio: 'ignore' },
    );
    // The server is stopped however the run ends, also when the browser cannot start (else the
    // benchmark process would wait for it forever).
    let browser: Awaited<ReturnType<typeof chromium.launch>> | undefined;
    try {
      browser = await chromium.launch({
        executablePath: '/usr/bin/chromium',
        headless: true,
        args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking'],
      });
      const url = `http://127.0.0.1:${PORT}/`;
      for (let i = 0; i < 100; i++) {
        try {
          if ((await fetch(url)).ok) break;
        } catch {
          await new Promise((resolve) => setTimeout(resolve, 100));
        }
      }
      const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
      await page.goto(url);
      await page.getByTestId('sheet-svg').waitFor();
      const demo = largestDemo();
      await page.getByTestId('demo-menu').selectOption(demo.fileName);
      await page.getByTestId('sheet-svg').waitFor();
      await page.evaluate(() => {
        const seen: number[] = [];
        (window as unknown as { __longTasks: number[] }).__longTasks = seen;
        new PerformanceObserver((list) => list.getEntries().forEach((entry) => seen.push(entry.duration))).observe({
          type: 'longtask',
        });
      });
      const studies: StudyTimes[] = [];
      const windows: WindowTimes[] = [];
      for (const [label, devices, edits] of [
        [`${demo.fileName}, ${demo.devices} devices`, 0, EDITS],
        ['generated, 500 devices', 500, EDITS],
        ['generated, 2,000 devices', 2000, Math.ceil(EDITS / 2)],
      ] as const) {
        if (devices > 0) {
          const document = radialStudy(devices);
          await page.evaluate(
            (doc) => (window as unknown as { __discernBench: BenchHook }).__discernBench.open(doc),
            document,
          );
        }
        studies.push(await editTimes(page, label, edits));
        if (devices > 0) windows.push(await windowTimes(page, label));
      }
      // The largest study again, edited with the One-line tab open (its diagram follows every edit).
      const longTasksNow = () => page.evaluate(() => [...(window as unknown as { __longTasks: number[] }).__longTasks]);
      await page.evaluate(() => ((window as unknown as { __longTasks: number[] }).__longTasks.length = 0));
      await page.getByTestId('tab-one-line').click();
      await page.locator('[data-testid="one-line"] svg').first().waitFor();
      // A long task's entry may come a moment after the task it is for.
      await page.waitForTimeout(300);
      const opening = await longTasksNow();
      const oneLine = {
        ...(await editTimes(page, `${studies[2].label}, One-line tab open`, Math.ceil(EDITS / 2))),
        opening,
      };
      await page.getByTestId('tab-work').click();
      const probeTimes = await page.evaluate(
        ({ probes }) => {
          const amps = Array.from({ length: probes }, (_, i) => 100 * 10 ** ((3 * i) / probes));
          return (window as unknown as { __discernBench: BenchHook }).__discernBench.measureProbe(amps);
        },
        { probes: PROBES },
      );
      return { studies, probe: probeTimes.slice(5), windows, oneLine };
    } finally {
      await browser?.close();
      server.kill();
    }
  })();
  return measured;
}

/** Gzipped sizes (bytes) of the built assets, split into what the page loads at start and what it loads on demand. */
async function bundleSizes() {
  await build();
  const html = readFileSync(`${ROOT}dist/index.html`, 'utf8');
  // Every asset counts: scripts, styles and the fonts a PDF export fetches.
  const assets = readdirSync(`${ROOT}dist/assets`).filter((f) => /\.(js|css|ttf|woff2?)$/.test(f));
  const gz = (file: string) => gzipSync(readFileSync(`${ROOT}dist/assets/${file}`), { level: 9 }).length;
  // At start: the scripts and stylesheet named in index.html, and the workers' entries they name (of the
  // same build, named in the page's code beside their sources: `workerUrl("analysis.worker.ts", "./checks-….js")`): the checks'
  // worker starts at once, the others (a few hundred bytes each) with their first question, and what
  // they load beyond the page's own chunks is counted as loaded on demand.
  const named = assets.filter((f) => html.includes(`/assets/${f}`));
  const workers = named
    .filter((f) => f.endsWith('.js'))
    .flatMap((f) => [
      ...readFileSync(`${ROOT}dist/assets/${f}`, 'utf8').matchAll(
        /["'`][\w.]+\.worker\.ts["'`]\s*,\s*["'`]\.\/([\w.-]+\.js)["'`]/g,
      ),
    ])
    .map((match) => match[1]);
  const atStart = assets.filter((f) => named.includes(f) || workers.includes(f));
  const onDemand = assets.filter((f) => !atStart.includes(f));
  const sum = (files: string[]) => files.reduce((total, f) => total + gz(f), 0);
  return { start: sum(atStart), onDemand: sum(onDemand), files: atStart };
}

export const benchmarks: Benchmark[] = [
  ...[
    { study: 0, target: 16 },
    { study: 1, target: 16 },
    { study: 2, target: 33 },
  ].map(({ study, target }): Benchmark => ({
    id: 'P4',
    what: `setting edit → next frame painted (rAF after the DOM update), Chromium, ${['the demo', '500 devices', '2,000 devices'][study]}`,
    unit: 'ms',
    target,
    async run() {
      const { label, work, paint, path } = (await measure()).studies[study];
      const workMedian = medianOf(work).value.toFixed(1);
      return medianOf(
        paint,
        `${label}, stepping ${path}; ${paint.length} edits at phases spread over a frame; the page's own work ${workMedian} ms of it`,
      );
    },
  })),
  {
    id: 'P4',
    what: 'longest task of the page while editing at 500 devices (long tasks observed)',
    unit: 'ms',
    target: 50,
    async run() {
      const { studies } = await measure();
      const { longTasks } = studies[1];
      const longest = Math.max(0, ...longTasks);
      // The 2,000-device study is edited in the same page: its long tasks are told too (no target).
      const large = studies[2].longTasks;
      const largeText = large.length > 0 ? `longest ${Math.max(...large).toFixed(0)} ms` : 'none';
      return single(longest, `${longTasks.length} tasks over 50 ms; at 2,000 devices ${large.length} (${largeText})`);
    },
  },
  {
    id: 'P4o',
    what: 'setting edit → next frame painted with the One-line tab open, Chromium, 2,000 devices',
    unit: 'ms',
    target: 33,
    async run() {
      const { label, paint, longTasks, opening } = (await measure()).oneLine;
      const told = (tasks: number[]) =>
        `${tasks.length} tasks over 50 ms${tasks.length > 0 ? ` (longest ${Math.max(...tasks).toFixed(0)} ms)` : ''}`;
      return medianOf(
        paint,
        `${label}; ${paint.length} edits, ${told(longTasks)}; opening the tab and drawing the diagram, ${told(opening)}`,
      );
    },
  },
  {
    id: 'P4w',
    what: "longest task of the page while the Window tab works out three devices' windows and a proposal for the study, 500 devices",
    unit: 'ms',
    target: 50,
    async run() {
      const [small, large] = (await measure()).windows;
      const longest = (times: WindowTimes) => Math.max(0, ...times.longTasks);
      const shown = (times: WindowTimes) => times.shown.map((ms) => ms.toFixed(0)).join(', ');
      return single(
        longest(small),
        `${small.longTasks.length} tasks over 50 ms; windows shown after ${shown(small)} ms, the proposal after ${small.proposal.toFixed(0)} ms; at 2,000 devices ${large.longTasks.length} tasks over 50 ms (longest ${longest(large).toFixed(0)} ms), windows after ${shown(large)} ms, the proposal after ${large.proposal.toFixed(0)} ms`,
      );
    },
  },
  ...[
    { study: 0, target: 50 },
    { study: 2, target: 100 },
  ].map(({ study, target }): Benchmark => ({
    id: 'P4f',
    what: `setting edit → the checks' findings painted, Chromium, ${['the demo', '', '2,000 devices'][study]}`,
    unit: 'ms',
    target,
    async run() {
      const { label, findings } = (await measure()).studies[study];
      return medianOf(findings, `${label}; ${findings.length} edits`);
    },
  })),
  {
    id: 'P4-probe',
    what: 'probe moved → readout laid out, headless Chromium, the demo',
    unit: 'ms',
    target: 8,
    async run() {
      return medianOf((await measure()).probe);
    },
  },
  {
    id: 'P6',
    what: "production bundle loaded at start (entry JS, CSS, the workers' entries), gzip",
    unit: 'kB',
    target: 300,
    async run() {
      const { start, onDemand } = await bundleSizes();
      return single(
        start / 1000,
        `plus ${(onDemand / 1000).toFixed(0)} kB loaded on demand (the workers' own code, the PDF writer and its font)`,
      );
    },
  },
  {
    id: 'P6',
    what: 'every production asset, the PDF export chunks and fonts included, gzip',
    unit: 'kB',
    target: 300,
    async run() {
      const { start, onDemand } = await bundleSizes();
      return single((start + onDemand) / 1000);
    },
  },
];
