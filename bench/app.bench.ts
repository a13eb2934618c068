// P4 and P6 of DESIGN §7: the workbench's redraw and probe times in headless Chromium, and the size
// of what a browser downloads to start it.
import { spawn, spawnSync } from 'node:child_process';
import { readFileSync, readdirSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { chromium } from 'playwright-core';
import { medianOf, single, type Benchmark } from './benchmark.ts';
import { ROOT } from './root.ts';

const PORT = 4190;
const EDITS = 60;
const PROBES = 120;

let built: Promise<void> | undefined;
let measured: Promise<{ edit: number[]; probe: number[]; demo: string; devices: number; path: string }> | undefined;

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

/** Opens the largest demo in Chromium and times setting changes and probe moves through the page's hook. */
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
    const browser = await chromium.launch({
      executablePath: '/usr/bin/chromium',
      headless: true,
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking'],
    });
    try {
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
      const result = await page.evaluate(
        ({ edits, probes }) => {
          type Hook = {
            measureEdits(path: (string | number)[], values: unknown[]): number[];
            measureProbe(amps: number[]): number[];
            settingPaths(): { path: (string | number)[]; value: number }[];
          };
          const hook = (window as unknown as { __discernBench: Hook }).__discernBench;
          const [setting] = hook.settingPaths();
          // Alternate between the setting and 5 % above it, as a user stepping it would.
          const values = Array.from({ length: edits }, (_, i) => (i % 2 === 0 ? setting.value * 1.05 : setting.value));
          const editTimes = hook.measureEdits(setting.path, values);
          const amps = Array.from({ length: probes }, (_, i) => 100 * 10 ** ((3 * i) / probes));
          const probeTimes = hook.measureProbe(amps);
          return { editTimes, probeTimes, path: setting.path.join('.') };
        },
        { edits: EDITS, probes: PROBES },
      );
      // The first few edits warm the page's code up; the median ignores them anyway.
      return {
        edit: result.editTimes.slice(5),
        probe: result.probeTimes.slice(5),
        demo: demo.fileName,
        devices: demo.devices,
        path: result.path,
      };
    } finally {
      await browser.close();
      server.kill();
    }
  })();
  return measured;
}

/** Gzipped sizes (bytes) of the built assets, split into what the page loads at start and what it loads on demand. */
async function bundleSizes() {
  await build();
  const html = readFileSync(`${ROOT}dist/index.html`, 'utf8');
  const assets = readdirSync(`${ROOT}dist/assets`).filter((f) => /\.(js|css)$/.test(f));
  const gz = (file: string) => gzipSync(readFileSync(`${ROOT}dist/assets/${file}`), { level: 9 }).length;
  // At start: the entry script and stylesheet named in index.html, and the checks' worker it starts at once.
  const atStart = assets.filter((f) => html.includes(`/assets/${f}`) || f.startsWith('analysis.worker'));
  const onDemand = assets.filter((f) => !atStart.includes(f));
  const sum = (files: string[]) => files.reduce((total, f) => total + gz(f), 0);
  return { start: sum(atStart), onDemand: sum(onDemand), files: atStart };
}

export const benchmarks: Benchmark[] = [
  {
    id: 'P4',
    what: 'setting change → sheet redrawn and laid out, headless Chromium, median',
    unit: 'ms',
    target: 16,
    async run() {
      const { edit, demo, devices, path } = await measure();
      return medianOf(edit, `${demo}, ${devices} devices, stepping ${path}`);
    },
  },
  {
    id: 'P4-probe',
    what: 'probe moved → readout laid out, headless Chromium, median',
    unit: 'ms',
    target: 8,
    async run() {
      const { probe, demo } = await measure();
      return medianOf(probe, demo);
    },
  },
  {
    id: 'P6',
    what: 'production bundle loaded at start (entry JS, CSS, checks worker), gzip',
    unit: 'kB',
    target: 300,
    async run() {
      const { start, onDemand } = await bundleSizes();
      return single(start / 1000, `plus ${(onDemand / 1000).toFixed(0)} kB loaded only for a PDF export`);
    },
  },
  {
    id: 'P6',
    what: 'every production asset, the PDF export chunks included, gzip',
    unit: 'kB',
    target: 300,
    async run() {
      const { start, onDemand } = await bundleSizes();
      return single((start + onDemand) / 1000);
    },
  },
];
