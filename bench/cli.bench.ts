// P5 (DESIGN §7): wall time of a cold `discern transformer`, the installed command (bin/discern.js,
// which runs the bundle `npm install` builds). Each run is a new Node process.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Benchmark } from './benchmark.ts';

const root = fileURLToPath(new URL('..', import.meta.url));
const ARGS = [
  'bin/discern.js',
  'transformer',
  '--kva',
  '1500',
  '--primary',
  '12.47 kV',
  '--secondary',
  '480',
  '--impedance',
  '5.75',
];

export const benchmarks: Benchmark[] = [
  {
    id: 'P5',
    what: 'CLI `discern transformer` cold start, wall time (median of 7 new processes)',
    unit: 's',
    target: 1,
    async run() {
      if (!existsSync(`${root}/dist-cli/discern.js`)) {
        spawnSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '-c', 'vite.cli.config.ts'], {
          cwd: root,
        });
      }
      const times: number[] = [];
      for (let i = 0; i < 7; i++) {
        const start = performance.now();
        const run = spawnSync(process.execPath, ARGS, { cwd: root, encoding: 'utf8' });
        times.push((performance.now() - start) / 1000);
        if (run.status !== 0) throw new Error(`discern transformer failed: ${run.stderr}`);
      }
      times.sort((a, b) => a - b);
      return { value: times[3], detail: `fastest ${times[0].toFixed(2)} s` };
    },
  },
];
