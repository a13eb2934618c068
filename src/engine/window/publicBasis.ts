/**
 * A margin rule's basis as users may read it: the study's margin rules note which numbers were
 * recalled rather than looked up; user-facing text names the published source only.
 *
 * @example publicBasis('0.2 s relay over a trip-unit band (IEEE 242 ch. 15, relay over fuse or LV breaker, from memory)')
 *   // '0.2 s relay over a trip-unit band (IEEE 242 ch. 15, relay over fuse or LV breaker)'
 */
export function publicBasis(basis: string): string {
  return basis
    .replace(/\s*\(from memory\)/g, '')
    .replace(/[,;]\s*from memory/g, '')
    .replace(/REFERENCE §[\d.]+,?\s*/g, '')
    .replace(/\(\s*\)/g, '')
    .replace(/\(\s*,\s*/g, '(')
    .trim();
}
