// `npm run bench`: runs every benchmark module in bench/ and prints each figure beside its target (DESIGN §7).
import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dirname, join } from 'node:path';
import type { Benchmark } from './benchmark.ts';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const modules = readdirSync(here)
  .filter((file) => file.endsWith('.bench.ts'))
  .sort();

const rows: string[][] = [['id', 'what', 'measured', 'target', 'ratio', 'holds']];
let failed = 0;
for (const file of modules) {
  const { benchmarks } = (await import(pathToFileURL(join(here, file)).href)) as { benchmarks: Benchmark[] };
  for (const bench of benchmarks) {
    if (only.length > 0 && !only.includes(bench.id)) continue;
    const { value, detail } = await bench.run();
    const ratio = bench.higherIsBetter ? value / bench.target : value / bench.target;
    const holds = bench.higherIsBetter ? value >= bench.target : value < bench.target;
    if (!holds) failed++;
    const comparator = bench.higherIsBetter ? '≥' : '<';
    rows.push([
      bench.id,
      bench.what + (detail ? ` (${detail})` : ''),
      `${format(value)} ${bench.unit}`,
      `${comparator} ${format(bench.target)} ${bench.unit}`,
      ratio.toFixed(2),
      holds ? 'yes' : 'NO',
    ]);
    console.error(`${bench.id} done`);
  }
}
const widths = rows[0].map((_, c) => Math.max(...rows.map((row) => row[c].length)));
for (const row of rows) console.log(row.map((cell, c) => cell.padEnd(widths[c])).join('  '));
console.log(failed === 0 ? 'every target holds' : `${failed} target(s) missed`);

function format(value: number): string {
  return Math.abs(value) >= 100 ? value.toFixed(0) : Number(value.toPrecision(3)).toString();
}
