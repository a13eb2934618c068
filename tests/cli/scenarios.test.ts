import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  checkCommand,
  faultsCommand,
  plotCommand,
  reportCommand,
  windowCommand,
} from '../../src/cli/commands/index.ts';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { jsonReport } from '../../src/engine/report/index.ts';
import { analyseScenarios } from '../../src/engine/scenario/index.ts';
import { readStudy } from '../../src/engine/study/index.ts';
import { assertInDelta } from '../asserts.ts';
import { runVerb } from './run.ts';

const standby = 'demo/harrowmere-standby.json';
const overlap = 'demo/harrowmere-standby-overlap.json';
const single = ['selective', 'overlap', 'fused', 'full'].map((name) => `demo/harrowmere-${name}.json`);

describe('discern check in operating scenarios', () => {
  it('has the expected defaults: every scenario checked, each named with its id and counts', async () => {
    const { code, stdout } = await runVerb([standby], checkCommand);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^Scenarios checked \(a finding marked \[name\] holds only in those named\):$/m);
    expect(stdout).toMatch(/^ {2}Normal \(normal\): 0 fail, \d+ warning, \d+ info, \d+ ok$/m);
    expect(stdout).toMatch(/^ {2}On generator \(on-generator\): 0 fail, \d+ warning, \d+ info, \d+ ok$/m);
    expect(stdout).toMatch(/^ {2}Dock on the office feeder \(tie-closed\): 0 fail, /m);
    expect(stdout.split('\n').every((line) => line.length <= 120)).toBe(true);
  });

  it('exits 1 on the generator overlap, the failures marked [On generator]; --all-scenarios is the same', async () => {
    const run = await runVerb([overlap], checkCommand);
    expect(run.code).toBe(1);
    expect(run.stdout).toMatch(
      /^- Exhaust fan breaker 50 A: NFPA 70 700\.32 selective coordination \(emergency system\) \[On generator\]$/m,
    );
    expect(run.stdout).toMatch(/^ {2}On generator \(on-generator\): 2 fail, /m);
    expect(run.stdout).toMatch(/^ {2}Normal \(normal\): 0 fail, /m);
    expect(run.stdout).toMatch(/\ncounts: 2 fail, /);
    const all = await runVerb([overlap, '--all-scenarios'], checkCommand);
    expect(all).toEqual(run);
  });

  it('exits 0 on the overlap demo with --scenario normal (by id or by name), where the utility feeds the chain', async () => {
    for (const name of ['normal', 'Normal']) {
      const { code, stdout } = await runVerb([overlap, '--scenario', name], checkCommand);
      expect(code).toBe(0);
      expect(stdout).toMatch(/^ {2}Normal \(normal\): 0 fail, /m);
      expect(stdout).not.toMatch(/On generator/);
    }
    expect((await runVerb([overlap, '--scenario', 'On generator'], checkCommand)).code).toBe(1);
  });

  it('refuses an unknown --scenario, or one with --all-scenarios, in one line naming the flag, exit 2', async () => {
    const bad = await runVerb([overlap, '--scenario', 'island'], checkCommand);
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toMatch(/^--scenario: expected one of "normal", "on-generator", "tie-closed", got "island"\n$/);
    const both = await runVerb([overlap, '--scenario', 'normal', '--all-scenarios'], checkCommand);
    expect(both.code).toBe(2);
    expect(both.stderr).toMatch(/^--scenario: expected either --scenario or --all-scenarios, got "normal"\n$/);
    // A study without scenarios has one, "normal".
    const plain = await runVerb([single[0], '--scenario', 'on-generator'], checkCommand);
    expect(plain.stderr).toMatch(/^--scenario: expected one of "normal", got "on-generator"\n$/);
  });

  it('--json adds every scenario: its sources, de-energised buses, fault levels per bus of every tree, pairs and counts', async () => {
    const { code, stdout } = await runVerb([overlap, '--json'], checkCommand);
    expect(code).toBe(1);
    const json = JSON.parse(stdout);
    expect(Object.keys(json)).toEqual(['study', 'caution', 'counts', 'findings', 'pairs', 'faults', 'scenarios']);
    expect(json.scenarios.map((s: { id: string }) => s.id)).toEqual(['normal', 'on-generator', 'tie-closed']);
    const generator = json.scenarios[1];
    expect(generator).toMatchObject({ name: 'On generator', sources: ['G1'] });
    expect(generator.deEnergised).toEqual(['MV', 'SWBD', 'MCC', 'DOCK', 'OFC-P', 'OFC', 'ATS-N']);
    expect(generator.faults.map((f: { busId: string; source: string }) => `${f.busId}:${f.source}`)).toEqual([
      'GEN:G1',
      'ATS-E:G1',
      'EMP:G1',
    ]);
    expect(generator.pairs.map((p: { upstream: string }) => p.upstream)).toContain('GEN-CB');
    expect(generator.counts.fail).toBe(2);
    expect(json.scenarios[0].counts.fail).toBe(0);
    expect(json.scenarios[0].faults.map((f: { busId: string }) => f.busId)).toContain('EMP');
    // The findings carry the scenarios they hold in; the code finding holds on the generator only.
    const code700 = json.findings.find((f: { id: string }) => f.id === 'code-selectivity:EM-BR');
    expect(code700.scenarios).toEqual(['On generator']);
  });

  it('--report adds a scenarios column (CSV) and a scenario line with a column (Markdown)', async () => {
    const csv = await runVerb([overlap, '--report', 'out/f.csv'], checkCommand);
    const text = String(csv.files.get('out/f.csv'));
    expect(text).toMatch(/^severity,kind,title,range,worst,explanation,suggestion,basis,scenarios\r\n/);
    expect(text).toMatch(/,On generator\r\n/);
    expect(text).toMatch(/\r\ncaution,,"?For review[^\r]*,,,,,,\r\n$/);
    const md = await runVerb([overlap, '--report', 'out/f.md'], checkCommand);
    const markdown = String(md.files.get('out/f.md'));
    expect(markdown).toMatch(
      /\n\*\*Scenarios analysed:\*\* Normal \(`normal`\): 0 fail, .*On generator \(`on-generator`\): 2 fail/,
    );
    expect(markdown).toMatch(/\n\| severity \| check \| finding \| current range \| worst margin \| scenarios \|\n/);
    expect(markdown).toMatch(/\n\*Holds in:\* On generator\n/);
  });

  it('gives byte for byte the JSON of the single-tree analysis for a study without scenarios', async () => {
    for (const path of single) {
      const study = readStudy(readFileSync(path, 'utf8')).study!;
      const before = JSON.stringify(jsonReport(analyseStudy(study)), null, 2);
      expect(JSON.stringify(jsonReport(analyseScenarios(study)), null, 2)).toBe(before);
      const { stdout } = await runVerb([path, '--json'], checkCommand);
      expect(stdout).toBe(`${before}\n`);
      expect(JSON.parse(stdout)).not.toHaveProperty('scenarios');
    }
  });
});

describe('discern faults in operating scenarios', () => {
  it('has the expected defaults: every scenario one after another, each tree headed by its source', async () => {
    const { code, stdout } = await runVerb([standby], faultsCommand);
    expect(code).toBe(0);
    const headings = stdout.match(/^== Scenario: .*$/gm);
    expect(headings).toEqual([
      '== Scenario: Normal (normal) ==',
      '== Scenario: On generator (on-generator) ==',
      '== Scenario: Dock on the office feeder (tie-closed) ==',
    ]);
    expect(stdout.match(/^fed from .*$/gm)).toEqual([
      'fed from UTIL (utility):',
      'fed from G1 (generator):',
      'fed from UTIL (utility):',
    ]);
  });

  it('--scenario on-generator prints the generator tree only: GEN, ATS-E and EMP', async () => {
    const { code, stdout } = await runVerb([standby, '--scenario', 'on-generator'], faultsCommand);
    expect(code).toBe(0);
    expect(stdout).toMatch(
      /^== Scenario: On generator \(on-generator\) ==\nde-energised: MV, SWBD, MCC, DOCK, OFC-P, OFC, ATS-N$/m,
    );
    expect(stdout).toMatch(/^fed from G1 \(generator\):$/m);
    const buses = [...stdout.matchAll(/^([A-Z][\w-]*) +0\.48 +3φ /gm)].map((m) => m[1]);
    expect(buses).toEqual(['GEN', 'ATS-E', 'EMP']);
    expect(stdout).not.toMatch(/^(SWBD|MCC|MV) /m);
    expect(stdout).not.toMatch(/Normal/);
  });

  it('--json holds each scenario with its trees; the generator gives I″ = I rated / x″d at its terminals', async () => {
    const { stdout } = await runVerb([standby, '--json'], faultsCommand);
    const json = JSON.parse(stdout);
    expect(json.study).toBe('Harrowmere Cold Store — standby generator');
    expect(json.scenarios.map((s: { id: string }) => s.id)).toEqual(['normal', 'on-generator', 'tie-closed']);
    const [tree] = json.scenarios[1].trees;
    expect(json.scenarios[1].trees).toHaveLength(1);
    expect(tree).toMatchObject({ source: 'G1', kind: 'generator' });
    expect(tree.buses.map((b: { busId: string }) => b.busId)).toEqual(['GEN', 'ATS-E', 'EMP']);
    // 300 kVA at 480 V: 360.84 A rated; x″d 0.12 gives 3007 A subtransient (IEEE 242 §2, I″ = I / x″d; python3).
    // The motors' first-cycle contribution adds nearly in phase, so the sum holds to 1 %.
    const gen = tree.buses[0];
    assertInDelta(gen.max.threePhase - gen.max.motorAmps, 3007, 0.01);
    // The utility scenario's tree reaches the emergency panel through the normal side.
    const normalBuses = json.scenarios[0].trees[0].buses.map((b: { busId: string }) => b.busId);
    expect(normalBuses).toEqual(expect.arrayContaining(['SWBD', 'ATS-N', 'EMP']));
    expect(normalBuses).not.toContain('GEN');
  });

  it('--scenario by name gives one scenario; an unknown one is a one-line error, exit 2', async () => {
    const json = JSON.parse(
      (await runVerb([standby, '--scenario', 'Dock on the office feeder', '--json'], faultsCommand)).stdout,
    );
    expect(json.scenarios.map((s: { id: string }) => s.id)).toEqual(['tie-closed']);
    const bad = await runVerb([standby, '--scenario', 'x'], faultsCommand);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/^--scenario: expected one of "normal", "on-generator", "tie-closed", got "x"\n$/);
  });
});

describe('discern plot in operating scenarios', () => {
  it('has the expected defaults: the first scenario energising the view, named on the sheet', async () => {
    const { code, stdout, files } = await runVerb([standby, '--view', 'service', '--out', 'out/s.svg'], plotCommand);
    expect(code).toBe(0);
    expect(stdout).toBe('service (Normal): wrote out/s.svg\n');
    expect(String(files.get('out/s.svg'))).toMatch(/— Normal/);
  });

  it('--scenario on-generator draws the generator tree; a view de-energised there is a one-line error', async () => {
    const run = await runVerb(
      [overlap, '--view', 'emergency', '--scenario', 'on-generator', '--out', 'e.svg'],
      plotCommand,
    );
    expect(run.code).toBe(0);
    expect(String(run.files.get('e.svg'))).toMatch(/— On generator/);
    const dark = await runVerb(
      [overlap, '--view', 'service', '--scenario', 'on-generator', '--out', 's.svg'],
      plotCommand,
    );
    expect(dark.code).toBe(2);
    expect(dark.stderr).toMatch(
      /^--scenario: expected a scenario in which view "service" has devices energised, got "on-generator"\n$/,
    );
    expect(dark.files.size).toBe(0);
  });
});

describe('discern report in operating scenarios', () => {
  it('--scenario on-generator works out the generator scenario only', async () => {
    const { code, files } = await runVerb([standby, '--scenario', 'on-generator', '--out', 'r.md'], reportCommand);
    expect(code).toBe(0);
    const text = String(files.get('r.md'));
    expect(text).toMatch(/\n### Emergency panel \(480 V\) in "On generator"\n/);
    expect(text).not.toMatch(/ in "Normal"\n/);
  });
});

describe('window in an operating scenario', () => {
  it("works out the generator breaker's window on the generator's tree", async () => {
    const { code, stdout } = await runVerb(
      ['demo/harrowmere-standby-overlap.json', '--device', 'GEN-CB', '--scenario', 'on-generator'],
      windowCommand,
    );
    expect(code).toBe(0);
    expect(stdout).toMatch(
      /coordinate with Exhaust fan breaker 50 A below \(0 s margin; must be shown selective, NFPA 70 700\.32\)/,
    );
  });

  it('refuses a device the scenario does not energise, in one line', async () => {
    const { code, stderr } = await runVerb(
      ['demo/harrowmere-standby-overlap.json', '--device', 'MAIN', '--scenario', 'on-generator'],
      windowCommand,
    );
    expect(code).toBe(2);
    expect(stderr).toBe('--device: expected a device energised in scenario "on-generator", got "MAIN"\n');
  });
});
