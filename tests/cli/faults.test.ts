import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { commands, faultsCommand } from '../../src/cli/commands/index.ts';
import { assertInDelta } from '../asserts.ts';
import { singlePhaseInput } from '../engine/fault/sequenceReference.ts';
import { runVerb, spawnDiscern } from './run.ts';

const demo = 'demo/harrowmere-selective.json';
const run = (args: string[]) => runVerb(args, faultsCommand);

describe('discern faults', () => {
  it('has the expected defaults', async () => {
    // Text table by default, exit 0.
    const { code, stdout } = await run([demo]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^Harrowmere Cold Store/);
    expect(commands.map((c) => c.verb)).toContain('faults');
  });

  it('the table lists every bus with its voltage, max/min currents and the reflected values', async () => {
    const { stdout } = await run([demo]);
    expect(stdout).toMatch(
      /bus +kV +system +3φ max A +3φ min A +L-L max A +L-L min A +L-G max A +L-G min A +X\/R 3φ +X\/R L-G +motors A +at 12\.47 kV max\/min/,
    );
    for (const bus of ['MV', 'SWBD', 'MCC', 'DOCK', 'OFC-P', 'OFC'])
      expect(stdout).toMatch(new RegExp(`^${bus} `, 'm'));
    // Demo T1 through-fault at 12.47 kV: 1094 A; infinite bus 31 378 A (1804.22 A / 0.0575, IEEE 141 identity).
    expect(stdout).toMatch(/^T1 +1500 +69 +1 804 +31 378 +\d[\d ]* +1 094 +1 094 +\d[\d ]*$/m);
    // Each bus shows its current only at the voltages on its way to the source.
    expect(stdout).toMatch(/^SWBD +0\.48 +3φ .* here *$/m);
    expect(stdout).toMatch(/Transformer secondary faults/);
    expect(stdout).toMatch(/qualified engineer/);
  });

  it('--json carries every bus and transformer with its work', async () => {
    const { code, stdout } = await run([demo, '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    const swbd = json.buses.find((b: { busId: string }) => b.busId === 'SWBD');
    expect(swbd.volts).toBe(480);
    assertInDelta(swbd.max.threePhase - swbd.max.motorAmps, 28421.1, 1e-5); // IEEE 141 / IEEE 399 per-unit method, hand calculation
    expect(swbd.reflected.map((r: { volts: number }) => r.volts)).toEqual([12470]);
    const ofc = json.buses.find((b: { busId: string }) => b.busId === 'OFC');
    expect(ofc.reflected.map((r: { volts: number }) => r.volts)).toEqual([480, 12470]);
    // No motors at or below OFC: its whole fault passes the 480–208 V unit. The demo motors join at
    // 480 V, below T1, and feed the fault without passing T1 (IEEE 399 / IEEE 141: motors are parallel
    // sources at their buses), so less reaches 12.47 kV than the bus total reflected; at minimum, no motors.
    assertInDelta(ofc.reflected[0].maxAmps, (ofc.max.threePhase * 208) / 480, 1e-12);
    expect(ofc.reflected[1].maxAmps).toBeLessThan((ofc.max.threePhase * 208) / 12470);
    assertInDelta(ofc.reflected[1].minAmps, (ofc.min.threePhase * 208) / 12470, 1e-12);
    expect(swbd.phases).toBe(3);
    expect(swbd.max.lineToGround).toBeGreaterThan(0);
    const t1 = json.transformers.find((t: { transformerId: string }) => t.transformerId === 'T1');
    assertInDelta(t1.reflectedToPrimary, 1093.99, 1e-5);
    expect(swbd.work.length).toBeGreaterThan(10);
  });

  it('a single-phase bus shows its full-winding and line-to-neutral faults and no three-phase fault', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'discern-faults-'));
    const path = join(dir, 'single.json');
    writeFileSync(path, JSON.stringify(singlePhaseInput()));
    const { code, stdout } = await run([path]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^S +0\.24 +1φ +— +— +9 \d{3} /m);
    expect(stdout).toMatch(
      /^S: single-phase 120\/240 V centre-tapped; L-L is the full-winding fault, L-G the line-to-neutral \(half-winding\) fault\.$/m,
    );
  });

  it('a bad study prints its first problem as one line, exit 2', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'discern-faults-'));
    const path = join(dir, 'bad.json');
    writeFileSync(
      path,
      JSON.stringify({
        discern: 1,
        name: 'x',
        source: { kind: 'infinite', id: 'U', bus: 'A' },
        buses: [{ id: 'A', voltage: 'high' }],
      }),
    );
    const { code, stdout, stderr } = await run([path]);
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toMatch(/^study\.buses\[0\]\.voltage: expected a voltage such as "13\.8 kV", got "high"\n$/);
  });

  it('a missing file or argument is one line, exit 2', async () => {
    const missing = await run(['no/such/study.json']);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(
      /^no\/such\/study\.json: expected a readable study file, got "no\/such\/study\.json"\n$/,
    );
    expect((await run([])).stderr).toMatch(/^faults: expected a study file, got nothing\n$/);
    expect((await run([demo, '--csv'])).stderr).toMatch(
      /^--csv: expected one of --json, --scenario, --all-scenarios, --help, got "--csv"\n$/,
    );
  });
});

describe('discern (dispatch)', () => {
  it('--help lists every verb, exit 0; an unknown verb is one line, exit 2', async () => {
    const help = await runVerb(['--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toMatch(/^ {2}transformer {2}/m);
    expect(help.stdout).toMatch(/^ {2}faults {7}/m);
    const unknown = await runVerb(['plott']);
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toMatch(/^verb: expected one of transformer, faults.*, got "plott"\n$/);
    expect((await runVerb([])).code).toBe(2);
  });

  it('runs as a real process on the demo study', () => {
    const { code, stdout } = spawnDiscern(['faults', demo, '--json']);
    expect(code).toBe(0);
    expect(JSON.parse(stdout).buses.length).toBeGreaterThanOrEqual(6);
  });
});
