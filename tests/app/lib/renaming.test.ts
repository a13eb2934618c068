import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { z } from 'zod/mini';
import { ELEMENT_ID_PLACES, idAfterStep, idEditOf, isId, withIdRenamed } from '../../../src/app/lib/renaming.ts';
import { STUDY_JSON_SCHEMA, type SchemaNode } from '../../../src/app/lib/fieldInfo.ts';
import { idField, readStudy, type StudyInput } from '../../../src/engine/study/index.ts';

const demoFolder = new URL('../../../demo/', import.meta.url);
const demoOf = (file: string) => JSON.parse(readFileSync(new URL(file, demoFolder), 'utf8')) as StudyInput;
const standby = demoOf('harrowmere-standby.json');

/** Every string and every record key in `value` that is exactly `id`, by where it is. */
function placesNaming(value: unknown, id: string, at = 'study'): string[] {
  if (value === id) return [at];
  if (Array.isArray(value)) return value.flatMap((item, i) => placesNaming(item, id, `${at}[${i}]`));
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([key, child]) => [
    ...(key === id ? [`${at} key`] : []),
    ...placesNaming(child, id, `${at}.${key}`),
  ]);
}

/** The element ids a document defines: the source's and every list item's but views' and scenarios'. */
function elementIdsOf(document: StudyInput): string[] {
  const lists = ['generators', 'switches', 'buses', 'transformers', 'cables', 'motors', 'devices'] as const;
  return [document.source.id, ...lists.flatMap((list) => (document[list] ?? []).map((item) => item.id))];
}

describe('renaming', () => {
  it('idAfterStep follows an item across the undo of its rename, and nothing across an addition or a deletion', () => {
    const renamed = withIdRenamed(standby, 'SWBD', 'SWBD-1');
    expect(idAfterStep(renamed, standby, 'buses', 'SWBD-1')).toBe('SWBD');
    expect(idAfterStep(standby, renamed, 'buses', 'SWBD')).toBe('SWBD-1');
    expect(idAfterStep(standby, renamed, 'buses', 'DOCK')).toBe('DOCK');
    const fewer = { ...standby, buses: standby.buses!.filter((b) => b.id !== 'DOCK') };
    expect(idAfterStep(standby, fewer, 'buses', 'DOCK')).toBeUndefined();
  });

  it('ELEMENT_ID_PLACES is every id field of the study schema but the ids of views and scenarios', () => {
    const idPattern = (z.toJSONSchema(idField) as SchemaNode & { pattern?: string }).pattern;
    const found = new Set<string>();
    const walk = (node: SchemaNode & { pattern?: string; propertyNames?: { pattern?: string } }, at: string) => {
      if (node.pattern === idPattern) found.add(at);
      if (node.propertyNames?.pattern === idPattern) found.add(`${at}{}`);
      for (const [key, child] of Object.entries(node.properties ?? {})) walk(child, at ? `${at}.${key}` : key);
      if (node.items) walk(node.items, `${at}[]`);
      for (const member of [...(node.oneOf ?? []), ...(node.anyOf ?? [])]) walk(member, at);
    };
    walk(STUDY_JSON_SCHEMA, '');
    found.delete('views[].id');
    found.delete('scenarios[].id');
    expect([...found].sort()).toEqual([...ELEMENT_ID_PLACES].sort());
  });

  it('withIdRenamed(MAIN) renames the device and its places on every sheet, sharing what it leaves alone', () => {
    const next = withIdRenamed(standby, 'MAIN', 'MAIN-2');
    expect(next.devices!.find((d) => d.name === standby.devices!.find((s) => s.id === 'MAIN')!.name)!.id).toBe(
      'MAIN-2',
    );
    expect(next.views!.find((v) => v.id === 'service')!.devices).toEqual(['R-T1', 'MAIN-2', 'FDR-MCC', 'MCC-M1']);
    expect(next.views!.find((v) => v.id === 'emergency')!.devices).toEqual(['MAIN-2', 'FDR-EM', 'EM-BR']);
    expect(readStudy(next).problems).toEqual([]);
    expect(placesNaming(next, 'MAIN')).toEqual([]);
    // What names no MAIN is the same object as before (the undo history shares it).
    expect(next.buses).toBe(standby.buses);
    expect(next.views!.find((v) => v.id === 'office')).toBe(standby.views!.find((v) => v.id === 'office'));
    expect(withIdRenamed(standby, 'MAIN', 'MAIN')).toBe(standby);
  });

  it('withIdRenamed() follows a bus, a switch, a cable and a generator into switches and scenarios', () => {
    const dock = withIdRenamed(standby, 'DOCK', 'DOCK-PNL');
    expect(dock.switches!.find((w) => w.id === 'TIE')).toMatchObject({ from: 'OFC-P', to: 'DOCK-PNL' });
    expect(dock.cables!.find((c) => c.id === 'C-DOCK')).toMatchObject({ from: 'SWBD', to: 'DOCK-PNL' });

    const ats = withIdRenamed(standby, 'ATS', 'ATS-1');
    expect(ats.scenarios!.find((s) => s.id === 'on-generator')!.switches).toEqual({ 'ATS-1': 'emergency' });

    const cable = withIdRenamed(standby, 'C-DOCK', 'C-DOCK-1');
    expect(cable.scenarios!.find((s) => s.id === 'tie-closed')!.outOfService).toEqual(['C-DOCK-1']);
    expect(cable.devices!.find((d) => d.id === 'FDR-DOCK')!.feeds).toBe('C-DOCK-1');

    const generator = withIdRenamed(standby, 'G1', 'GEN-300');
    expect(generator.scenarios!.find((s) => s.id === 'on-generator')!.sources).toEqual(['GEN-300']);
    expect(generator.views!.find((v) => v.id === 'emergency-generator')!.withstand).toEqual(['GEN-300', 'C-GEN']);

    for (const next of [dock, ats, cable, generator]) expect(readStudy(next).problems).toEqual([]);
  });

  it('withIdRenamed() keeps a switch its place among a scenario’s positions, and per-pair margins follow', () => {
    const twoSwitches = structuredClone(standby);
    twoSwitches.scenarios![1].switches = { ATS: 'emergency', TIE: 'open' };
    const next = withIdRenamed(twoSwitches, 'ATS', 'ATS-1');
    expect(Object.keys(next.scenarios![1].switches!)).toEqual(['ATS-1', 'TIE']);

    const withPair = { ...standby, coordination: { pairs: [{ upstream: 'MAIN', downstream: 'FDR-EM', margin: 0.3 }] } };
    expect(withIdRenamed(withPair, 'FDR-EM', 'FDR-EMP').coordination!.pairs).toEqual([
      { upstream: 'MAIN', downstream: 'FDR-EMP', margin: 0.3 },
    ]);
  });

  it('withIdRenamed() leaves a sheet or a scenario that shares the element’s id alone', () => {
    const sameName = structuredClone(standby);
    sameName.views![0].id = 'MAIN';
    sameName.scenarios![0].id = 'MAIN';
    const next = withIdRenamed(sameName, 'MAIN', 'MAIN-2');
    expect(next.views![0].id).toBe('MAIN');
    expect(next.scenarios![0].id).toBe('MAIN');
    expect(readStudy(next).problems).toEqual([]);
  });

  it('every element of every demo renamed leaves a study that reads with no problems and names the old id nowhere', () => {
    const demos = readdirSync(demoFolder).filter((file) => file.endsWith('.json'));
    expect(demos).toContain('harrowmere-standby.json');
    for (const file of demos) {
      const document = demoOf(file);
      for (const id of elementIdsOf(document)) {
        const next = withIdRenamed(document, id, `${id}-R`);
        expect(readStudy(next).problems, `${file}: ${id}`).toEqual([]);
        expect(placesNaming(next, id), `${file}: ${id}`).toEqual([]);
        expect(placesNaming(next, `${id}-R`).length, `${file}: ${id}`).toBe(placesNaming(document, id).length);
      }
    }
  });

  it('isId() accepts what the schema accepts as an id', () => {
    expect(isId('C-DOCK')).toBe(true);
    expect(isId('MAIN 2')).toBe(false);
    expect(isId('')).toBe(false);
    expect(isId(12)).toBe(false);
  });

  describe('idEditOf()', () => {
    const main = ['devices', standby.devices!.findIndex((d) => d.id === 'MAIN'), 'id'] as const;

    it('renames an element everywhere once the typed id is good and its own', () => {
      const edit = idEditOf(standby, main, 'MAI')!;
      expect(edit).toMatchObject({ renamed: true, wasKnownAs: 'MAIN', knownAs: 'MAI' });
      expect(readStudy(edit.document).problems).toEqual([]);
      expect(placesNaming(edit.document, 'MAIN')).toEqual([]);
    });

    it('writes a half-typed or taken id as typed, renames nothing, and remembers what the rest calls it', () => {
      const spaced = idEditOf(standby, main, 'MAIN 2')!;
      expect(spaced).toMatchObject({ renamed: false, knownAs: 'MAIN' });
      expect(spaced.document.devices![main[1]].id).toBe('MAIN 2');
      expect(spaced.document.views![0].devices).toContain('MAIN');
      expect(readStudy(spaced.document).problems.map((p) => p.path)).toContain(`study.devices[${main[1]}].id`);

      const taken = idEditOf(standby, main, 'R-T1')!;
      expect(taken).toMatchObject({ renamed: false, knownAs: 'MAIN' });
      expect(taken.document.views![0].devices).toEqual(['R-T1', 'MAIN', 'FDR-MCC', 'MCC-M1']);
    });

    it('typing on from a half-typed id renames the references from the id they still use', () => {
      const spaced = idEditOf(standby, main, 'MAIN 2')!;
      const done = idEditOf(spaced.document, main, 'MAIN-2', spaced.knownAs)!;
      expect(done).toMatchObject({ renamed: true, wasKnownAs: 'MAIN', knownAs: 'MAIN-2' });
      expect(readStudy(done.document).problems).toEqual([]);
      expect(placesNaming(done.document, 'MAIN')).toEqual([]);
      expect(placesNaming(done.document, 'MAIN 2')).toEqual([]);
    });

    it('a view’s id is renamed within the views alone; a field that is not an id is no id edit', () => {
      const view = idEditOf(standby, ['views', 0, 'id'], 'MAIN')!;
      expect(view).toMatchObject({ renamed: true, wasKnownAs: 'service', knownAs: 'MAIN' });
      expect(view.document.devices).toBe(standby.devices);
      expect(idEditOf(standby, ['views', 0, 'id'], 'primary')).toMatchObject({ renamed: false });
      expect(idEditOf(standby, ['devices', 0, 'feeds'], 'SWBD')).toBeUndefined();
      expect(idEditOf(standby, ['views', 0, 'devices', 0], 'MAIN')).toBeUndefined();
    });

    it('renames the source too, and the source bus with the bus', () => {
      const source = idEditOf(standby, ['source', 'id'], 'GRID')!;
      expect(source.renamed).toBe(true);
      expect(source.document.source.id).toBe('GRID');
      const bus = idEditOf(standby, ['buses', 0, 'id'], 'MV-1')!;
      expect(bus.document.source.bus).toBe('MV-1');
      expect(bus.document.transformers![0].from).toBe('MV-1');
      expect(readStudy(bus.document).problems).toEqual([]);
    });
  });
});
