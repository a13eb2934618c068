import { describe, expect, it } from 'vitest';
import { logTicks, tickLabel } from '../../src/plot/ticks.ts';

describe('logTicks', () => {
  it('has the expected defaults', () => {
    const ticks = logTicks({ domain: [0.01, 1000], range: [650, 50] });
    // Five decades of 1–9 plus the closing 1000: 46 lines, six of them decades.
    expect(ticks).toHaveLength(46);
    expect(ticks.filter((t) => t.major).map((t) => t.value)).toEqual([0.01, 0.1, 1, 10, 100, 1000]);
  });

  it('logTicks gives exact decimals for the 2–9 lines below one', () => {
    const values = logTicks({ domain: [0.01, 0.1], range: [0, 1] }).map((t) => t.value);
    expect(values).toEqual([0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08, 0.09, 0.1]);
  });

  it('logTicks keeps only the lines inside a domain that does not start on a decade', () => {
    const values = logTicks({ domain: [300, 2000], range: [0, 1] }).map((t) => t.value);
    expect(values).toEqual([300, 400, 500, 600, 700, 800, 900, 1000, 2000]);
  });
});

describe('tickLabel', () => {
  it('tickLabel prints plain decimals and groups thousands from 10 000', () => {
    expect([0.01, 0.1, 1, 10, 1000, 10_000, 100_000, 1_000_000].map(tickLabel)).toEqual([
      '0.01',
      '0.1',
      '1',
      '10',
      '1000',
      '10 000',
      '100 000',
      '1 000 000',
    ]);
  });
});
