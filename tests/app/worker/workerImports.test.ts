import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(import.meta.dirname, '../../..');

/** Every source module a worker's entry loads, following value imports (type-only imports load nothing). */
function modulesLoadedFrom(entry: string): Map<string, string[]> {
  const loaded = new Map<string, string[]>();
  const pending = [resolve(ROOT, entry)];
  while (pending.length > 0) {
    const file = pending.pop()!;
    if (loaded.has(file)) continue;
    const source = readFileSync(file, 'utf8');
    const specifiers = [...source.matchAll(/^(?:import|export)\s+(?!type\b)[^;]*?from\s+'([^']+)'/gms)].map(
      (m) => m[1],
    );
    loaded.set(file, specifiers);
    // Source modules only: an asset's URL (`…/DejaVuSans.ttf?url`) loads nothing.
    for (const specifier of specifiers)
      if (specifier.startsWith('.') && specifier.endsWith('.ts')) pending.push(resolve(dirname(file), specifier));
  }
  return loaded;
}

// The page sends the workers parsed studies, so the study schemas and the unit library (mathjs) stay
// out of their downloads; each device family keeps its schema in a file of its own for this.
const WORKERS = [
  {
    name: "the checks' worker",
    entry: 'src/app/worker/analysis.worker.ts',
    loads: ['src/engine/analysis.ts', 'src/engine/devices/relay.ts'],
  },
  {
    name: "the settings' worker",
    entry: 'src/app/worker/settings.worker.ts',
    loads: ['src/engine/window/settingWindow.ts', 'src/engine/window/proposal.ts'],
  },
  {
    name: "the one-line's worker",
    entry: 'src/app/worker/oneLine.worker.ts',
    loads: ['src/plot/oneLine/oneLine.ts', 'src/engine/fault/faultLevels.ts'],
  },
  {
    name: "the report's worker",
    entry: 'src/app/worker/report.worker.ts',
    loads: ['src/report/studyReport.ts', 'src/report/reportPdf.ts', 'src/engine/scenario/scenarioAnalysis.ts'],
  },
];

describe.each(WORKERS)('$name', ({ entry, loads }) => {
  const loaded = modulesLoadedFrom(entry);
  const importersOf = (name: string) =>
    [...loaded].filter(([, specifiers]) => specifiers.includes(name)).map(([file]) => file.slice(ROOT.length + 1));

  it(`loads what it works with: ${loads.join(', ')}`, () => {
    const files = [...loaded.keys()].map((file) => file.slice(ROOT.length + 1));
    for (const file of loads) expect(files).toContain(file);
  });

  it('loads no unit parser and no schema', () => {
    expect(importersOf('mathjs')).toEqual([]);
    // Only the setting that keeps any schema from compiling code (the page's policy forbids it).
    expect(importersOf('zod/mini')).toEqual(['src/app/lib/jitlessSchemas.ts']);
    expect(importersOf('zod')).toEqual([]);
  });
});
