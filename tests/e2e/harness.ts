// Serves the built workbench (dist/) with `vite preview` and drives it with Debian's Chromium
// through playwright-core (DEVELOPERS.md: spawn vite directly, never through npx; one browser per file).
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** A served workbench and a browser pointed at it. */
export interface Workbench {
  url: string;
  browser: Browser;
  /** A fresh context (empty storage) and page at 1280 × 800, opened on the workbench. */
  open(): Promise<{ context: BrowserContext; page: Page }>;
  close(): Promise<void>;
}

/** The screen sizes the workbench is held to: a laptop, a common office monitor, a full-HD one (px). */
export const SCREEN_SIZES = [
  [1280, 800],
  [1440, 900],
  [1920, 1080],
] as const;

/**
 * Starts `vite preview` on `port` and launches Chromium. Fails at once, saying why, when dist/ has
 * not been built (`npm test` builds it first).
 */
export async function startWorkbench(port: number): Promise<Workbench> {
  if (!existsSync(`${ROOT}dist/index.html`))
    throw new Error('dist/index.html: expected a built workbench, got none (run vite build)');
  const server: ChildProcess = spawn(
    process.execPath,
    [`${ROOT}node_modules/vite/bin/vite.js`, 'preview', '--host', '127.0.0.1', '--port', String(port), '--strictPort'],
    { cwd: ROOT, stdio: 'ignore' },
  );
  const url = `http://127.0.0.1:${port}/`;
  await waitFor(url);
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS });
  return {
    url,
    browser,
    async open() {
      const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
      const page = await context.newPage();
      const errors: string[] = [];
      page.on('pageerror', (error) => errors.push(error.message));
      (page as Page & { errors?: string[] }).errors = errors;
      await page.goto(url);
      await page.getByTestId('sheet-svg').waitFor();
      await settled(page);
      return { context, page };
    },
    async close() {
      await browser.close();
      server.kill();
    },
  };
}

/** Errors the page threw since it opened. */
export function pageErrors(page: Page): string[] {
  return (page as Page & { errors?: string[] }).errors ?? [];
}

/** Waits until the study named `name` is the one open (reading a chosen file takes a moment). */
export async function studyOpened(page: Page, name: string): Promise<void> {
  await page.waitForFunction(
    (expected) => document.querySelector('[data-testid="study-name"]')?.textContent?.includes(expected) ?? false,
    name,
  );
}

/**
 * Records every notice the page shows from now on, however briefly (each once while it stays); the
 * returned function reads them.
 */
export async function recordNotices(page: Page): Promise<() => Promise<string[]>> {
  await page.evaluate(() => {
    const seen: string[] = ((window as unknown as { notices: string[] }).notices = []);
    new MutationObserver(() => {
      const text = document.querySelector('[data-testid="notice"] span')?.textContent;
      if (text && seen.at(-1) !== text) seen.push(text);
    }).observe(document.body, { subtree: true, childList: true, characterData: true });
  });
  return () => page.evaluate(() => (window as unknown as { notices: string[] }).notices);
}

/** Waits until the checks of the latest edit have come back from the worker. */
export async function settled(page: Page): Promise<void> {
  await page.waitForFunction(() => !document.querySelector('[data-testid="findings-summary"] .pending'));
}

async function waitFor(url: string): Promise<void> {
  for (let i = 0; i < 100; i++) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`vite preview: expected it to answer at ${url}, got no answer in 10 s`);
}
