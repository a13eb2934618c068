/**
 * The rule every breaker family holds its two times to: the opening time (its fastest operation) no later
 * than the clearing time (its latest clearing at high current). Adds the issue at `openingTime` to `ctx`
 * (a schema's refinement context), naming the clearing time.
 *
 * @example z.superRefine((breaker, ctx) => requireOpeningBeforeClearing(breaker, ctx))
 */
export function requireOpeningBeforeClearing(
  breaker: { openingTime: number; clearingTime: number },
  ctx: { addIssue(issue: { code: 'custom'; path: string[]; message: string }): void },
): void {
  if (breaker.openingTime > breaker.clearingTime) {
    ctx.addIssue({
      code: 'custom',
      path: ['openingTime'],
      message: `expected an opening time no later than the clearing time ${breaker.clearingTime} s, got "${breaker.openingTime}"`,
    });
  }
}
