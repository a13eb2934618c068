// P5 (DEVELOPERS.md, benchmarks): wall time of each command-line verb on the demo, run exactly as the README runs it
// (`npm run discern -- …`, which runs the bundle `npm install` builds). The bundle is rebuilt from
// the sources first, so the figures are for the code as it is now. Every run is a new process; the
// verbs take turns, round after round.
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { medianOf, type Benchmark, type Measured } from './benchmark.ts';
import { ROOT } from './root.ts';

const ROUNDS = 5;
const out = mkdtempSync(join(tmpdir(), 'discern-bench-'));
const VERBS: Array<{ verb: string; args: string[]; target: number; ok: number[] }> = [
  {
    verb: 'transformer',
    args: [
      ...['transformer', '--kva', '1500', '--primary', '12.47 kV', '--secondary', '480', '--impedance', '5.75'],
      ...['--xr', '6', '--source-mva', '250', '--source-xr', '12'],
    ],
    target: 1,
    ok: [0],
  },
  { verb: 'faults', args: ['faults', 'demo/harrowmere-selective.json'], target: 1, ok: [0] },
  {
    verb: 'band',
    args: ['band', 'demo/harrowmere-selective.json', '--device', 'MAIN', '--amps', '2500,10000,30000'],
    target: 1,
    ok: [0],
  },
  // Exit code 1: the overlap demo has failing findings, which is what it is for.
  {
    verb: 'check',
    args: ['check', 'demo/harrowmere-overlap.json', '--report', join(out, 'findings.md')],
    target: 1,
    ok: [0, 1],
  },
  {
    verb: 'plot (SVG)',
    args: ['plot', 'demo/harrowmere-selective.json', '--view', 'service', '--out', join(out, 'service.svg')],
    target: 1,
    ok: [0],
  },
  {
    verb: 'plot (PDF)',
    args: ['plot', 'demo/harrowmere-selective.json', '--view', 'service', '--out', join(out, 'service.pdf')],
    target: 1.5,
    ok: [0],
  },
  { verb: 'window', args: ['window', 'demo/harrowmere-overlap.json', '--device', 'MAIN'], target: 1, ok: [0] },
  {
    verb: 'propose',
    args: ['propose', 'demo/harrowmere-overlap.json', '--out', join(out, 'proposed.json')],
    target: 1,
    ok: [0],
  },
  {
    verb: 'paths',
    args: ['paths', 'demo/harrowmere-full.json', '--out', join(out, 'with-paths.json')],
    target: 1,
    ok: [0],
  },
  {
    verb: 'report (PDF)',
    args: [
      ...['report', 'demo/harrowmere-selective.json', '--out', join(out, 'study.pdf')],
      ...['--paper', 'letter', '--date', '2026-12-02'],
    ],
    target: 1.5,
    ok: [0],
  },
];

let results: Measured[] | undefined;
function measure(): Measured[] {
  if (results) return results;
  const prepare = () => {
    const build = spawnSync('npm', ['run', '--silent', 'prepare'], { cwd: ROOT, encoding: 'utf8' });
    if (build.status !== 0) throw new Error(`npm run prepare failed: ${build.stderr}`);
  };
  prepare();
  const times: number[][] = VERBS.map(() => []);
  for (let round = -1; round < ROUNDS; round++) {
    VERBS.forEach(({ verb, args, ok }, i) => {
      // A source edited meanwhile makes the command run the sources: rebuild and time it again.
      for (let attempt = 0; ; attempt++) {
        const start = performance.now();
        const run = spawnSync('npm', ['run', '--silent', 'discern', '--', ...args], { cwd: ROOT, encoding: 'utf8' });
        const seconds = (performance.now() - start) / 1000;
        if (!ok.includes(run.status ?? -1)) throw new Error(`discern ${verb} ended with ${run.status}: ${run.stderr}`);
        if (!run.stderr.includes('running the sources')) {
          if (round >= 0) times[i].push(seconds);
          break;
        }
        if (attempt === 3) throw new Error(`discern ${verb} kept running the sources: src/ changed as it ran`);
        prepare();
      }
    });
  }
  results = times.map((t) => medianOf(t, `${ROUNDS} new processes, verbs taking turns`));
  return results;
}

export const benchmarks: Benchmark[] = VERBS.map(({ verb, args, target }, i) => ({
  id: 'P5',
  what: `\`npm run discern -- ${verb === 'plot (PDF)' || verb === 'plot (SVG)' ? args.slice(0, 4).join(' ') + ' --out …' + (verb === 'plot (PDF)' ? '.pdf' : '.svg') : args[0] + ' …'}\` on the demo, wall time`,
  unit: 's',
  target,
  async run() {
    return measure()[i];
  },
}));
