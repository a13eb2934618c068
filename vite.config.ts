import { defineConfig } from 'vitest/config';
import type { Plugin } from 'vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';

/** What the page's code says where each worker's script will be, by the worker's entry; the build writes its file name in. */
const WORKER_PLACEHOLDERS = {
  checks: './discern-checks-worker.js',
  settings: './discern-settings-worker.js',
  oneLine: './discern-one-line-worker.js',
  report: './discern-report-worker.js',
};

/**
 * The workers (the checks'; setting windows' and proposals'; the one-line diagram's; the study report's) are built as further entries of the
 * page's own build, not as separate worker bundles, so the engine code they load with the page
 * (bands, fault levels, checks) sits in chunks they share and a browser downloads once. The page
 * learns each worker entry's hashed file name here, once every chunk has its name (see
 * `src/app/worker/runners.ts`).
 */
function workerEntries(): Plugin {
  return {
    name: 'discern-worker-entries',
    apply: 'build',
    generateBundle(_, bundle) {
      for (const [entry, placeholder] of Object.entries(WORKER_PLACEHOLDERS)) {
        const worker = Object.values(bundle).find(
          (file) => file.type === 'chunk' && file.isEntry && file.name === entry,
        );
        if (!worker) throw new Error(`${entry} worker: expected an entry named "${entry}" in the build, got none`);
        const name = `./${worker.fileName.split('/').pop()}`;
        for (const file of Object.values(bundle)) {
          if (file.type === 'chunk' && file.code.includes(placeholder))
            file.code = file.code.replaceAll(placeholder, name);
        }
      }
    },
  };
}

/**
 * The built page keeps a stricter Content-Security-Policy than the dev server can: no inline styles
 * (the dev server injects them for hot reload) and no WebSocket (hot reload's channel).
 */
function strictBuildPolicy(): Plugin {
  return {
    name: 'discern-strict-build-policy',
    apply: 'build',
    transformIndexHtml: (html) =>
      html
        .replace("style-src 'self' 'unsafe-inline'", "style-src 'self'")
        .replace("connect-src 'self' ws:", "connect-src 'self'"),
  };
}

/**
 * The Content-Security-Policy sent as a header. It repeats the page's meta policy and adds what only
 * a header can carry: `frame-ancestors 'none'` (no other site may frame the workbench). The dev
 * server keeps inline styles and the WebSocket that hot reload needs; `vite preview` serves the
 * built page with the strict policy.
 */
const POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "connect-src 'self'",
  "worker-src 'self' blob:",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');
const DEV_POLICY = POLICY.replace("style-src 'self'", "style-src 'self' 'unsafe-inline'").replace(
  "connect-src 'self'",
  "connect-src 'self' ws:",
);

export default defineConfig({
  plugins: [svelte(), strictBuildPolicy(), workerEntries()],
  build: {
    outDir: 'dist',
    target: 'es2022',
    chunkSizeWarningLimit: 800,
    rolldownOptions: {
      input: {
        index: 'index.html',
        checks: 'src/app/worker/analysis.worker.ts',
        settings: 'src/app/worker/settings.worker.ts',
        oneLine: 'src/app/worker/oneLine.worker.ts',
        report: 'src/app/worker/report.worker.ts',
      },
    },
  },
  server: { headers: { 'Content-Security-Policy': DEV_POLICY } },
  preview: { headers: { 'Content-Security-Policy': POLICY } },
  test: {
    include: ['tests/**/*.test.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 60_000,
    env: { TZ: 'UTC', LANG: 'C' },
  },
});
