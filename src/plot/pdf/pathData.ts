/**
 * One step of a path in absolute coordinates: a move, a straight line, a cubic Bézier (control
 * points, then the end point) or a close. Every SVG path command reduces to these four.
 */
export type PathStep =
  | { op: 'M' | 'L'; x: number; y: number }
  | { op: 'C'; x1: number; y1: number; x2: number; y2: number; x: number; y: number }
  | { op: 'Z' };

/**
 * Reads SVG path data (SVG 1.1 §8.3): every command, absolute and relative — M L H V Z, cubic C/S,
 * quadratic Q/T (raised to cubics exactly) and elliptical arcs A (split into cubic Béziers of at most
 * 90° each, SVG 1.1 Appendix F.6). After a close, the next drawing command starts again from the
 * subpath's start with an explicit move, as SVG reads it. Malformed data ends the path where it stops
 * making sense, as SVG renderers do.
 * @example pathStepsOf('M0,0L10,0Z') // [{ op: 'M', x: 0, y: 0 }, { op: 'L', x: 10, y: 0 }, { op: 'Z' }]
 */
export function pathStepsOf(d: string): PathStep[] {
  // Any letter is a command, so an unknown one ends the path instead of being skipped.
  const tokens = d.match(/[a-zA-Z]|[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/g) ?? [];
  const steps: PathStep[] = [];
  // Path data must open with a move (SVG 1.1 §8.3.2); anything else draws nothing.
  if (tokens[0] !== 'M' && tokens[0] !== 'm') return steps;
  let [x, y, startX, startY] = [0, 0, 0, 0];
  // The last control point, for the smooth forms S and T.
  let [cubicX, cubicY, quadX, quadY] = [NaN, NaN, NaN, NaN];
  let closed = false;
  let command = '';
  let i = 0;
  const more = () => i < tokens.length && !/^[a-zA-Z]$/.test(tokens[i]);
  const take = () => Number(tokens[i++]);
  const flag = () => {
    // Arc flags may run together with what follows ("0 1,0" or "011"): take one digit.
    const token = tokens[i];
    if (
      token.length > 1 &&
      (token[0] === '0' || token[0] === '1') &&
      !token.startsWith('0.') &&
      !token.startsWith('1.')
    ) {
      tokens[i] = token.slice(1);
      return token[0] === '1';
    }
    i++;
    return token !== '0';
  };
  const reopen = () => {
    if (closed) steps.push({ op: 'M', x, y });
    closed = false;
  };
  const cubic = (x1: number, y1: number, x2: number, y2: number, ex: number, ey: number) => {
    reopen();
    steps.push({ op: 'C', x1, y1, x2, y2, x: ex, y: ey });
    [cubicX, cubicY, x, y] = [x2, y2, ex, ey];
  };
  const quadratic = (qx: number, qy: number, ex: number, ey: number) => {
    cubic(x + (2 / 3) * (qx - x), y + (2 / 3) * (qy - y), ex + (2 / 3) * (qx - ex), ey + (2 / 3) * (qy - ey), ex, ey);
    [quadX, quadY] = [qx, qy];
  };
  try {
    while (i < tokens.length) {
      if (/^[a-zA-Z]$/.test(tokens[i])) command = tokens[i++];
      else if (command === '' || command === 'Z' || command === 'z') break;
      const relative = command === command.toLowerCase();
      const [ox, oy] = relative ? [x, y] : [0, 0];
      const wasCubic = 'CcSs'.includes(command);
      const wasQuadratic = 'QqTt'.includes(command);
      switch (command.toUpperCase()) {
        case 'M': {
          [x, y] = [ox + take(), oy + take()];
          [startX, startY, closed] = [x, y, false];
          steps.push({ op: 'M', x, y });
          // Further pairs after a move are lines (SVG 1.1 §8.3.2).
          command = relative ? 'l' : 'L';
          break;
        }
        case 'L':
          reopen();
          [x, y] = [ox + take(), oy + take()];
          steps.push({ op: 'L', x, y });
          break;
        case 'H':
          reopen();
          x = (relative ? x : 0) + take();
          steps.push({ op: 'L', x, y });
          break;
        case 'V':
          reopen();
          y = (relative ? y : 0) + take();
          steps.push({ op: 'L', x, y });
          break;
        case 'C':
          cubic(ox + take(), oy + take(), ox + take(), oy + take(), ox + take(), oy + take());
          break;
        case 'S': {
          const [x1, y1] = Number.isNaN(cubicX) ? [x, y] : [2 * x - cubicX, 2 * y - cubicY];
          cubic(x1, y1, ox + take(), oy + take(), ox + take(), oy + take());
          break;
        }
        case 'Q':
          quadratic(ox + take(), oy + take(), ox + take(), oy + take());
          break;
        case 'T': {
          const [qx, qy] = Number.isNaN(quadX) ? [x, y] : [2 * x - quadX, 2 * y - quadY];
          quadratic(qx, qy, ox + take(), oy + take());
          break;
        }
        case 'A': {
          const [rx, ry, rotation] = [take(), take(), take()];
          const [large, sweep] = [flag(), flag()];
          const [ex, ey] = [ox + take(), oy + take()];
          reopen();
          for (const c of arcCubics(x, y, rx, ry, rotation, large, sweep, ex, ey)) cubic(...c);
          break;
        }
        case 'Z':
          steps.push({ op: 'Z' });
          [x, y, closed] = [startX, startY, true];
          break;
        default:
          i = tokens.length;
      }
      if (Number.isNaN(x) || Number.isNaN(y)) throw new RangeError('incomplete');
      if (!wasCubic || 'Zz'.includes(command)) [cubicX, cubicY] = [NaN, NaN];
      if (!wasQuadratic) [quadX, quadY] = [NaN, NaN];
      if ('Zz'.includes(command) && more()) break;
    }
  } catch {
    // A command short of numbers: keep what was drawn before it.
    while (steps.length > 0 && hasNaN(steps[steps.length - 1])) steps.pop();
  }
  return steps;
}

// Accepts a step; true when any of its numbers is missing.
function hasNaN(step: PathStep): boolean {
  return Object.values(step).some((v) => typeof v === 'number' && Number.isNaN(v));
}

type Cubic = [number, number, number, number, number, number];

// Accepts an SVG arc from (x1, y1); cubic Béziers of at most 90° each, by the centre parametrisation of
// SVG 1.1 Appendix F.6.5 (radii scaled up when too small, F.6.6). A zero radius is a straight line.
function arcCubics(
  x1: number,
  y1: number,
  rxIn: number,
  ryIn: number,
  degrees: number,
  large: boolean,
  sweep: boolean,
  x2: number,
  y2: number,
): Cubic[] {
  if (x1 === x2 && y1 === y2) return [];
  let [rx, ry] = [Math.abs(rxIn), Math.abs(ryIn)];
  if (rx === 0 || ry === 0) return [[x1, y1, x2, y2, x2, y2]];
  const phi = (degrees * Math.PI) / 180;
  const [cos, sin] = [Math.cos(phi), Math.sin(phi)];
  const dx = (x1 - x2) / 2;
  const dy = (y1 - y2) / 2;
  const px = cos * dx + sin * dy;
  const py = -sin * dx + cos * dy;
  const lambda = (px * px) / (rx * rx) + (py * py) / (ry * ry);
  if (lambda > 1) [rx, ry] = [rx * Math.sqrt(lambda), ry * Math.sqrt(lambda)];
  const numerator = rx * rx * ry * ry - rx * rx * py * py - ry * ry * px * px;
  const root = Math.sqrt(Math.max(0, numerator / (rx * rx * py * py + ry * ry * px * px)));
  const sign = large === sweep ? -1 : 1;
  const cpx = (sign * root * rx * py) / ry;
  const cpy = (-sign * root * ry * px) / rx;
  const cx = cos * cpx - sin * cpy + (x1 + x2) / 2;
  const cy = sin * cpx + cos * cpy + (y1 + y2) / 2;
  const angle = (ux: number, uy: number, vx: number, vy: number) => Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy);
  const theta = angle(1, 0, (px - cpx) / rx, (py - cpy) / ry);
  let delta = angle((px - cpx) / rx, (py - cpy) / ry, (-px - cpx) / rx, (-py - cpy) / ry);
  if (!sweep && delta > 0) delta -= 2 * Math.PI;
  if (sweep && delta < 0) delta += 2 * Math.PI;

  const pieces = Math.ceil(Math.abs(delta) / (Math.PI / 2) - 1e-9);
  const step = delta / pieces;
  // Control arm length for a unit circle arc of `step` radians.
  const k = (4 / 3) * Math.tan(step / 4);
  const point = (t: number): [number, number] => {
    const [ex, ey] = [rx * Math.cos(t), ry * Math.sin(t)];
    return [cos * ex - sin * ey + cx, sin * ex + cos * ey + cy];
  };
  const tangent = (t: number): [number, number] => {
    const [ex, ey] = [-rx * Math.sin(t), ry * Math.cos(t)];
    return [cos * ex - sin * ey, sin * ex + cos * ey];
  };
  const cubics: Cubic[] = [];
  for (let n = 0; n < pieces; n++) {
    const [a, b] = [theta + n * step, theta + (n + 1) * step];
    const [ax, ay] = point(a);
    const [bx, by] = n === pieces - 1 ? [x2, y2] : point(b);
    const [tax, tay] = tangent(a);
    const [tbx, tby] = tangent(b);
    cubics.push([ax + k * tax, ay + k * tay, bx - k * tbx, by - k * tby, bx, by]);
  }
  return cubics;
}
