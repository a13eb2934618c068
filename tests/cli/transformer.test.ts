import { describe, expect, it } from 'vitest';
import { transformerCommand } from '../../src/cli/commands/index.ts';
import { assertInDelta } from '../asserts.ts';
import { runVerb, spawnDiscern } from './run.ts';

const demoFlags = ['--kva', '1500', '--primary', '12.47 kV', '--secondary', '480', '--impedance', '5.75'];
const run = (args: string[]) => runVerb(args, transformerCommand);

/** The demo flags with `extra` added, a flag in `extra` replacing the demo's value. */
function withFlags(extra: string[]): string[] {
  const out = [...demoFlags];
  for (let i = 0; i < extra.length; i++) {
    const at = out.indexOf(extra[i]);
    const takesValue = extra[i + 1] !== undefined && !extra[i + 1].startsWith('--');
    if (at !== -1 && takesValue) out[at + 1] = extra[++i];
    else if (takesValue) out.push(extra[i], extra[++i]);
    else out.push(extra[i]);
  }
  return out;
}

describe('discern transformer', () => {
  it('has the expected defaults', async () => {
    // Three-phase, infinite source when no source is given.
    const { code, stdout } = await run([...demoFlags, '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(json.input.phases).toBe(3);
    expect(json.faultAmps.secondary).toBe(json.faultAmps.infiniteBus);
  });

  it('--json gives FLA, infinite-bus, finite-source and reflected amps for the demo unit, IEEE 141 / IEEE 399 per-unit method, hand calculation', async () => {
    const { code, stdout, stderr } = await run([
      ...demoFlags,
      '--xr',
      '6',
      '--source-mva',
      '250',
      '--source-xr',
      '12',
      '--json',
    ]);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    assertInDelta(json.fullLoadAmps.secondary, 1804.22, 1e-6);
    assertInDelta(json.fullLoadAmps.primary, 69.449, 1e-5);
    assertInDelta(json.faultAmps.infiniteBus, 31377.7, 1e-5);
    assertInDelta(json.faultAmps.secondary, 28421.1, 1e-5);
    assertInDelta(json.faultAmps.reflectedToPrimary, 1093.99, 1e-5);
    expect(json.work.length).toBeGreaterThan(5);
    expect(json.work[0]).toMatchObject({ label: expect.any(String), formula: expect.any(String), unit: 'A' });
  });

  it('--source-ka reads a fault current: 34.6965 kA at 4.16 kV is 250 MVA, IEEE 141 / IEEE 399 per-unit method, hand calculation', async () => {
    const { stdout } = await run([
      '--kva=750',
      '--primary=4160',
      '--secondary=480',
      '--impedance=5.75 %',
      '--xr=5',
      '--source-ka=34.6965',
      '--source-xr=15',
      '--json',
    ]);
    assertInDelta(JSON.parse(stdout).faultAmps.secondary, 14916.9, 1e-5);
  });

  it('prints the numbers and the work as text', async () => {
    const { code, stdout } = await run([...demoFlags, '--xr', '6', '--source-mva', '250', '--source-xr', '12']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/Full-load current +primary 69\.45 A +secondary 1804 A/);
    expect(stdout).toMatch(/infinite source +31\.38 kA/);
    expect(stdout).toMatch(/with this source +28\.42 kA +X\/R 6\.3/);
    expect(stdout).toMatch(/seen at the primary 1094 A/);
    expect(stdout).toMatch(/I_sc = 1804\.22 A \/ 0\.0634817 pu = 28421\.1 A/);
  });

  it('--phases 1 uses S / V', async () => {
    const { stdout } = await run([
      '--kva',
      '50',
      '--primary',
      '7200',
      '--secondary',
      '240',
      '--impedance',
      '2',
      '--phases',
      '1',
      '--json',
    ]);
    assertInDelta(JSON.parse(stdout).fullLoadAmps.secondary, 208.333, 1e-5);
  });

  it('--phases 1 on a 240 V secondary prints the line-to-neutral fault; the connection flags need --phases 1', async () => {
    const single = ['--kva', '50', '--primary', '7.2 kV', '--secondary', '240', '--impedance', '2.1', '--phases', '1'];
    const { stdout } = await run([...single, '--primary-connection', 'line-to-neutral']);
    // Infinite source, all reactance: 50 kVA / 120 V / (1.2 × 0.021) = 16 534 A (half winding, common practice).
    expect(stdout).toMatch(/^ {2}line to neutral +16\.53 kA/m);
    const bad = await run([...single, '--secondary-winding', 'three-wire']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/^--secondary-winding: expected centre-tapped or two-wire, got "three-wire"\n$/);
    const three = await run([...demoFlags, '--primary-connection', 'line-to-neutral']);
    expect(three.stderr).toMatch(/^--primary-connection: expected --phases 1 with it/);
  });

  it('--help prints the flags', async () => {
    const { code, stdout } = await run(['--help']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/--source-mva/);
  });

  it.each([
    [['--impedance', '-5'], /^--impedance: expected a percentage greater than 0, got "-5"\n$/],
    [['--impedance', 'lots'], /^--impedance: expected a percentage greater than 0, got "lots"\n$/],
    // A per-unit impedance where a percentage goes, refused as a study refuses it.
    [
      ['--impedance', '0.0575'],
      /^--impedance: expected a percentage of at least 0\.5 \(a per-unit 0\.0575 is 5\.75\), got "0\.0575"\n$/,
    ],
    [
      ['--primary', '4.16 kA'],
      /^--primary: expected a voltage greater than 0 such as "480" or "12\.47 kV", got "4\.16 kA"\n$/,
    ],
    [['--kva', '0'], /^--kva: expected a rating greater than 0 such as "1500" or "1\.5 MVA", got "0"\n$/],
    [['--phases', '2'], /^--phases: expected 1 or 3, got "2"\n$/],
    // Numbers a study would refuse (a denormal, an overflowing size) are refused here too: they carry
    // Infinity into the fault current.
    [['--secondary', '1e-310'], /^--secondary: expected a voltage between 1 V and 2000000 V, got "1e-310"\n$/],
    // As in a study, each quantity keeps to its physical range: a microvolt winding is no transformer.
    [['--primary', '0.000001'], /^--primary: expected a voltage between 1 V and 2000000 V, got "0\.000001"\n$/],
    [['--kva', '1e-9'], /^--kva: expected a power between 1 VA and 1000000000000 VA, got "1e-9"\n$/],
    [
      ['--impedance', '5e-324'],
      /^--impedance: expected a number between 1e-9 and 1000000000000 in size, got "5e-324"\n$/,
    ],
    [['--xr', '1e13'], /^--xr: expected a number between 1e-9 and 1000000000000 in size, got "1e13"\n$/],
    [['--xr', 'high'], /^--xr: expected an X\/R ratio greater than 0, got "high"\n$/],
    [
      ['--source-mva', '250', '--source-ka', '11'],
      /^--source-ka: expected either --source-mva or --source-ka, got "both"\n$/,
    ],
    [['--source-xr', '12'], /^--source-xr: expected --source-mva or --source-ka with it, got "--source-xr 12"\n$/],
    [['--colour', 'red'], /^--colour: expected one of --kva, --primary, .*--help, got "--colour"\n$/],
    [['--json=yes'], /^--json: expected no value \(it is a switch\), got "yes"\n$/],
  ])('%j is one line naming the flag, exit 2', async (extra, message) => {
    const { code, stdout, stderr } = await run(withFlags(extra));
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toMatch(message);
  });

  it('a repeated flag is refused, exit 2', async () => {
    const { code, stderr } = await run([...demoFlags, '--kva', '750']);
    expect(code).toBe(2);
    expect(stderr).toMatch(/^--kva: expected the flag once, got "--kva given twice"\n$/);
  });

  it('a missing required flag is named, exit 2', async () => {
    const { code, stderr } = await run(['--kva', '1500', '--primary', '480', '--secondary', '208']);
    expect(code).toBe(2);
    expect(stderr).toMatch(/^--impedance: expected a percentage such as "5\.75", got nothing\n$/);
    expect((await run(['--primary', '480'])).stderr).toMatch(
      /^--kva: expected a transformer rating such as "1500" \(kVA\), got nothing\n$/,
    );
    expect((await run([...demoFlags.slice(0, 6), '--impedance'])).stderr).toMatch(
      /^--impedance: expected a value after --impedance, got nothing\n$/,
    );
  });

  it('runs as a real process: exit 0 with JSON, exit 2 with one line on stderr', () => {
    const ok = spawnDiscern(['transformer', ...demoFlags, '--json']);
    expect(ok.code).toBe(0);
    assertInDelta(JSON.parse(ok.stdout).faultAmps.secondary, 31377.7, 1e-5);
    const bad = spawnDiscern(['transformer', ...demoFlags.slice(0, 6), '--impedance', '-5']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/^--impedance: expected a percentage greater than 0, got "-5"\n$/);
  });
});
