import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { flattenTree, systemTreeOf } from '../../../src/app/lib/systemTree.ts';
import { newStudyDocument } from '../../../src/app/lib/newItems.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';

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
});
