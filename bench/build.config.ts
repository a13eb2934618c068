// Bundles the benchmarks for `npm run bench` the way the shipped code is built (Vite, as the page and
// the command line are), into node_modules/.cache/discern-bench/. Run through tsx instead, every
// function of the engine carries esbuild's name-keeping wrapper, which makes closures two to three
// times slower to call than in either shipped build.
import { readdirSync } from 'node:fs';
import { defineConfig } from 'vite';

const benches = readdirSync('bench').filter((file) => file.endsWith('.bench.ts'));

export default defineConfig({
  logLevel: 'warn',
  build: {
    ssr: true,
    outDir: 'node_modules/.cache/discern-bench',
    emptyOutDir: true,
    target: 'node20',
    minify: false,
    rollupOptions: {
      input: {
        run: 'bench/run.ts',
        ...Object.fromEntries(benches.map((file) => [file.replace(/\.ts$/, ''), `bench/${file}`])),
      },
      output: { entryFileNames: '[name].js', chunkFileNames: '[name]-[hash].js' },
    },
  },
});
