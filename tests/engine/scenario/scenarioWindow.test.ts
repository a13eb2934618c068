import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { proposeSettings, settingWindowOf } from '../../../src/engine/window/index.ts';

const standby = () => parseStudy(readFileSync('demo/harrowmere-standby-overlap.json', 'utf8'));

describe('setting windows and proposals in a switched study', () => {
  it("works out the generator breaker's window on the generator's tree", () => {
    const window = settingWindowOf(standby(), 'GEN-CB', { maps: false });
    expect(window.adjustable).toBe(true);
    // Its one device below on the generator is the fan breaker, held to it on the steady and on the
    // decaying current; as the breaker nearest the machine it is also read against the armature's
    // damage curve (NFPA 70 445.12(A)), which at its present 480 A long-time pickup (1.33 × the 361 A
    // rating) it does not clear below: as in the full check, a warning (the machine's inherent
    // protection may cover it), so allowed but not clean.
    const ids = window.constraints.map((c) => c.id);
    expect(ids).toEqual(expect.arrayContaining(['below:EM-BR', 'decrement-below:EM-BR', 'withstand:G1']));
    const armature = window.constraints.find((c) => c.id === 'withstand:G1')!.result;
    expect([armature.ok, armature.clean]).toEqual([true, false]);
    expect(window.settings.some((s) => s.intervals.length > 0)).toBe(true);
    const labels = JSON.stringify(window);
    expect(labels).toContain('Exhaust fan breaker 50 A');
  });

  it('refuses a scenario in which the device is not energised, naming the device', () => {
    expect(() => settingWindowOf(standby(), 'MAIN', { scenario: 'on-generator' })).toThrow(
      /^device: expected a device energised in scenario "on-generator", got "MAIN"/,
    );
  });

  it('proposes scenario by scenario: the main in "Normal", the generator breaker in "On generator"', () => {
    const proposal = proposeSettings(standby());
    expect(proposal.order).toContain('MAIN');
    expect(proposal.order).toContain('GEN-CB');
    expect(proposal.order.indexOf('GEN-CB')).toBeGreaterThan(proposal.order.indexOf('MAIN'));
    expect(proposal.orderRule).toMatch(/scenario by scenario/);
    // Every device is kept; only settings change.
    expect(proposal.study.devices.map((d) => d.id)).toEqual(standby().devices.map((d) => d.id));
  });
});
