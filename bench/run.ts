// `npm run bench`: runs every benchmark module in bench/ and prints each figure beside its target
// (DEVELOPERS.md, benchmarks), the ratio figure / target, and the spread (min / median / max) of the runs behind it.
// `npm run bench -- P1 P3` runs only those ids (a prefix matches: P2 also runs P2e).
// Each module runs in a process of its own, so what one leaves in memory (the studies and bands it
// built, a grown heap) weighs on no other's figures: the P2 ratio read 0.2–0.3 higher after the
// workbench and band benchmarks had run in the same process than on its own.
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dirname, join } from 'node:path';
import type { Benchmark } from './benchmark.ts';

const here = dirname(fileURLToPath(import.meta.url));
// The full analysis and the proposals (P2, P8) are specified on one core: their modules run pinned to
// one CPU where `taskset` is there to do it (the engine's collector otherwise works on the other core too),
// and say so beside their figures. The page (P4) and the command line (P5) run as a user runs them.
const ONE_CORE = new Set(['checks.bench', 'window.bench']);
const args = process.argv.slice(2);
const inModule = args[0] === '--module' ? args[1] : undefined;
const only = inModule === undefined ? args : args.slice(2);

if (inModule !== undefined) {
  // One module's rows, as JSON on standard output for the process that started this one.
  process.stdout.write(JSON.stringify(await rowsOf(inModule)));
} else {
  const modules = readdirSync(here)
    .filter((file) => /\.bench\.(ts|js)$/.test(file))
    .sort();
  const rows: string[][] = [['id', 'what', 'measured', 'target', 'ratio', 'holds', 'spread min / median / max (runs)']];
  let failed = 0;
  const pinning = spawnSync('taskset', ['-c', '0', process.execPath, '-e', '']).status === 0;
  for (const file of modules) {
    const command = [process.execPath, fileURLToPath(import.meta.url), '--module', file, ...only];
    if (pinning && ONE_CORE.has(file.replace(/\.(ts|js)$/, ''))) command.unshift('taskset', '-c', '0');
    const child = spawnSync(command[0], command.slice(1), {
      stdio: ['ignore', 'pipe', 'inherit'],
      encoding: 'utf8',
      maxBuffer: 1 << 26,
    });
    if (child.status !== 0) {
      failed++;
      rows.push([file, 'benchmark module', 'failed', '', '', 'NO', `exit ${child.status ?? child.signal}`]);
      continue;
    }
    const result = JSON.parse(child.stdout) as { rows: string[][]; failed: number };
    rows.push(...result.rows);
    failed += result.failed;
  }
  const widths = rows[0].map((_, c) => Math.max(...rows.map((row) => row[c].length)));
  for (const row of rows) console.log(row.map((cell, c) => cell.padEnd(widths[c])).join('  '));
  console.log(failed === 0 ? 'every target holds' : `${failed} target(s) missed`);
  console.log('Timings on a shared machine vary from run to run: read the spread beside each figure.');
}

/** Runs the chosen benchmarks of one module: a row for each, and how many missed their target. */
async function rowsOf(file: string): Promise<{ rows: string[][]; failed: number }> {
  const rows: string[][] = [];
  let failed = 0;
  const { benchmarks } = (await import(pathToFileURL(join(here, file)).href)) as { benchmarks: Benchmark[] };
  for (const bench of benchmarks) {
    if (only.length > 0 && !only.some((id) => bench.id.startsWith(id))) continue;
    let measured;
    try {
      measured = await bench.run();
    } catch (error) {
      failed++;
      rows.push([bench.id, bench.what, 'failed', '', '', 'NO', (error as Error).message.split('\n')[0]]);
      console.error(`${bench.id} failed: ${(error as Error).message}`);
      continue;
    }
    const { value, spread, detail } = measured;
    const ratio = value / bench.target;
    const holds = bench.higherIsBetter
      ? value >= bench.target
      : bench.inclusive
        ? value <= bench.target
        : value < bench.target;
    if (!holds) failed++;
    const comparator = bench.higherIsBetter ? '≥' : bench.inclusive ? '≤' : '<';
    rows.push([
      bench.id,
      bench.what + (detail ? ` (${detail})` : ''),
      `${format(value)} ${bench.unit}`,
      `${comparator} ${format(bench.target)} ${bench.unit}`,
      ratio.toFixed(2),
      holds ? 'yes' : 'NO',
      `${format(spread.min)} / ${format(spread.median)} / ${format(spread.max)} (${spread.runs})`,
    ]);
    console.error(`${bench.id} done: ${format(value)} ${bench.unit}`);
  }
  return { rows, failed };
}

function format(value: number): string {
  return Math.abs(value) >= 100 ? value.toFixed(0) : Number(value.toPrecision(3)).toString();
}
