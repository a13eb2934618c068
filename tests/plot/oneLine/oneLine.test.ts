import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy, type Analysis } from '../../../src/engine/analysis.ts';
import { analyseScenarios } from '../../../src/engine/scenario/index.ts';
import { readStudy, type Study } from '../../../src/engine/study/index.ts';
import { boxesOverlap } from '../../../src/plot/geometry.ts';
import {
  oneLineBaseOf,
  oneLineDefaults,
  oneLineOf,
  oneLineWithMarks,
  sameOneLineBase,
  type OneLine,
} from '../../../src/plot/oneLine/index.ts';
import { AnalysisMemo } from '../../../src/engine/incremental.ts';
import { readEditableStudy, readStudyEdit, type EditableReading } from '../../../src/engine/study/readStudyEdit.ts';
import { withValueAt } from '../../../src/app/lib/documentPath.ts';
import { svgOf } from '../../../src/plot/svg.ts';
import { reportPagesOf } from '../../../src/report/reportPages.ts';
import { studyReportOf } from '../../../src/report/studyReport.ts';

function demo(name: string): Study {
  const { study, problems } = readStudy(readFileSync(`demo/${name}.json`, 'utf8'));
  if (!study) throw new Error(problems.map((p) => `${p.path}: ${p.message}`).join('; '));
  return study;
}

// Accepts a demo with scenarios; each scenario's energised trees, analysed, by scenario label.
function scenarioTrees(name: string): Map<string, Analysis[]> {
  const { scenarios } = analyseScenarios(demo(name));
  return new Map(scenarios!.map((s) => [s.label, s.parts]));
}

// Accepts a diagram, an element id and a label's role; the lines of its label, as drawn.
function labelOf(diagram: OneLine, id: string, role = 'one-line-label'): string[] {
  return diagram.layers
    .find((layer) => layer.name === 'diagram')!
    .items.flatMap((item) => (item.type === 'text' && item.dataId === id && item.role === role ? [item.text] : []));
}

// Accepts a diagram and an element id; the path data of its symbol's strokes.
function symbolPaths(diagram: OneLine, id: string): string[] {
  return diagram.layers
    .find((layer) => layer.name === 'diagram')!
    .items.flatMap((item) =>
      item.type === 'path' && item.dataId === id && item.role === 'one-line-branch' ? [item.d] : [],
    );
}

/** The ids of everything a one-line diagram draws of a study: its source, buses, branches, motors and devices. */
function elementIdsOf(study: Study): string[] {
  return [
    study.source.id,
    ...study.buses.map((b) => b.id),
    ...study.transformers.map((t) => t.id),
    ...study.cables.map((c) => c.id),
    ...study.motors.map((m) => m.id),
    ...study.devices.map((d) => d.id),
  ];
}

describe('oneLineOf', () => {
  it('has the expected defaults', () => {
    expect(oneLineDefaults.fontSize).toBe(11);
    expect(oneLineDefaults.fontFamily).toMatch(/^DejaVu Sans/);
    expect(oneLineDefaults.maxWidth).toBe(1400);
  });

  for (const name of ['harrowmere-full', 'harrowmere-selective', 'harrowmere-overlap']) {
    it(`draws every element of ${name} once, within the widest a diagram may be, and no two symbols or labels overlap, continuation bars' too`, () => {
      const study = demo(name);
      const diagram = oneLineOf(analyseStudy(study));
      const ids = diagram.places.map((place) => place.id).sort();
      expect(ids).toEqual(elementIdsOf(study).sort());
      expect(diagram.width).toBeLessThanOrEqual(oneLineDefaults.maxWidth);
      const boxes = [
        ...diagram.places.flatMap((place) => [
          { id: place.id, what: 'label', box: place.label },
          ...(place.type === 'bus' ? [] : [{ id: place.id, what: 'symbol', box: place.symbol }]),
        ]),
        ...diagram.continuations.map((place) => ({ id: place.id, what: 'continued label', box: place.label })),
      ];
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

  for (const name of ['harrowmere-standby', 'harrowmere-standby-overlap'])
    it(`draws every element of each scenario's trees of ${name} once, its switches too, and no two symbols or labels overlap`, () => {
      for (const [label, trees] of scenarioTrees(name))
        for (const tree of trees) {
          const { study } = tree;
          const diagram = oneLineOf(tree);
          const switches = label === 'On generator' ? ['ATS'] : ['ATS', 'TIE'];
          expect(diagram.places.map((place) => place.id).sort(), label).toEqual(
            [...elementIdsOf(study), ...switches].sort(),
          );
          const boxes = diagram.places.flatMap((place) => [
            place.label,
            ...(place.type === 'bus' ? [] : [place.symbol]),
          ]);
          for (let i = 0; i < boxes.length; i++)
            for (let j = i + 1; j < boxes.length; j++) expect(boxesOverlap(boxes[i], boxes[j]), label).toBe(false);
        }
    });

  it("continues the whole-site demo's wide buses on bars of their own, 4386 px wide before, each bar labelled and linked", () => {
    const analysis = analyseStudy(demo('harrowmere-full'));
    const diagram = oneLineOf(analysis);
    expect(diagram.width).toBeLessThanOrEqual(oneLineDefaults.maxWidth);
    // The switchboard's four feeders, the MCC's eight motors and the dock panel's six do not fit one row.
    const continued = (id: string) => diagram.continuations.filter((place) => place.id === id);
    expect(continued('SWBD').length).toBeGreaterThan(0);
    expect(continued('MCC').length).toBeGreaterThan(0);
    expect(continued('DOCK').length).toBeGreaterThan(0);
    expect(labelOf(diagram, 'SWBD', 'one-line-continued-label')[0]).toBe('480 V main switchboard, 480 V (continued)');
    const items = diagram.layers.find((layer) => layer.name === 'diagram')!.items;
    for (const place of diagram.continuations) {
      const bar = diagram.places.find((p) => p.id === place.id)!.symbol;
      // Below its bus's own bar, starting where it starts, and reached by the dashed link down its left end.
      expect(place.symbol.y).toBeGreaterThan(bar.y);
      expect(place.symbol.x).toBe(bar.x);
      const link = items.find(
        (item) => item.type === 'path' && item.role === 'one-line-continuation' && item.dataId === place.id,
      ) as { d: string; dash?: string };
      const [x, y0, , y1] = link.d.match(/-?[\d.]+/g)!.map(Number);
      expect(link.dash).toBeDefined();
      expect(x).toBeCloseTo(bar.x + 6, 2);
      expect(y0).toBeLessThanOrEqual(bar.y + bar.height);
      expect(y1).toBeGreaterThanOrEqual(place.symbol.y - 12);
    }
    // Every branch's run starts on a bar of the bus it hangs from (its own or a continuation), within the bar.
    const { study } = analysis;
    const parentOf = new Map<string, string>([
      ...study.transformers.map((t): [string, string] => [t.id, t.from]),
      ...study.cables.map((c): [string, string] => [c.id, c.from]),
      ...study.motors.map((m): [string, string] => [m.id, m.bus]),
    ]);
    for (const [id, busId] of parentOf) {
      const run = items.find((item) => item.type === 'path' && item.role === 'one-line-run' && item.dataId === id) as {
        d: string;
      };
      const [x, top] = run.d.match(/-?[\d.]+/g)!.map(Number);
      const bars = [diagram.places.find((p) => p.id === busId)!, ...continued(busId)].map((p) => p.symbol);
      expect(
        bars.some((bar) => Math.abs(bar.y + bar.height / 2 - top) < 0.01 && x >= bar.x && x <= bar.x + bar.width),
        `${id} on ${busId}`,
      ).toBe(true);
    }
  });

  it('prints the whole-site one-line at 3.3 pt or more on a Letter portrait overview page, where in one row it printed at 1.3 pt, and its labels at 6 pt or more on the tiles after it', () => {
    const analysis = analyseStudy(demo('harrowmere-full'));
    const pages = reportPagesOf(studyReportOf(analysis), { paper: 'letter', orientation: 'portrait' });
    const placed = pages.flatMap((page) =>
      page.figure?.drawing.title?.endsWith('one-line diagram') ? [page.figure] : [],
    );
    // The overview shows it whole (3.4 pt under a one-line caption; the overview's note takes a second line).
    const [{ drawing, width, window }, ...tiles] = placed;
    expect(window).toBeUndefined();
    expect(oneLineDefaults.fontSize * (width / drawing.width)).toBeGreaterThanOrEqual(3.3);
    expect(tiles.length).toBeGreaterThan(1);
    for (const tile of tiles) expect(oneLineDefaults.fontSize * (tile.width / tile.window!.width)).toBeGreaterThan(6);
  });

  it('draws a diagram that fits, the selective demo, in one row per bus with no continuation bar', () => {
    const diagram = oneLineOf(analyseStudy(demo('harrowmere-selective')));
    expect(diagram.continuations).toEqual([]);
    const items = diagram.layers.find((layer) => layer.name === 'diagram')!.items;
    expect(items.some((item) => item.role === 'one-line-continuation')).toBe(false);
  });

  it('draws the transfer switch as one, on normal in "Normal" and on emergency "On generator", not as a closed tie', () => {
    const trees = scenarioTrees('harrowmere-standby');
    const normal = oneLineOf(trees.get('Normal')![0]);
    const generator = oneLineOf(trees.get('On generator')![0]);
    expect(labelOf(normal, 'ATS')).toEqual(['Emergency transfer switch', 'transfer switch on normal, from ATS-N']);
    expect(labelOf(generator, 'ATS')).toEqual([
      'Emergency transfer switch',
      'transfer switch on emergency, from ATS-E',
    ]);
    // Three contacts (load, side in use, idle side) where a tie has two, and the idle side's lead.
    expect(symbolPaths(normal, 'ATS').join('').match(/A/g)).toHaveLength(6);
    expect(symbolPaths(normal, 'ATS')).toHaveLength(3);
  });

  it('draws the normally open tie open under the office primary in "Normal", and closed with the dock on the office feeder', () => {
    const trees = scenarioTrees('harrowmere-standby');
    const normal = oneLineOf(trees.get('Normal')![0]);
    expect(labelOf(normal, 'TIE')).toEqual(['Dock–office tie (normally open)', 'tie, open, to DOCK']);
    // The blade, hinged at the upper contact, swings 8 px clear of the run: M x,y−5 L x+8,y+4.
    const [, blade] = symbolPaths(normal, 'TIE');
    const [x0, y0, x1, y1] = blade.match(/-?[\d.]+/g)!.map(Number);
    expect([x1 - x0, y1 - y0]).toEqual([8, 9]);
    // It hangs from the office transformer primary bus, whose bar spans its run.
    const bar = normal.places.find((p) => p.id === 'OFC-P')!.symbol;
    const tie = normal.places.find((p) => p.id === 'TIE')!.symbol;
    expect(tie.x + tie.width / 2).toBeGreaterThan(bar.x);
    expect(tie.x + tie.width / 2).toBeLessThan(bar.x + bar.width);
    expect(tie.y).toBeGreaterThan(bar.y);

    const tied = oneLineOf(trees.get('Dock on the office feeder')![0]);
    expect(labelOf(tied, 'TIE')).toEqual(['Dock–office tie (normally open)', 'tie, closed']);
    const [, closedBlade] = symbolPaths(tied, 'TIE');
    const [cx0, , cx1] = closedBlade.match(/-?[\d.]+/g)!.map(Number);
    expect(cx1).toBe(cx0);
  });

  it("draws a transfer switch's idle side open on the tree that feeds it: both sources in, ATS on emergency", () => {
    const study = demo('harrowmere-standby');
    const both = { id: 'both', name: 'Both', sources: ['UTIL', 'G1'], switches: { ATS: 'emergency' as const } };
    const [utility, generator] = analyseScenarios({
      ...study,
      scenarios: [{ ...both, outOfService: [] }],
    }).scenarios![0].parts.map((tree) => oneLineOf(tree));
    // The utility still reaches ATS-N, whose contact the switch has left.
    expect(labelOf(utility, 'ATS')).toEqual([
      'Emergency transfer switch',
      'transfer switch on emergency, normal side open',
    ]);
    expect(labelOf(generator, 'ATS')).toEqual([
      'Emergency transfer switch',
      'transfer switch on emergency, from ATS-E',
    ]);
  });

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

describe("a diagram's base, kept across an edit that changes only findings", () => {
  // As the workbench reads and analyses an edit: the reading keeps what the edit left alone, and the
  // memo keeps the fault levels while the network is the same.
  const memo = new AnalysisMemo();
  const first = readEditableStudy(JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8')));
  const analysed = (reading: EditableReading) => analyseStudy(reading.study!, memo);
  const edited = (path: (string | number)[], value: unknown) =>
    readStudyEdit(first, withValueAt(first.document, path, value));
  const before = analysed(first);
  const marksOf = (diagram: OneLine) => diagram.layers.find((layer) => layer.name === 'findings')!.items;

  it('draws, with the marks of the findings put on its base, exactly what oneLineOf draws', () => {
    expect(svgOf(oneLineWithMarks(oneLineBaseOf(before), before.findings))).toBe(svgOf(oneLineOf(before)));
  });

  it("keeps the base after a setting edit, and the kept base with the new findings' marks is the diagram drawn afresh", () => {
    // The MCC feeder's short-time delay brought down from 0.2 to 0.1 s.
    const after = analysed(edited(['devices', 2, 'characteristic', 'shortTime', 'delay'], 0.1));
    expect(after.faults).toBe(before.faults);
    expect(sameOneLineBase(before, after)).toBe(true);
    const drawnAfresh = oneLineOf(after);
    // The edit changes which elements a failing or warning finding concerns: the marks are not those of before.
    expect(marksOf(drawnAfresh)).not.toEqual(marksOf(oneLineOf(before)));
    expect(svgOf(oneLineWithMarks(oneLineBaseOf(before), after.findings))).toBe(svgOf(drawnAfresh));
  });

  it('draws a new base when a label changes (a name, a rating) or the network does', () => {
    for (const [path, value] of [
      [['devices', 1, 'name'], 'Main breaker'],
      [['devices', 1, 'rating'], '1600 A'],
      [['name'], 'Another study'],
      [['buses', 0, 'name'], 'Incoming'],
    ] as const) {
      const after = analysed(edited([...path], value));
      expect(sameOneLineBase(before, after), path.join('.')).toBe(false);
    }
  });
});
