import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { windowCommand } from '../../src/cli/commands/window.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { runVerb } from './run.ts';

describe('discern window', () => {
  it('has the expected defaults: each setting with its window and binding constraints, the recommendation, exit 0', async () => {
    const { code, stdout } = await runVerb(['demo/harrowmere-selective.json', '--device', 'FDR-MCC'], windowCommand);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^MCC feeder 600 A \(FDR-MCC, trip-unit\) — setting window\n/);
    expect(stdout).toMatch(/^setting\s+now\s+window\s+lower edge set by\s+upper edge set by$/m);
    expect(stdout).toMatch(/^short-time delay\s+/m);
    expect(stdout).toMatch(/coordinate with Main 2000 A above/);
    expect(stdout).toMatch(/^Recommended/m);
    expect(stdout).toMatch(/How ties are broken: Fastest first/);
    expect(stdout).toContain(CAUTION);
  });

  it('prints JSON with --json: settings with intervals and bindings, maps, constraints and the recommendation', async () => {
    const { code, stdout } = await runVerb(
      ['demo/harrowmere-overlap.json', '--device', 'MAIN', '--json'],
      windowCommand,
    );
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(json).toMatchObject({ deviceId: 'MAIN', exists: true, adjustable: true });
    expect(json.settings[0]).toHaveProperty('intervals');
    expect(json.maps.length).toBe(2);
    expect(json.maps[0].columns[0]).toHaveProperty('x');
    expect(json.recommendation.settings.find((s: { key: string }) => s.key === 'instantaneous').to).toBe(false);
  });

  it('exits 1 and names the conflict when the device has no window', async () => {
    const { code, stdout } = await runVerb(['demo/harrowmere-overlap.json', '--device', 'FDR-EM'], windowCommand);
    expect(code).toBe(1);
    expect(stdout).toMatch(/^No setting keeps every constraint\.$/m);
    expect(stdout).toMatch(/coordinate with Exhaust fan breaker 50 A below/);
    expect(stdout).toMatch(/^What would open a window:$/m);
  });

  it('exits 0 with a recommendation when the present setting fails but its own row shows a window', async () => {
    // The full demo with the service relay's time dial turned down to 2: it no longer waits for the main.
    const full = JSON.parse(readFileSync('demo/harrowmere-full.json', 'utf8'));
    full.devices.find((d: { id: string }) => d.id === 'R-T1').characteristic.timeOvercurrent.timeDial = 2;
    const path = join(mkdtempSync(join(tmpdir(), 'discern-window-')), 'fast-relay.json');
    writeFileSync(path, JSON.stringify(full));
    const { code, stdout } = await runVerb([path, '--device', 'R-T1'], windowCommand);
    expect(stdout).toMatch(/^time dial\s+2 \(outside\)\s+4\.\d+–10\.\d+\s/m);
    expect(stdout).not.toMatch(/No setting keeps every constraint/);
    expect(stdout).toMatch(/^Recommended:$/m);
    expect(code).toBe(0);
  });

  it("marks a bound the checks only warn about 'warn' where it is missed: the generator breaker and the machine's damage curve", async () => {
    const { code, stdout } = await runVerb(
      ['demo/harrowmere-standby.json', '--device', 'GEN-CB', '--scenario', 'on-generator'],
      windowCommand,
    );
    expect(code).toBe(0);
    // NFPA 70 445.12(A) accepts the machine's inherent protection, so the damage curve is a warning, not a failure.
    const damage = stdout.split('\n').filter((line) => line.includes('damage curve'));
    expect(damage.length).toBeGreaterThanOrEqual(2);
    for (const line of damage) expect(line).toMatch(/^warn\s/);
    expect(stdout).toContain('warn: a bound the checks only warn about, missed here');
  });

  it('exits 2 with one line naming the flag for an unknown or missing device', async () => {
    const unknown = await runVerb(['demo/harrowmere-overlap.json', '--device', 'X'], windowCommand);
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toMatch(/^--device: expected one of R-T1, MAIN, .*, got "X"\n$/);
    const missing = await runVerb(['demo/harrowmere-overlap.json'], windowCommand);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/^--device: expected a device id, got nothing\n$/);
  });
});
