// Bundles the command line into one file (dist-cli/discern.js, built by `npm install` through `prepare`) so the installed `discern` starts fast: the engine's
// TypeScript is compiled ahead and mathjs is cut down to its unit machinery. The PNG renderer (a native
// module) stays external, and it and the PDF writer load only when a figure in those formats is asked for.
import { defineConfig } from 'vite';

export default defineConfig({
  build: {
    ssr: 'src/cli/main.ts',
    outDir: 'dist-cli',
    emptyOutDir: true,
    target: 'node20',
    minify: false,
    rollupOptions: { output: { entryFileNames: 'discern.js', chunkFileNames: '[name].js' } },
  },
  ssr: {
    noExternal: [
      'mathjs',
      'zod',
      'd3-scale',
      'd3-shape',
      'd3-array',
      'd3-format',
      'd3-interpolate',
      'd3-time',
      'd3-time-format',
      'd3-color',
      'd3-path',
      'internmap',
    ],
    external: ['@resvg/resvg-js'],
  },
});
