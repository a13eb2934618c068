import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import {
  darkItemsOf,
  flattenTree,
  keptRowsOf,
  rowsOf,
  scenarioRowsOf,
  switchText,
  systemRowsOf,
  systemTreeOf,
  treeItemsOf,
} from '../../../src/app/lib/systemTree.ts';
import { scenarioViewOf } from '../../../src/app/lib/scenarioParts.ts';
import { scenariosOf } from '../../../src/engine/scenario/index.ts';
import { newStudyDocument } from '../../../src/app/lib/newItems.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy, readEditableStudy, readStudyEdit, type StudyInput } from '../../../src/engine/study/index.ts';
import { withValueAt } from '../../../src/app/lib/documentPath.ts';

const demo = JSON.parse(
  readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'),
) as StudyInput;
const network = networkOf(parseStudy(demo));

describe('systemTree', () => {
  it('has the expected defaults', () => {
    const tree = systemTreeOf(networkOf(parseStudy(newStudyDocument())));
    expect(tree).toMatchObject({ kind: 'source', id: 'UTIL', detail: 'utility, 250 MVA available' });
    expect(tree.children.map((c) => [c.kind, c.id, c.detail])).toEqual([['bus', 'BUS-1', '12.47 kV']]);
  });

  it('systemTreeOf() walks from the source down, each element with the device feeding it', () => {
    const tree = systemTreeOf(network);
    expect(tree.detail).toBe('utility, 250 MVA available');
    const mv = tree.children[0];
    expect(mv).toMatchObject({ kind: 'bus', id: 'MV', detail: '12.47 kV' });
    const t1 = mv.children.find((c) => c.id === 'T1')!;
    expect(t1.detail).toBe('1.5 MVA, 12.47 kV–480 V, 5.75 %Z');
    expect(t1.device?.id).toBe('R-T1');
    expect(t1.children[0]).toMatchObject({ kind: 'bus', id: 'SWBD' });
    expect(t1.children[0].device?.id).toBe('MAIN');
  });

  it('flattenTree() lists every bus, branch and motor once, in reading order', () => {
    const ids = flattenTree(systemTreeOf(network)).map((n) => n.id);
    const expected = [demo.source.id, ...demo.buses.map((b) => b.id), ...(demo.transformers ?? []).map((t) => t.id)];
    for (const id of expected) expect(ids.filter((x) => x === id)).toHaveLength(1);
    expect(ids.indexOf('MV')).toBeLessThan(ids.indexOf('SWBD'));
    expect(ids).toHaveLength(
      1 +
        demo.buses.length +
        (demo.transformers ?? []).length +
        (demo.cables ?? []).length +
        (demo.motors ?? []).length,
    );
  });

  it('systemRowsOf() lists the rows in reading order with their depth below the source', () => {
    const rows = systemRowsOf(network);
    expect(rows.slice(0, 4).map((r) => `${r.depth} ${r.node.kind} ${r.node.id}`)).toEqual([
      '0 source UTIL',
      '1 bus MV',
      '2 transformer T1',
      '3 bus SWBD',
    ]);
    expect(rows.map((r) => r.node)).toEqual(flattenTree(systemTreeOf(network)));
  });

  it('a study 5,000 levels deep builds whole (no call-stack limit)', () => {
    const buses = [{ id: 'B0', voltage: '480 V' }];
    const cables = [];
    for (let i = 1; i <= 5000; i++) {
      buses.push({ id: `B${i}`, voltage: '480 V' });
      cables.push({ id: `C${i}`, from: `B${i - 1}`, to: `B${i}`, size: '4/0', length: '1 ft' });
    }
    const deep = parseStudy({
      discern: 1,
      name: 'Deep',
      source: { kind: 'infinite', id: 'U', bus: 'B0' },
      buses,
      cables,
    });
    const rows = systemRowsOf(networkOf(deep));
    expect(rows).toHaveLength(1 + 5001 + 5000);
    expect(rows.at(-1)).toMatchObject({ depth: 10_001, node: { kind: 'bus', id: 'B5000' } });
  });
});

describe('systemTree rows kept across edits', () => {
  const withMainPickup = (pickup: number) => {
    const edited = structuredClone(demo);
    const main = edited.devices!.find((d) => d.id === 'MAIN')!;
    (main.characteristic as { longTime: { pickup: unknown } }).longTime.pickup = pickup;
    return systemRowsOf(networkOf(parseStudy(edited)));
  };

  it('keptRowsOf() hands back the rows already drawn when an edit changes only a setting', () => {
    const before = systemRowsOf(network);
    const after = systemRowsOf(networkOf(parseStudy(demo)));
    expect(after).not.toBe(before);
    expect(keptRowsOf(after, before)).toBe(before);
    expect(keptRowsOf(withMainPickup(0.9), before)).toBe(before);
    expect(keptRowsOf(after, undefined)).toBe(after);
  });

  it('keptRowsOf() takes the new row where it reads differently, and keeps every other row', () => {
    const before = systemRowsOf(network);
    const edited = structuredClone(demo);
    edited.buses = edited.buses!.map((b) => (b.id === 'MCC' ? { ...b, name: 'Motor control centre' } : b));
    const kept = keptRowsOf(systemRowsOf(networkOf(parseStudy(edited))), before);
    expect(kept).not.toBe(before);
    const changed = kept.filter((row, i) => row !== before[i]);
    expect(changed.map((r) => r.node.label)).toEqual(['Motor control centre']);
  });

  it('systemRowsOf() after an edit of a device setting hands back the rows it laid out before', () => {
    const reading = readEditableStudy(demo);
    const before = systemRowsOf(networkOf(reading.study!));
    const index = demo.devices!.findIndex((d) => d.id === 'MAIN');
    const edited = readStudyEdit(reading, withValueAt(demo, ['devices', index, 'name'], 'Main breaker'));
    const named = systemRowsOf(networkOf(edited.study!));
    const drawn = (rows: typeof before) =>
      rows.map(({ node, depth }) => ({
        depth,
        id: node.id,
        label: node.label,
        detail: node.detail,
        device: node.device,
      }));
    // Only the renamed device's row is new, and the rows read as a fresh layout of the edited study.
    expect(named.filter((row, i) => row !== before[i]).map((r) => r.node.device?.label)).toEqual(['Main breaker']);
    expect(drawn(named)).toEqual(drawn(rowsOf(systemTreeOf(networkOf(edited.study!)))));
    // A setting the tree does not show changes no row.
    const retuned = readStudyEdit(edited, withValueAt(edited.document, ['devices', index, 'margin'], '0.3 s'));
    expect(retuned.study?.devices[index].margin).toBe(0.3);
    expect(systemRowsOf(networkOf(retuned.study!))).toBe(named);
    // The rows drawn from a layout are handed back as they are when the same layout comes again.
    const drawnRows = keptRowsOf(named, before);
    expect(drawnRows).not.toBe(named);
    expect(keptRowsOf(named, drawnRows)).toBe(drawnRows);
  });

  it('treeItemsOf() lists the device of a row before its element, on the same level', () => {
    const rows = systemRowsOf(network);
    const items = treeItemsOf(rows);
    expect(items).toHaveLength(rows.length + rows.filter((r) => r.node.device).length);
    const swbd = items.findIndex((item) => item.key === 'bus:SWBD');
    expect(items[swbd - 1]).toEqual({ key: 'device:MAIN', rowKey: 'bus:SWBD', level: 4 });
    expect(items[swbd]).toEqual({ key: 'bus:SWBD', rowKey: 'bus:SWBD', level: 4 });
  });
});

describe('systemTree in a scenario', () => {
  const standby = parseStudy(
    readFileSync(new URL('../../../demo/harrowmere-standby-overlap.json', import.meta.url), 'utf8'),
  );
  const [normal, onGenerator, tieClosed] = scenariosOf(standby);
  const ats = standby.switches.find((s) => s.id === 'ATS')!;
  const tie = standby.switches.find((s) => s.id === 'TIE')!;

  it('switchText() says the kind of switch and its position in the scenario', () => {
    expect(switchText(ats, normal)).toBe('transfer switch, on the normal side (ATS-N)');
    expect(switchText(ats, onGenerator)).toBe('transfer switch, on the emergency side (ATS-E)');
    expect(switchText(ats, { ...normal, switches: { ATS: 'open' } })).toBe('transfer switch, open');
    expect(switchText(tie, normal)).toBe('tie, open');
    expect(switchText(tie, tieClosed)).toBe('tie, closed');
  });

  it('scenarioRowsOf() draws the generator as the source of its tree, the transfer switch on its emergency side', () => {
    const rows = scenarioRowsOf(standby, scenarioViewOf(standby, onGenerator));
    expect(rows[0]).toMatchObject({ depth: 0, node: { kind: 'generator', id: 'G1' } });
    expect(rows[0].node.detail).toBe('generator, 300 kVA, 480 V');
    const atsRow = rows.find((r) => r.node.id === 'ATS')!;
    expect(atsRow.node).toMatchObject({ kind: 'switch', detail: 'transfer switch, on the emergency side (ATS-E)' });
    expect(rows.map((r) => r.node.id)).not.toContain('SWBD');
  });

  it('scenarioRowsOf() of the normal scenario is the utility tree, the transfer switch on its normal side', () => {
    const rows = scenarioRowsOf(standby, scenarioViewOf(standby, normal));
    expect(rows[0].node).toMatchObject({ kind: 'source', id: 'UTIL' });
    expect(rows.find((r) => r.node.id === 'ATS')?.node.detail).toBe('transfer switch, on the normal side (ATS-N)');
    expect(rows.map((r) => r.node.id)).not.toContain('G1');
  });

  it('darkItemsOf() lists the sources out of service, the dark buses, what is switched out and the open switches', () => {
    const onGen = darkItemsOf(standby, scenarioViewOf(standby, onGenerator));
    expect(onGen.map((d) => `${d.kind} ${d.id}`)).toEqual([
      'source UTIL',
      'bus MV',
      'bus SWBD',
      'bus MCC',
      'bus DOCK',
      'bus OFC-P',
      'bus OFC',
      'bus ATS-N',
      'switch TIE',
    ]);
    const tied = darkItemsOf(standby, scenarioViewOf(standby, tieClosed));
    expect(tied.map((d) => `${d.kind} ${d.id} ${d.detail}`)).toEqual([
      'generator G1 not in service',
      'bus GEN 480 V, de-energised',
      'bus ATS-E 480 V, de-energised',
      'cable C-DOCK out of service',
    ]);
  });
});
