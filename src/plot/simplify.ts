/**
 * Drops the points of a polyline (interleaved pixels `[x0, y0, x1, y1, …]`) that lie within
 * `tolerance` px of the line through their kept neighbours (Ramer–Douglas–Peucker). End points and
 * corners (a pickup's vertical edge, a segment join) are kept, so the shape is unchanged to the eye
 * while a smooth curve sampled once per pixel column shrinks to a few dozen points.
 * @example simplifyPolyline(new Float64Array([0, 0, 1, 1, 2, 2, 3, 0]), 0.1) // Float64Array [0, 0, 2, 2, 3, 0]
 */
export function simplifyPolyline(points: Float64Array, tolerance = 0.1): Float64Array {
  const n = points.length / 2;
  if (n <= 2) return points;
  const keep = new Uint8Array(n);
  keep[0] = 1;
  keep[n - 1] = 1;
  const stack: [number, number][] = [[0, n - 1]];
  while (stack.length > 0) {
    const [first, last] = stack.pop()!;
    let worst = -1;
    let worstDistance = tolerance;
    for (let i = first + 1; i < last; i++) {
      const d = distanceToSegment(points, i, first, last);
      if (d > worstDistance) {
        worstDistance = d;
        worst = i;
      }
    }
    if (worst < 0) continue;
    keep[worst] = 1;
    stack.push([first, worst], [worst, last]);
  }
  let count = 0;
  for (let i = 0; i < n; i++) count += keep[i];
  const out = new Float64Array(count * 2);
  for (let i = 0, j = 0; i < n; i++) {
    if (!keep[i]) continue;
    out[j++] = points[2 * i];
    out[j++] = points[2 * i + 1];
  }
  return out;
}

// Accepts point indices into the interleaved array; distance in px from point i to segment a–b.
function distanceToSegment(p: Float64Array, i: number, a: number, b: number): number {
  const ax = p[2 * a];
  const ay = p[2 * a + 1];
  const dx = p[2 * b] - ax;
  const dy = p[2 * b + 1] - ay;
  const px = p[2 * i] - ax;
  const py = p[2 * i + 1] - ay;
  const lengthSquared = dx * dx + dy * dy;
  const t = lengthSquared === 0 ? 0 : Math.max(0, Math.min(1, (px * dx + py * dy) / lengthSquared));
  return Math.hypot(px - t * dx, py - t * dy);
}
