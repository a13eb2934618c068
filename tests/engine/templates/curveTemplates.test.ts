import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { assertBandContract } from '../devices/bandInvariants.ts';
import { bandOf } from '../../../src/engine/band.ts';
import { INVERSE_CURVES, INVERSE_CURVE_NAMES } from '../../../src/engine/devices/inverseCurves.ts';
import {
  curveTemplateById,
  curveTemplateFileSchema,
  curveTemplates,
  readCurveTemplates,
  relayCurveSet,
  relayCurveSetSchema,
  TEMPLATE_FILES,
  tripUnitRangesSchema,
  tripUnitSettingRanges,
} from '../../../src/engine/templates/index.ts';

const curvesDir = new URL('../../../curves/', import.meta.url);
const files = readdirSync(curvesDir).filter((name) => name.endsWith('.json'));
const DATA_FILES = ['relay-curves.json', 'trip-unit-ranges.json'];

describe('curveTemplates', () => {
  it('has the expected defaults', () => {
    expect(curveTemplates.length).toBeGreaterThanOrEqual(14);
    expect(new Set(curveTemplates.map((t) => t.family))).toEqual(
      new Set(['relay', 'trip-unit', 'thermal-magnetic', 'fuse']),
    );
    expect(curveTemplateById('relay-ieee-very-inverse')?.characteristic.kind).toBe('relay');
    expect(curveTemplateById('no-such-template')).toBeUndefined();
  });

  it('every JSON file in curves/ validates against its schema and is imported', () => {
    for (const name of files) {
      const data = JSON.parse(readFileSync(new URL(name, curvesDir), 'utf8'));
      if (name === 'relay-curves.json') relayCurveSetSchema.parse(data);
      else if (name === 'trip-unit-ranges.json') tripUnitRangesSchema.parse(data);
      else {
        expect(curveTemplateFileSchema.safeParse(data).success, name).toBe(true);
        expect(TEMPLATE_FILES[name], `${name} is imported`).toEqual(data);
      }
    }
    expect(files.length).toBe(Object.keys(TEMPLATE_FILES).length + DATA_FILES.length);
  });

  it('curves/relay-curves.json holds the same constants as the code table (IEEE C37.112, IEC 60255-151)', () => {
    expect(relayCurveSet.curves.map((c) => c.id)).toEqual(INVERSE_CURVE_NAMES);
    for (const curve of relayCurveSet.curves) {
      const table = INVERSE_CURVES[curve.id as keyof typeof INVERSE_CURVES];
      expect([curve.a, curve.b, curve.p, curve.reset ?? undefined]).toEqual([table.a, table.b, table.p, table.reset]);
      expect(curve.source).toMatch(/IEEE C37\.112|IEC 60255/);
    }
  });

  it('the trip-unit ranges match the usual ranges of IEEE 1015 trip-unit practice (common practice)', () => {
    const { ranges } = tripUnitSettingRanges;
    expect([ranges.longTimePickup.min, ranges.longTimePickup.max]).toEqual([0.4, 1]);
    expect([ranges.shortTimePickup.min, ranges.shortTimePickup.max]).toEqual([1.5, 10]);
    expect([ranges.instantaneousPickup.min, ranges.instantaneousPickup.max]).toEqual([2, 15]);
  });

  it('every fuse and thermal-magnetic template is flagged and labelled illustrative, not a product', () => {
    const invented = curveTemplates.filter((t) => t.family === 'fuse' || t.family === 'thermal-magnetic');
    expect(invented.filter((t) => t.family === 'fuse').length).toBeGreaterThanOrEqual(3);
    for (const template of invented) {
      const c = template.characteristic;
      expect(c.kind !== 'relay' && c.kind !== 'trip-unit' && c.illustrative, template.id).toBe(true);
      expect(template.label, template.id).toMatch(/illustrative, not a product/);
      expect(template.note, template.id).toMatch(/illustrative, not a product/);
    }
  });

  it('every template gives a band that keeps the band contract', () => {
    for (const template of curveTemplates)
      assertBandContract(bandOf(template.characteristic), [10, 100, 1000, 1e4, 1e5]);
  });

  it('readCurveTemplates names the file and field of a bad template', () => {
    const bad = { family: 'relay', note: 'x', templates: [{ id: 'f', label: 'f', characteristic: { kind: 'fuse' } }] };
    expect(() => readCurveTemplates({ 'bad.json': bad })).toThrow(
      /^curves\/bad\.json: templates\.0\.characteristic\.minimumMelting: /,
    );
    const wrongFamily = {
      family: 'relay',
      note: 'x',
      templates: [
        { id: 'f', label: 'f', characteristic: curveTemplates.find((t) => t.family === 'fuse')!.characteristic },
      ],
    };
    expect(() => readCurveTemplates({ 'mixed.json': wrongFamily })).toThrow(
      /^curves\/mixed\.json: templates\.0\.characteristic\.kind: expected "relay" like the file's family, got "fuse"$/,
    );
  });
});
