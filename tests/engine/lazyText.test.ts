import { describe, expect, it } from 'vitest';
import { sharedBuilders, withLazyFields, withLazyText } from '../../src/engine/lazyText.ts';

describe('withLazyText', () => {
  it('builds a sentence on first read only, and keeps it', () => {
    let built = 0;
    const finding = withLazyText(
      { id: 'coordination:A/B', explanation: '' },
      {
        explanation: () => `built ${++built}`,
      },
    );
    expect(built).toBe(0);
    expect(finding.explanation).toBe('built 1');
    expect(finding.explanation).toBe('built 1');
    expect(built).toBe(1);
  });

  it('reads as plain data: key order, JSON, structured cloning and deep equality', () => {
    const finding = withLazyText(
      { id: 'x', explanation: '', suggestion: '', basis: 'IEEE 242' },
      { explanation: () => 'because', suggestion: () => 'raise the dial' },
    );
    const plain = { id: 'x', explanation: 'because', suggestion: 'raise the dial', basis: 'IEEE 242' };
    expect(Object.keys(finding)).toEqual(['id', 'explanation', 'suggestion', 'basis']);
    expect(JSON.stringify(finding)).toBe(JSON.stringify(plain));
    expect(structuredClone(finding)).toStrictEqual(plain);
    expect(finding).toEqual(plain);
  });

  it('lets an assignment replace a sentence, built or not, on that object alone', () => {
    const make = () => withLazyText({ explanation: '' }, { explanation: () => 'built' });
    const [first, second] = [make(), make()];
    first.explanation = 'edited';
    expect(first.explanation).toBe('edited');
    expect(second.explanation).toBe('built');
  });

  it('gives a builder the object it builds for, so one builder serves many findings', () => {
    type Titled = { title: string; explanation: string };
    const explanation = (finding: Titled) => `${finding.title}: the upstream device may open first.`;
    const [a, b] = ['MAIN over F1', 'MAIN over F2'].map((title) => withLazyText<Titled>({ title }, { explanation }));
    expect(b.explanation).toBe('MAIN over F2: the upstream device may open first.');
    expect(a.explanation).toBe('MAIN over F1: the upstream device may open first.');
  });
});

describe('withLazyFields', () => {
  it('adds a new field last, and a second call on the same object keeps the first one lazy', () => {
    let steps = 0;
    const bus = withLazyFields(
      withLazyFields({ busId: 'SWBD' } as Record<string, unknown>, { work: () => [++steps] }),
      { steps: () => ['impedance'] },
    );
    expect(Object.keys(bus)).toEqual(['busId', 'work', 'steps']);
    expect(steps).toBe(0);
    expect(JSON.parse(JSON.stringify(bus))).toEqual({ busId: 'SWBD', work: [1], steps: ['impedance'] });
    expect(bus.work).toBe(bus.work);
  });
});

describe('sharedBuilders', () => {
  type Interval = { id: string; range: string; explanation: string };
  const FIELDS = sharedBuilders({
    range: (finding: Interval) => `range of ${finding.id}`,
    // Reads another lazy field of the same object first.
    explanation: (finding: Interval) => `${finding.id} over ${finding.range}`,
  });
  const make = (id: string) => withLazyText<Interval>({ id }, FIELDS);

  it('serves many objects, each keeping its own values, whichever field is read first', () => {
    const [a, b] = [make('A'), make('B')];
    expect(b.explanation).toBe('B over range of B');
    expect(a.range).toBe('range of A');
    expect(a.explanation).toBe('A over range of A');
    expect(make('C')).toEqual({ id: 'C', range: 'range of C', explanation: 'C over range of C' });
  });

  it('lets an assignment change one object alone, and leaves the shared set as it was', () => {
    const [a, b] = [make('A'), make('B')];
    a.explanation = 'edited';
    expect(a.explanation).toBe('edited');
    expect(b.explanation).toBe('B over range of B');
    expect(Object.isFrozen(FIELDS)).toBe(true);
    expect(typeof FIELDS.explanation).toBe('function');
  });

  it('adds more fields to an object made with shared builders without changing the others', () => {
    const [a, b] = [make('A'), make('B')];
    withLazyFields(a, { work: () => ['step'] });
    expect(Object.keys(a)).toEqual(['id', 'range', 'explanation', 'work']);
    expect(Object.keys(b)).toEqual(['id', 'range', 'explanation']);
    expect(b.explanation).toBe('B over range of B');
  });
});
