import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(import.meta.dirname, '../../..');

/** Every source module the checks' worker loads, following value imports (type-only imports load nothing). */
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

describe("the checks' worker", () => {
  // The page sends the worker parsed studies, so the study schemas and the unit library (mathjs) stay
  // out of its download; each device family keeps its schema in a file of its own for this.
  const loaded = modulesLoadedFrom('src/app/worker/analysis.worker.ts');
  const importersOf = (name: string) =>
    [...loaded].filter(([, specifiers]) => specifiers.includes(name)).map(([file]) => file.slice(ROOT.length + 1));

  it('loads the engine checks and the band functions', () => {
    const files = [...loaded.keys()].map((file) => file.slice(ROOT.length + 1));
    expect(files).toContain('src/engine/analysis.ts');
    expect(files).toContain('src/engine/devices/relay.ts');
  });

  it('loads no unit parser and no schema', () => {
    expect(importersOf('mathjs')).toEqual([]);
    // Only the setting that keeps any schema from compiling code (the page's policy forbids it).
    expect(importersOf('zod')).toEqual(['src/app/lib/jitlessSchemas.ts']);
  });
});

describe("the settings' worker", () => {
  const loaded = modulesLoadedFrom('src/app/worker/settings.worker.ts');
  const importersOf = (name: string) =>
    [...loaded].filter(([, specifiers]) => specifiers.includes(name)).map(([file]) => file.slice(ROOT.length + 1));

  it('loads the setting window and the proposals', () => {
    const files = [...loaded.keys()].map((file) => file.slice(ROOT.length + 1));
    expect(files).toContain('src/engine/window/settingWindow.ts');
    expect(files).toContain('src/engine/window/proposal.ts');
  });

  it("loads no unit parser and no schema, as the checks' worker", () => {
    expect(importersOf('mathjs')).toEqual([]);
    expect(importersOf('zod')).toEqual(['src/app/lib/jitlessSchemas.ts']);
  });
});

describe("the report's worker", () => {
  const loaded = modulesLoadedFrom('src/app/worker/report.worker.ts');
  const importersOf = (name: string) =>
    [...loaded].filter(([, specifiers]) => specifiers.includes(name)).map(([file]) => file.slice(ROOT.length + 1));

  it('loads the report, its PDF writer and every check', () => {
    const files = [...loaded.keys()].map((file) => file.slice(ROOT.length + 1));
    for (const file of [
      'src/report/studyReport.ts',
      'src/report/reportPdf.ts',
      'src/engine/scenario/scenarioAnalysis.ts',
    ])
      expect(files).toContain(file);
  });

  it("loads no unit parser and no schema, as the checks' worker", () => {
    expect(importersOf('mathjs')).toEqual([]);
    expect(importersOf('zod')).toEqual(['src/app/lib/jitlessSchemas.ts']);
  });
});

describe("the one-line's worker", () => {
  const loaded = modulesLoadedFrom('src/app/worker/oneLine.worker.ts');
  const importersOf = (name: string) =>
    [...loaded].filter(([, specifiers]) => specifiers.includes(name)).map(([file]) => file.slice(ROOT.length + 1));

  it('loads the one-line diagram and the fault levels its buses are labelled with', () => {
    const files = [...loaded.keys()].map((file) => file.slice(ROOT.length + 1));
    expect(files).toContain('src/plot/oneLine/oneLine.ts');
    expect(files).toContain('src/engine/fault/faultLevels.ts');
  });

  it("loads no unit parser and no schema, as the checks' worker", () => {
    expect(importersOf('mathjs')).toEqual([]);
    expect(importersOf('zod')).toEqual(['src/app/lib/jitlessSchemas.ts']);
  });
});
