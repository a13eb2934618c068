import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { studyDeltaOf, studyWithDelta } from '../../../src/app/worker/studyDelta.ts';
import { readEditableStudy, readStudyEdit } from '../../../src/engine/study/index.ts';

const document = JSON.parse(readFileSync('demo/harrowmere-standby.json', 'utf8')) as {
  devices: { rating?: string; name?: string }[];
  buses: unknown[];
  name: string;
};
const before = readEditableStudy(document);

describe('studyDelta', () => {
  it('has the expected defaults: no changes between a study and itself', () => {
    expect(studyDeltaOf(before.study!, before.study!)).toEqual({ fields: {}, items: {} });
  });

  it('studyDeltaOf() carries only the item a setting edit changed, and the worker rebuilds the study from it', () => {
    const devices = document.devices.slice();
    devices[2] = { ...devices[2], name: 'Retuned feeder' };
    const after = readStudyEdit(before, { ...document, devices });
    const delta = studyDeltaOf(before.study!, after.study!);
    expect(delta.fields).toEqual({});
    expect(Object.keys(delta.items)).toEqual(['devices']);
    expect(delta.items.devices?.map(([i]) => i)).toEqual([2]);
    // Both sides of the thread hold their own copies: apply a cloned delta to a cloned study.
    const there = structuredClone(before.study!);
    const rebuilt = studyWithDelta(there, structuredClone(delta));
    expect(rebuilt).toEqual(after.study);
    expect(rebuilt.devices[1]).toBe(there.devices[1]);
    expect(rebuilt.buses).toBe(there.buses);
  });

  it('studyDeltaOf() sends a list whose length changed whole, and a field removed as undefined', () => {
    const withoutBus = { ...before.study!, buses: before.study!.buses.slice(1), description: undefined };
    const delta = studyDeltaOf(before.study!, withoutBus);
    expect(delta.fields.buses).toBe(withoutBus.buses);
    expect('description' in delta.fields).toBe(true);
    const rebuilt = studyWithDelta(before.study!, delta);
    expect(rebuilt.buses).toEqual(withoutBus.buses);
    expect('description' in rebuilt).toBe(false);
  });
});
