import { describe, expect, it } from 'vitest';
import { defaultMarginRule, marginRuleOf } from '../../../src/engine/checks/margins.ts';
import { readFileSync } from 'node:fs';
import { createStudySchema, readStudy } from '../../../src/engine/study/index.ts';

const settings = createStudySchema().shape.coordination.parse(undefined);

describe('marginRuleOf', () => {
  it('has the expected defaults', () => {
    expect(settings).toEqual({
      thinMargin: 0.1,
      halfCycle: 0.01,
      horizon: 1000,
      margins: {},
      pairs: [],
      fuseRatio: 0.75,
      codeSelectivity: 'full-range',
      edition: '2023',
      sensitivity: { maxTime: 2 },
    });
  });

  it('uses 0.12 s relay over relay: the IEEE 242 ch. 15 digital-relay CTI less the breaker time already in the band (from memory)', () => {
    expect(defaultMarginRule('relay', 'relay').margin).toBe(0.12);
  });

  it('uses the fuse–fuse 75 % rule with no added margin (common practice)', () => {
    expect(defaultMarginRule('fuse', 'fuse')).toMatchObject({ margin: 0, timeRatio: 0.75 });
  });

  it('takes a fuse above a relay or an LV breaker at the same fraction of its minimum melting, for preloading (common practice)', () => {
    // A fuse's minimum-melting curve is drawn at 25 °C and no load; a loaded fuse melts sooner.
    expect(defaultMarginRule('fuse', 'relay')).toMatchObject({ margin: 0.1, timeRatio: 0.75 });
    expect(defaultMarginRule('fuse', 'trip-unit')).toMatchObject({ margin: 0, timeRatio: 0.75 });
    expect(defaultMarginRule('fuse', 'thermal-magnetic', 0.9)).toMatchObject({ margin: 0, timeRatio: 0.9 });
    expect(defaultMarginRule('fuse', 'trip-unit').basis).toMatch(/75 % for preloading/);
  });

  it('asks LV breaker bands only not to overlap, since each includes tolerance and clearing (common practice)', () => {
    expect(defaultMarginRule('trip-unit', 'thermal-magnetic')).toMatchObject({ margin: 0, timeRatio: 1 });
    expect(defaultMarginRule('thermal-magnetic', 'fuse')).toMatchObject({ margin: 0, timeRatio: 1 });
  });

  it('takes the device margin first, then the study margin for the pair kind', () => {
    const study = { ...settings, margins: { 'relay/trip-unit': 0.3 } };
    expect(marginRuleOf('relay', 'trip-unit', study).margin).toBe(0.3);
    expect(marginRuleOf('relay', 'trip-unit', study, 0.25).margin).toBe(0.25);
    expect(marginRuleOf('relay', 'trip-unit', study).basis).toMatch(/set in the study/);
  });

  it('rejects a margin key that is not a pair kind, and a negative margin, naming the field', () => {
    const demo = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
    const withMargins = (margins: object) => readStudy({ ...demo, coordination: { margins } }).problems[0];
    expect(withMargins({ 'relay/recloser': 0.2 })).toEqual({
      path: 'study.coordination.margins["relay/recloser"]',
      message: 'expected a pair kind such as "relay/fuse", got "relay/recloser"',
    });
    expect(withMargins({ 'relay/fuse': -0.1 }).path).toBe('study.coordination.margins["relay/fuse"]');
    expect(withMargins({ 'relay/fuse': -0.1 }).message).toMatch(/^expected a value of at least 0, got "-0.1"$/);
  });
});

describe('coordination.pairs', () => {
  const demo = () => JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));

  it('sets the margin of one series pair, overriding every other rule', () => {
    const study = readStudy({
      ...demo(),
      coordination: { pairs: [{ upstream: 'MAIN', downstream: 'FDR-MCC', margin: '6 cycles' }] },
    }).study!;
    expect(
      marginRuleOf('trip-unit', 'trip-unit', study.coordination, 0.3, { upstream: 'MAIN', downstream: 'FDR-MCC' }),
    ).toMatchObject({
      margin: 0.1,
      basis: '0.1 s set in the study for this pair',
    });
    expect(
      marginRuleOf('trip-unit', 'trip-unit', study.coordination, undefined, {
        upstream: 'MAIN',
        downstream: 'FDR-DOCK',
      }).margin,
    ).toBe(0);
  });

  it('rejects a pair that names no device, or two devices that are not in series, naming the field', () => {
    const problem = (pairs: object[]) => readStudy({ ...demo(), coordination: { pairs } }).problems[0];
    expect(problem([{ upstream: 'NOPE', downstream: 'FDR-MCC', margin: 0.2 }])).toEqual({
      path: 'study.coordination.pairs[0].upstream',
      message: 'expected the id of a device, got "NOPE"',
    });
    expect(problem([{ upstream: 'R-T1', downstream: 'FDR-MCC', margin: 0.2 }])).toEqual({
      path: 'study.coordination.pairs[0].upstream',
      message: 'expected the device just above FDR-MCC, got "R-T1"',
    });
  });
});
