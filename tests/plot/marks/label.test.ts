import { describe, expect, it } from 'vitest';
import { labelDefaults, labelItems, labelSize, type LabelSpec } from '../../../src/plot/marks/label.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

const spec: LabelSpec = {
  id: 'A',
  dataId: 'MAIN',
  text: 'MAIN',
  colour: '#E69F00',
  size: 11,
  anchor: [100, 100],
  candidates: [],
};

describe('labelItems', () => {
  it('has the expected defaults', () => {
    expect(labelDefaults).toEqual({ padX: 2, padY: 1, backdropOpacity: 0.85, leaderWidth: 0.9 });
    const { width, height } = labelSize('MAIN', 11);
    expect(width).toBeCloseTo(textWidth('MAIN', 11) + 4, 12);
    expect(height).toBeCloseTo(11 * 1.17 + 2, 12);
  });

  it('labelSize turns the box of text that reads upward', () => {
    const flat = labelSize('SWBD 28.4 kA @ 480 V', 10);
    const upward = labelSize('SWBD 28.4 kA @ 480 V', 10, 'normal', -90);
    expect([upward.width, upward.height]).toEqual([flat.height, flat.width]);
  });

  it('labelItems draws a backdrop, the text in its box, and a leader only when the label moved away', () => {
    const box = { x: 50, y: 40, width: 40, height: 14.87 };
    const near = labelItems(spec, { id: 'A', box, leader: null }, {});
    expect(near.map((p) => p.role)).toEqual(['label-backdrop', 'label']);
    expect(near[1]).toMatchObject({ type: 'text', x: 52, text: 'MAIN', fill: '#E69F00', anchor: 'start' });
    const far = labelItems(spec, { id: 'A', box, leader: [100, 100, 90, 54.87] }, { backdrop: false });
    expect(far.map((p) => p.role)).toEqual(['label-leader', 'label']);
  });
});
