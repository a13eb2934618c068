/**
 * Whether two plain values (as read from JSON, or parsed from it) hold the same content: the same
 * fields in any order, the same items and the same values, numbers compared by `Object.is` (so 0 and
 * −0 differ, and NaN equals NaN).
 *
 * @example sameContent({ pickup: 1, delay: 4 }, { delay: 4, pickup: 1 }) // true
 */
export function sameContent(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return Object.is(a, b);
  if (Array.isArray(a) || Array.isArray(b)) {
    if (!Array.isArray(a) || !Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameContent(a[i], b[i])) return false;
    return true;
  }
  const x = a as Record<string, unknown>;
  const y = b as Record<string, unknown>;
  let fields = 0;
  for (const key in x) {
    if (!Object.hasOwn(y, key) || !sameContent(x[key], y[key])) return false;
    fields++;
  }
  for (const key in y) if (Object.hasOwn(y, key)) fields--;
  return fields === 0;
}
