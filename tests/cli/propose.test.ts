import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { proposeCommand } from '../../src/cli/commands/propose.ts';
import { readStudy } from '../../src/engine/study/index.ts';
import { runVerb } from './run.ts';

describe('discern propose', () => {
  it('has the expected defaults: every device, the changes before and after, the findings cleared, exit 0 when all clear', async () => {
    const { code, stdout, files } = await runVerb(
      ['demo/harrowmere-overlap.json', '--out', 'out/proposed.json'],
      proposeCommand,
    );
    expect(code).toBe(0);
    expect(stdout).toMatch(/^Proposed changes \(\d+, in the order set\):$/m);
    expect(stdout).toMatch(/^Main 2000 A\s+instantaneous trip\s+on\s+off/m);
    expect(stdout).toMatch(/^Failing findings: \d+ before, 0 after\.$/m);
    expect(stdout).toMatch(/^Cleared:\n- fail: Main 2000 A over MCC feeder 600 A: overlap/m);
    expect(stdout).toMatch(/Proposed study written to out\/proposed\.json\./);
    const written = readStudy(String(files.get('out/proposed.json')));
    expect(written.problems).toEqual([]);
    expect(written.study!.devices.find((d) => d.id === 'MAIN')!.characteristic).not.toHaveProperty('instantaneous');
    expect(files.has('demo/harrowmere-overlap.json')).toBe(false);
  });

  it('proposes one view with --view and prints JSON with --json', async () => {
    const { code, stdout } = await runVerb(
      ['demo/harrowmere-overlap.json', '--view', 'emergency', '--json'],
      proposeCommand,
    );
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(json.order).toEqual(['FDR-EM', 'MAIN']);
    expect(json.changes[0]).toMatchObject({ deviceId: 'FDR-EM' });
    expect(json).not.toHaveProperty('study');
  });

  it('exits 2 with one line naming the flag for a bad view, an output that is the input, or both scopes', async () => {
    const view = await runVerb(['demo/harrowmere-overlap.json', '--view', 'nowhere'], proposeCommand);
    expect(view.code).toBe(2);
    expect(view.stderr).toMatch(/^--view: expected one of service, primary, office, emergency, got "nowhere"\n$/);
    const same = await runVerb(
      ['demo/harrowmere-overlap.json', '--out', 'demo/harrowmere-overlap.json'],
      proposeCommand,
    );
    expect(same.code).toBe(2);
    expect(same.stderr).toMatch(
      /^--out: expected a new file, not the input study, got "demo\/harrowmere-overlap\.json"\n$/,
    );
    const both = await runVerb(['demo/harrowmere-overlap.json', '--view', 'service', '--all'], proposeCommand);
    expect(both.code).toBe(2);
    expect(readFileSync('demo/harrowmere-overlap.json', 'utf8')).toMatch(/"pickup": 10/);
  });
});
