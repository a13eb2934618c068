import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { demoPlots } from './demo.ts';
import { fixturePlots } from './fixtures.ts';
import { normaliseSvg } from './normalise.ts';

// DEVELOPERS.md rule 13: each registered sheet is compared, normalised, with tests/output/<name>.svg.
// Regenerate with UPDATE_SNAPSHOTS=1 (or vitest -u) and review the change with git diff.
const plots = { ...fixturePlots, ...demoPlots };
const output = (name: string) => new URL(`../output/${name}.svg`, import.meta.url);

describe('SVG snapshots', () => {
  for (const [name, make] of Object.entries(plots)) {
    it(`${name} matches tests/output/${name}.svg`, async () => {
      const svg = normaliseSvg(make());
      const file = output(name);
      const changed = new URL(`../output/${name}-changed.svg`, import.meta.url);
      if (process.env.UPDATE_SNAPSHOTS) writeFileSync(file, svg);
      if (existsSync(file) && readFileSync(file, 'utf8') !== svg) writeFileSync(changed, svg);
      else rmSync(changed, { force: true });
      await expect(svg).toMatchFileSnapshot(`../output/${name}.svg`);
    });
  }
});
