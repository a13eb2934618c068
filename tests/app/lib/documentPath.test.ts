import { describe, it, expect } from 'vitest';
import {
  formatDocumentPath,
  valueAt,
  withItemAdded,
  withValueAt,
  withoutItemAt,
} from '../../../src/app/lib/documentPath.ts';

const study = {
  name: 'Harrowmere',
  devices: [
    { id: 'MAIN', characteristic: { kind: 'trip-unit', longTime: { pickup: 1 } } },
    { id: 'FDR-MCC', characteristic: { kind: 'trip-unit' } },
  ],
};

describe('documentPath', () => {
  it('has the expected defaults', () => {
    expect(valueAt(study, [])).toBe(study);
    expect(formatDocumentPath([])).toBe('study');
  });

  it("formatDocumentPath() names a path as the study's problems do, a key that is no plain name quoted", () => {
    expect(formatDocumentPath(['devices', 2, 'rating'])).toBe('study.devices[2].rating');
    expect(formatDocumentPath(['coordination', 'margins', 'relay/trip-unit'])).toBe(
      'study.coordination.margins["relay/trip-unit"]',
    );
  });

  it('valueAt() reads nested keys and indexes, undefined where the path leads nowhere', () => {
    expect(valueAt(study, ['devices', 0, 'characteristic', 'longTime', 'pickup'])).toBe(1);
    expect(valueAt(study, ['devices', 5, 'id'])).toBeUndefined();
    expect(valueAt(study, ['name', 'x'])).toBeUndefined();
  });

  it('withValueAt() copies only the branch it changes', () => {
    const next = withValueAt(study, ['devices', 0, 'characteristic', 'longTime', 'pickup'], 0.9);
    expect(next.devices[0].characteristic.longTime?.pickup).toBe(0.9);
    expect(study.devices[0].characteristic.longTime?.pickup).toBe(1);
    expect(next.devices[1]).toBe(study.devices[1]);
    expect(next).not.toBe(study);
  });

  it('withValueAt() removes a key when the value is undefined and creates missing objects', () => {
    expect(withValueAt({ a: 1, b: 2 }, ['b'], undefined)).toEqual({ a: 1 });
    expect(withValueAt({}, ['shortTime', 'delay'], 0.3)).toEqual({ shortTime: { delay: 0.3 } });
  });

  it('withValueAt() rejects an index beyond the end of a list, naming the path', () => {
    expect(() => withValueAt(study, ['devices', 7, 'id'], 'X')).toThrow(
      /^study\.devices\[7\]\.id: expected an index from 0 to 2, got "7"$/,
    );
  });

  it('withoutItemAt() and withItemAdded() edit lists without touching the original', () => {
    const fewer = withoutItemAt(study, ['devices', 0]);
    expect(fewer.devices.map((d) => d.id)).toEqual(['FDR-MCC']);
    const more = withItemAdded(study, ['views'], { id: 'V1' });
    expect((more as unknown as { views: unknown[] }).views).toEqual([{ id: 'V1' }]);
    expect(study.devices).toHaveLength(2);
  });

  it('withoutItemAt() rejects a path that is not a list item', () => {
    expect(() => withoutItemAt(study, ['name', 0])).toThrow(
      /^study\.name\[0\]: expected an item of a list, got "Harrowmere"$/,
    );
  });

  it('formatDocumentPath() names fields as study problems do', () => {
    expect(formatDocumentPath(['devices', 2, 'characteristic', 'pickup'])).toBe(
      'study.devices[2].characteristic.pickup',
    );
  });
});
