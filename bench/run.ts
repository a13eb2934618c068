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
  for (const file of modules) {
    const child = spawnSync(process.execPath, [fileURLToPath(import.meta.url), '--module', file, ...only], {
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
