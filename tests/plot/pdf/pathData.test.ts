import { describe, expect, it } from 'vitest';
import { pathStepsOf, type PathStep } from '../../../src/plot/pdf/pathData.ts';

// Accepts steps; the end points they visit, rounded to 1e-6 for comparison.
const ends = (steps: PathStep[]) =>
  steps.map((s) => (s.op === 'Z' ? 'Z' : `${s.op}${Number(s.x.toFixed(6))},${Number(s.y.toFixed(6))}`));

// Accepts a cubic's start and step and a parameter; the point on the curve.
function bezier(x0: number, y0: number, c: Extract<PathStep, { op: 'C' }>, t: number): [number, number] {
  const u = 1 - t;
  return [
    u * u * u * x0 + 3 * u * u * t * c.x1 + 3 * u * t * t * c.x2 + t * t * t * c.x,
    u * u * u * y0 + 3 * u * u * t * c.y1 + 3 * u * t * t * c.y2 + t * t * t * c.y,
  ];
}

describe('pathStepsOf', () => {
  it('has the expected defaults: the polylines pathOf writes, moves, lines and closes as they are', () => {
    expect(pathStepsOf('M0,0L10,5L10,0Z')).toEqual([
      { op: 'M', x: 0, y: 0 },
      { op: 'L', x: 10, y: 5 },
      { op: 'L', x: 10, y: 0 },
      { op: 'Z' },
    ]);
    expect(pathStepsOf('')).toEqual([]);
  });

  it('pathStepsOf reads relative commands, H and V, implicit lines after a move, and exponents', () => {
    expect(ends(pathStepsOf('m10 10 5 0 h5 v-5 H0 V1e1 l-2.5.5z'))).toEqual([
      'M10,10',
      'L15,10',
      'L20,10',
      'L20,5',
      'L0,5',
      'L0,10',
      'L-2.5,10.5',
      'Z',
    ]);
  });

  it('pathStepsOf starts again from the subpath start after a close, with an explicit move', () => {
    expect(ends(pathStepsOf('M1,1L5,1Z L5,5'))).toEqual(['M1,1', 'L5,1', 'Z', 'M1,1', 'L5,5']);
  });

  it('pathStepsOf raises a quadratic to the cubic with the same curve, and reflects T and S control points', () => {
    // Q from (0,0) via (10,10) to (20,0): the cubic's controls sit 2/3 of the way to the quadratic's (SVG 1.1 §8.3.7).
    const [, q, t] = pathStepsOf('M0,0Q10,10 20,0T40,0');
    const controls = (step: PathStep) => (step.op === 'C' ? [step.x1, step.y1, step.x2, step.y2, step.x, step.y] : []);
    controls(q).forEach((v, i) => expect(v).toBeCloseTo([20 / 3, 20 / 3, 40 / 3, 20 / 3, 20, 0][i], 12));
    // T reflects (10,10) about (20,0) to (30,−10).
    controls(t).forEach((v, i) => expect(v).toBeCloseTo([20 + 20 / 3, -20 / 3, 40 - 20 / 3, -20 / 3, 40, 0][i], 12));
    const [, , s] = pathStepsOf('M0,0C0,10 10,10 10,0S20,-10 20,0');
    expect(s.op === 'C' && [s.x1, s.y1]).toEqual([10, -10]);
  });

  it('pathStepsOf turns a circle drawn as two arcs into four quarter cubics that stay on the circle', () => {
    // symbols.ts's circle: centre (50, 40), radius 10, two half arcs with the large-arc flag.
    const steps = pathStepsOf('M40,40A10,10 0 1,0 60,40A10,10 0 1,0 40,40Z');
    expect(steps.map((s) => s.op)).toEqual(['M', 'C', 'C', 'C', 'C', 'Z']);
    let [x, y] = [40, 40];
    let worst = 0;
    for (const step of steps) {
      if (step.op !== 'C') continue;
      for (let t = 0; t <= 1; t += 0.125) {
        const [px, py] = bezier(x, y, step, t);
        worst = Math.max(worst, Math.abs(Math.hypot(px - 50, py - 40) - 10));
      }
      [x, y] = [step.x, step.y];
    }
    // A quarter circle as one cubic strays at most 0.027 % of the radius (common practice, k = 4/3·tan(θ/4)).
    expect(worst).toBeLessThan(10 * 3e-4);
    // Sweep 0 from the left point goes through the bottom in y-down pixels: (50, 50) first.
    expect(ends(steps)[1]).toBe('C50,50');
  });

  it('pathStepsOf follows the sweep and large-arc flags, flags run together, and scales up radii too small', () => {
    // The small arc over the top (sweep 1 in y-down pixels turns clockwise on screen: up and over).
    const [, over] = pathStepsOf('M0,0A5,5 0 0 1 10,0');
    expect(over.op === 'C' && over.y1).toBeLessThan(0);
    // Flags written as "01" and a radius of 1 for a 10 px chord: scaled to 5, a half circle over the top.
    const under = pathStepsOf('M0,0A1,1 0 0110,0');
    expect(under).toHaveLength(3);
    expect(ends(under).slice(1)).toEqual(['C5,-5', 'C10,0']);
    // A zero radius is a straight line; an arc to where it starts draws nothing.
    expect(ends(pathStepsOf('M0,0A0,5 0 0 1 10,0'))).toEqual(['M0,0', 'C10,0']);
    expect(ends(pathStepsOf('M0,0A5,5 0 0 1 0,0'))).toEqual(['M0,0']);
  });

  it('pathStepsOf keeps what is drawn before malformed data and draws nothing without a first move', () => {
    expect(ends(pathStepsOf('M0,0L10,0L5'))).toEqual(['M0,0', 'L10,0']);
    expect(pathStepsOf('L10,0')).toEqual([]);
    expect(ends(pathStepsOf('M0,0L10,0X5,5'))).toEqual(['M0,0', 'L10,0']);
  });
});
