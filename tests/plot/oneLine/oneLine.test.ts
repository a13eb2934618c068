import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { readStudy, type Study } from '../../../src/engine/study/index.ts';
import { boxesOverlap } from '../../../src/plot/geometry.ts';
import { oneLineDefaults, oneLineOf } from '../../../src/plot/oneLine/index.ts';
import { svgOf } from '../../../src/plot/svg.ts';

function demo(name: string): Study {
  const { study, problems } = readStudy(readFileSync(`demo/${name}.json`, 'utf8'));
  if (!study) throw new Error(problems.map((p) => `${p.path}: ${p.message}`).join('; '));
  return study;
}

describe('oneLineOf', () => {
  it('has the expected defaults', () => {
    expect(oneLineDefaults.fontSize).toBe(11);
    expect(oneLineDefaults.fontFamily).toMatch(/^DejaVu Sans/);
  });

  for (const name of ['harrowmere-full', 'harrowmere-selective', 'harrowmere-overlap']) {
    it(`draws every element of ${name} once, and no two symbols or labels overlap`, () => {
      const study = demo(name);
      const diagram = oneLineOf(analyseStudy(study));
      const ids = diagram.places.map((place) => place.id).sort();
      const expected = [
        study.source.id,
        ...study.buses.map((b) => b.id),
        ...study.transformers.map((t) => t.id),
        ...study.cables.map((c) => c.id),
        ...study.motors.map((m) => m.id),
        ...study.devices.map((d) => d.id),
      ].sort();
      expect(ids).toEqual(expected);
      const boxes = diagram.places.flatMap((place) => [
        { id: place.id, what: 'label', box: place.label },
        ...(place.type === 'bus' ? [] : [{ id: place.id, what: 'symbol', box: place.symbol }]),
      ]);
      const clashes: string[] = [];
      for (let i = 0; i < boxes.length; i++)
        for (let j = i + 1; j < boxes.length; j++)
          if (boxesOverlap(boxes[i].box, boxes[j].box))
            clashes.push(`${boxes[i].id} ${boxes[i].what} × ${boxes[j].id} ${boxes[j].what}`);
      expect(clashes).toEqual([]);
      for (const { box } of boxes) {
        expect(box.x).toBeGreaterThanOrEqual(0);
        expect(box.x + box.width).toBeLessThanOrEqual(diagram.width);
        expect(box.y + box.height).toBeLessThanOrEqual(diagram.height);
      }
    });
  }

  it('labels each bus with its maximum and minimum three-phase fault', () => {
    const analysis = analyseStudy(demo('harrowmere-selective'));
    const svg = svgOf(oneLineOf(analysis));
    for (const bus of analysis.study.buses) {
      const fault = analysis.faults.buses.get(bus.id)!;
      if (!Number.isFinite(fault.max.threePhase)) continue;
      expect(svg).toMatch(
        new RegExp(`data-role="one-line-bus-label" data-id="${bus.id}">3φ fault [^<]+ max, [^<]+ min<`),
      );
    }
  });

  it('marks a failing element with a triangle as well as a colour', () => {
    const analysis = analyseStudy(demo('harrowmere-fused'));
    const failing = new Set(analysis.findings.filter((f) => f.severity === 'fail').flatMap((f) => f.subjects));
    expect(failing.size).toBeGreaterThan(0);
    const marks = oneLineOf(analysis).layers.find((layer) => layer.name === 'findings')!.items;
    for (const id of failing) {
      const shapes = marks.filter((item) => item.dataId === id && item.type === 'path');
      expect(shapes.length, id).toBeGreaterThan(0);
      expect((shapes[0] as { d: string }).d).toMatch(/Z$/);
      expect(marks.some((item) => item.dataId === id && item.type === 'text' && item.text === '!')).toBe(true);
    }
  });

  it('is deterministic and lays out a 150-level chain without recursion', () => {
    const buses = Array.from({ length: 151 }, (_, i) => ({ id: `B${i}`, voltage: 480 }));
    const cables = Array.from({ length: 150 }, (_, i) => ({
      id: `C${i}`,
      from: `B${i}`,
      to: `B${i + 1}`,
      size: '4/0',
      length: 10,
    }));
    const { study } = readStudy({
      discern: 1,
      name: 'Deep chain',
      source: { kind: 'infinite', id: 'S', bus: 'B0' },
      buses,
      cables,
    });
    const analysis = analyseStudy(study!);
    const first = svgOf(oneLineOf(analysis));
    expect(svgOf(oneLineOf(analysis))).toBe(first);
    expect(oneLineOf(analysis).places.filter((p) => p.type === 'bus')).toHaveLength(151);
  });
});
