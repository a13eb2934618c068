import { describe, expect, it } from 'vitest';
import { freeDeviceId, templateChoices } from '../../../src/app/lib/templates.ts';

describe('templateChoices', () => {
  it('has the expected defaults: every template of curves/, each with its family', () => {
    const choices = templateChoices();
    expect(choices.length).toBeGreaterThan(10);
    expect(new Set(choices.map((c) => c.family))).toEqual(new Set(['relay', 'trip-unit', 'thermal-magnetic', 'fuse']));
  });

  it('carries each fuse and breaker template’s rating, the 65 A medium-voltage fuse included', () => {
    const choices = templateChoices();
    expect(choices.find((c) => c.id === 'fuse-illustrative-mv-power-65')?.rating).toBe('65 A');
    for (const c of choices.filter((t) => t.family !== 'relay')) expect(c.rating, c.id).toMatch(/^\d+ A$/);
  });

  it('freeDeviceId names a new device after the element it feeds', () => {
    expect(freeDeviceId(['D-T1'], 'T1')).toBe('D-T1-2');
  });
});
