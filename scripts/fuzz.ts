/**
 * `npm run fuzz [-- --seed N --count N]`: every verb of the command line run out of process on a
 * seeded corpus of hostile studies (tests/fuzz/hostileStudies.ts) and hostile `transformer` flags.
 * Fails (exit 1) on any crash (a signal, an exit code other than 0, 1 or 2), a hang (over 10 s), NaN,
 * Infinity or undefined in the output, an error longer than one line, or an error that names no field
 * path (`study.…` or a `--flag`). Prints one line per failure with the seed and case to reproduce it.
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { hostileStudies, seededRandom } from '../tests/fuzz/hostileStudies.ts';
import { echoedWords, firstNonsense, STUDY_PATH } from '../tests/fuzz/outcome.ts';

const HANG_SECONDS = 10;
/** The command line is bundled once, like the installed `discern`, so start-up does not count as a hang. */
const BUNDLE = 'node_modules/.cache/discern-fuzz';
const NONSENSE = /\bNaN\b|-?Infinity|\bundefined\b/;
const FIELD_ERROR = new RegExp(String.raw`^(${STUDY_PATH}|--[a-z-]+): expected [^\n]*$`);

const argv = process.argv.slice(2);
const option = (name: string, fallback: number) => {
  const i = argv.indexOf(`--${name}`);
  return i >= 0 ? Number(argv[i + 1]) : fallback;
};
const seed = option('seed', 20_261_202);
const count = option('count', 60);
const parallel = option('jobs', 2);

interface Run {
  label: string;
  args: string[];
  /** Words of `NONSENSE` the study itself holds (a bus named "Infinity"): printed back, they are not ours. */
  echoed?: Set<string>;
}

/** Runs the CLI once; resolves to what it printed and how it ended. */
function runOnce(
  args: string[],
): Promise<{ code: number | null; signal: string | null; stdout: string; stderr: string; hung: boolean }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [`${BUNDLE}/discern.js`, ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    let hung = false;
    child.stdout.on('data', (chunk) => (stdout += chunk));
    child.stderr.on('data', (chunk) => (stderr += chunk));
    const timer = setTimeout(() => {
      hung = true;
      child.kill('SIGKILL');
    }, HANG_SECONDS * 1000);
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      resolve({ code, signal, stdout, stderr, hung });
    });
  });
}

/** What is wrong with one run, if anything. */
function problemOf(result: Awaited<ReturnType<typeof runOnce>>, echoed = new Set<string>()): string | undefined {
  if (result.hung) return `hang: no answer within ${HANG_SECONDS} s`;
  if (result.signal || result.code === null || ![0, 1, 2].includes(result.code))
    return `crash: exit ${result.code ?? result.signal}: ${result.stderr.trim().split('\n').slice(-3).join(' / ')}`;
  const nonsense = firstNonsense(result.stdout, echoed, NONSENSE);
  if (nonsense)
    return `"${nonsense[0]}" in the output: …${result.stdout.slice(Math.max(0, nonsense.index - 60), nonsense.index + 20)}…`;
  if (result.code === 2) {
    const message = result.stderr.trimEnd();
    if (message.includes('\n')) return `error on more than one line: ${message.slice(0, 200)}`;
    if (!FIELD_ERROR.test(message)) return `error without a field path: ${message.slice(0, 200)}`;
  }
  return undefined;
}

/** Hostile `discern transformer` invocations: every flag given an absurd value in turn. */
function transformerRuns(random: () => number, n: number): Run[] {
  const base: Record<string, string> = {
    kva: '1500',
    primary: '12.47 kV',
    secondary: '480',
    impedance: '5.75',
    xr: '6',
    'source-mva': '250',
    'source-xr': '12',
  };
  const hostile = ['1e400', '1e-310', '5e-324', '-1', '0', 'NaN', 'Infinity', '1e308', '1500 kW', '1e400 MVA', '', 'x'];
  const runs: Run[] = [];
  for (let k = 0; k < n; k++) {
    const flags = { ...base };
    const names = Object.keys(flags);
    flags[names[Math.floor(random() * names.length)]] = hostile[Math.floor(random() * hostile.length)];
    const args = ['transformer', ...Object.entries(flags).flatMap(([name, value]) => [`--${name}`, value])];
    runs.push({ label: `transformer ${JSON.stringify(flags)}`, args });
  }
  return runs;
}

const build = spawnSync(
  'node_modules/.bin/vite',
  ['build', '-c', 'vite.cli.config.ts', '--outDir', BUNDLE, '--emptyOutDir', '--logLevel', 'warn'],
  { stdio: 'inherit' },
);
if (build.status !== 0) throw new Error('the command line did not build');

const folder = mkdtempSync(join(tmpdir(), 'discern-fuzz-'));
const runs: Run[] = transformerRuns(seededRandom(seed), Math.ceil(count / 4));
for (const hostile of hostileStudies(seed, count)) {
  const file = join(folder, `case-${hostile.index}.json`);
  writeFileSync(file, hostile.text);
  const device = /"id": "((?:MAIN|FDR|R-|MCC|EM|OFC|F)[\w.-]*)"/.exec(hostile.text)?.[1] ?? 'MAIN';
  const label = `#${hostile.index} ${hostile.mutation} (${hostile.base})`;
  const echoed = echoedWords(hostile.text, NONSENSE);
  const figure = join(folder, `case-${hostile.index}.${['svg', 'png', 'pdf'][hostile.index % 3]}`);
  const caseRuns: Run[] = [
    { label: `${label}: check`, args: ['check', file, '--report', join(folder, `case-${hostile.index}.md`)] },
    { label: `${label}: faults`, args: ['faults', file] },
    { label: `${label}: band`, args: ['band', file, '--device', device, '--amps', '100,1000,10000,100000'] },
    { label: `${label}: plot`, args: ['plot', file, '--out', figure] },
  ];
  // The slower verbs on every fourth case, so a default run stays within minutes.
  if (hostile.index % 4 === 0)
    caseRuns.push(
      { label: `${label}: report`, args: ['report', file, '--out', join(folder, `report-${hostile.index}.md`)] },
      { label: `${label}: window`, args: ['window', file, '--device', device] },
      { label: `${label}: propose`, args: ['propose', file, '--out', join(folder, `proposed-${hostile.index}.json`)] },
      { label: `${label}: paths`, args: ['paths', file, '--out', join(folder, `paths-${hostile.index}.json`)] },
    );
  runs.push(...caseRuns.map((run) => ({ ...run, echoed })));
}

let failures = 0;
let next = 0;
const started = Date.now();
async function worker(): Promise<void> {
  while (next < runs.length) {
    const run = runs[next++];
    const problem = problemOf(await runOnce(run.args), run.echoed);
    if (problem) {
      failures++;
      console.log(`FAIL seed ${seed} ${run.label}: ${problem}`);
    }
  }
}
await Promise.all(Array.from({ length: parallel }, worker));
rmSync(folder, { recursive: true, force: true });
console.log(
  `${runs.length} runs of every verb on seed ${seed} (${count} hostile studies): ${failures} failure(s) in ${Math.round((Date.now() - started) / 1000)} s`,
);
process.exitCode = failures > 0 ? 1 : 0;
