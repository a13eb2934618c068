import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { cachedBandOf } from '../../src/engine/bandCache.ts';
import { checkPair } from '../../src/engine/checks/coordination.ts';
import { characteristicSchema } from '../../src/engine/devices/characteristic.ts';
import { faultLevelsOf } from '../../src/engine/fault/index.ts';
import { networkOf, seriesPairs } from '../../src/engine/network/index.ts';
import { findOverlaps, type OverlapOptions } from '../../src/engine/overlap.ts';
import { rememberedOverlaps, type OverlapMemo } from '../../src/engine/overlapMemo.ts';
import { parseStudy } from '../../src/engine/study/index.ts';
import { radialStudy } from '../../bench/radialStudy.ts';

// Invented settings (illustrative): a 2000 A LSI main over an 800 A LSI feeder, IEEE 1015 trip-unit practice.
const main = cachedBandOf(
  characteristicSchema.parse({
    kind: 'trip-unit',
    sensor: 2000,
    longTime: { pickup: 1, delay: 10 },
    shortTime: { pickup: 4, delay: 0.3 },
  }),
);
const feeder = cachedBandOf(
  characteristicSchema.parse({
    kind: 'trip-unit',
    sensor: 800,
    longTime: { pickup: 1, delay: 4 },
    instantaneous: { pickup: 10 },
  }),
);

describe('rememberedOverlaps', () => {
  it('answers as the finder does, and gives the same answer again to the same question', () => {
    const memo: OverlapMemo = new Map();
    const options: OverlapOptions = { toAmps: 30_000, margin: 0.1 };
    const first = rememberedOverlaps(memo, main, feeder, options);
    expect(first).toEqual(findOverlaps(main, feeder, options));
    expect(rememberedOverlaps(memo, main, feeder, { toAmps: 30_000, margin: 0.1 })).toBe(first);
  });

  it('asks the finder again when any option, band or the top current differs', () => {
    const memo: OverlapMemo = new Map();
    const options: OverlapOptions = { toAmps: 30_000, margin: 0.1, timeRatio: 1, horizon: 1000 };
    const first = rememberedOverlaps(memo, main, feeder, options);
    const others: [OverlapOptions, typeof main, typeof feeder][] = [
      [{ ...options, toAmps: 20_000 }, main, feeder],
      [{ ...options, margin: 0.3 }, main, feeder],
      [{ ...options, timeRatio: 0.75 }, main, feeder],
      [{ ...options, horizon: 100 }, main, feeder],
      [{ ...options, fromAmps: 5000 }, main, feeder],
      [{ ...options, thinMargin: 0.2 }, main, feeder],
      [options, feeder, main],
    ];
    for (const [changed, up, down] of others) {
      const answer = rememberedOverlaps(memo, up, down, changed);
      expect(answer).not.toBe(first);
      expect(answer).toEqual(findOverlaps(up, down, changed));
    }
  });
});

describe('pair checks within one analysis', () => {
  it('give every pair of a study with many identical feeders what checking it alone gives', () => {
    const study = parseStudy(radialStudy(300));
    const analysis = analyseStudy(study);
    const network = networkOf(study);
    const context = { network, faults: faultLevelsOf(network), bands: analysis.bands };
    const alone = seriesPairs(network).map((pair) => checkPair(context, pair, study.coordination).check);
    expect(analysis.pairs).toEqual(alone);
  });
});
