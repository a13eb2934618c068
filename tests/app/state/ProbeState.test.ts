import { describe, it, expect } from 'vitest';
import { ProbeState } from '../../../src/app/state/ProbeState.svelte.ts';

describe('ProbeState', () => {
  it('has the expected defaults', () => {
    const probe = new ProbeState();
    expect(probe.amps).toBeUndefined();
    expect(probe.pinned).toEqual([]);
  });

  it('moveTo() follows the pointer and ignores currents that cannot be on a log axis', () => {
    const probe = new ProbeState();
    probe.moveTo(12_000);
    expect(probe.amps).toBe(12_000);
    probe.moveTo(-1);
    expect(probe.amps).toBeUndefined();
    probe.moveTo(NaN);
    expect(probe.amps).toBeUndefined();
  });

  it('pin(), unpin() and clear() keep the pinned probes in order, each once', () => {
    const probe = new ProbeState();
    probe.moveTo(1000);
    probe.pin();
    probe.pin(20_000);
    probe.pin(1000);
    expect(probe.pinned).toEqual([1000, 20_000]);
    probe.unpin(1000);
    expect(probe.pinned).toEqual([20_000]);
    probe.clear();
    expect(probe.pinned).toEqual([]);
    expect(probe.amps).toBeUndefined();
  });
});
