import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { fieldInfoAt, STUDY_JSON_SCHEMA } from '../../../src/app/lib/fieldInfo.ts';
import {
  PAIR_KINDS,
  STUDY_OPTION_GROUPS,
  optionDefault,
  pairChoices,
  startingMargin,
  startingPairMargin,
} from '../../../src/app/lib/studyOptions.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const listed = STUDY_OPTION_GROUPS.flatMap((group) => group.options.map((option) => option.path.join('.')));
const demo = JSON.parse(readFileSync('demo/harrowmere-full.json', 'utf8'));

describe('studyOptions', () => {
  it('has the expected defaults: every option of the schema offered, each once, the two margin tables aside', () => {
    const { properties } = STUDY_JSON_SCHEMA;
    const coordination = properties!.coordination.properties!;
    const expected = [
      ...Object.keys(coordination)
        .filter((key) => key !== 'margins' && key !== 'pairs' && key !== 'sensitivity')
        .map((key) => `coordination.${key}`),
      ...Object.keys(coordination.sensitivity.properties!).map((key) => `coordination.sensitivity.${key}`),
      ...Object.keys(properties!.conductorTemperatures.properties!).map((key) => `conductorTemperatures.${key}`),
    ];
    expect([...listed].sort()).toEqual(expected.sort());
    expect(new Set(listed).size).toBe(listed.length);
  });

  it("gives each option's default as the schema fills it in: seconds, °C, an edition", () => {
    const defaultAt = (...path: string[]) => optionDefault({ path, label: '' });
    expect(defaultAt('coordination', 'thinMargin')).toBe(0.1);
    expect(defaultAt('coordination', 'edition')).toBe('2023');
    expect(defaultAt('coordination', 'sensitivity', 'maxTime')).toBe(2);
    expect(defaultAt('coordination', 'sensitivity', 'arcingFactor')).toBeUndefined();
    expect(defaultAt('conductorTemperatures', 'maximumFault')).toBe(20);
    expect(defaultAt('conductorTemperatures', 'minimumFault')).toBe(90);
    const bare = { ...demo, coordination: undefined, conductorTemperatures: undefined };
    expect(fieldInfoAt(bare, ['coordination', 'edition'])).toMatchObject({ control: 'choice' });
    expect(fieldInfoAt(bare, ['conductorTemperatures', 'minimumFault'])?.control).toBe('number');
  });

  it('starts a new margin at the one the checks apply now: 0.12 s relay over relay, 0.2 s relay over LV devices (IEEE 242 ch. 15)', () => {
    expect(PAIR_KINDS).toHaveLength(16);
    expect(startingMargin('relay/relay')).toBe(0.12);
    expect(startingMargin('relay/trip-unit')).toBe(0.2);
    expect(startingMargin('trip-unit/thermal-magnetic')).toBe(0);
  });

  it('starts a margin for one pair at the one its pair is checked with now: 0.2 s relay over LV breaker (IEEE 242 ch. 15), else the study’s own', () => {
    // The full demo: relay R-T1 over the main MAIN, a series pair, with no margin set anywhere.
    expect(startingPairMargin(networkOf(parseStudy(demo)), 'R-T1', 'MAIN')).toBe(0.2);
    const ownKind = { ...demo, coordination: { margins: { 'relay/trip-unit': 0.35 } } };
    expect(startingPairMargin(networkOf(parseStudy(ownKind)), 'R-T1', 'MAIN')).toBe(0.35);
    const ownDevice = {
      ...demo,
      devices: demo.devices.map((d: { id: string }) => (d.id === 'R-T1' ? { ...d, margin: 0.4 } : d)),
    };
    expect(startingPairMargin(networkOf(parseStudy(ownDevice)), 'R-T1', 'MAIN')).toBe(0.4);
  });

  it('offers for one pair only a device with the device just above it, each pair once', () => {
    const network = networkOf(parseStudy(demo));
    const all = pairChoices(network, []);
    expect(all).toContainEqual({ upstream: 'MAIN', downstream: 'FDR-MCC' });
    expect(all.every(({ upstream, downstream }) => upstream !== downstream)).toBe(true);
    const rest = pairChoices(network, [{ upstream: 'MAIN', downstream: 'FDR-MCC' }]);
    expect(rest).toHaveLength(all.length - 1);
    expect(rest).not.toContainEqual({ upstream: 'MAIN', downstream: 'FDR-MCC' });
  });
});
