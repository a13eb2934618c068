import { defineConfig } from 'vitest/config';
import type { Plugin } from 'vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';

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
  plugins: [svelte(), strictBuildPolicy()],
  build: { outDir: 'dist', target: 'es2022', chunkSizeWarningLimit: 800 },
  server: { headers: { 'Content-Security-Policy': DEV_POLICY } },
  preview: { headers: { 'Content-Security-Policy': POLICY } },
  worker: {
    format: 'es',
    // The checks' worker gets parsed studies, so it needs no schema: the engine builds its zod schemas
    // (and the unit parser) at module level, and these calls are marked pure so the worker drops them.
    rolldownOptions: {
      treeshake: {
        manualPureFunctions: [
          'z',
          'create',
          'createStudySchema',
          'createCharacteristicSchema',
          'createRelaySchema',
          'createTripUnitSchema',
          'createThermalMagneticSchema',
          'quantityField',
          'percentField',
          'pointTableSchema',
        ],
      },
    },
  },
  test: {
    include: ['tests/**/*.test.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 60_000,
    env: { TZ: 'UTC', LANG: 'C' },
  },
});
