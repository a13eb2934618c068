/** Runs a task later; the returned function cancels it if it has not run yet. */
export type Scheduler = (task: () => void) => () => void;

/** The window functions {@link idleScheduler} uses (so tests can pass their own). */
export interface IdleHost {
  requestIdleCallback?: (task: () => void, options?: { timeout: number }) => number;
  cancelIdleCallback?: (handle: number) => void;
  setTimeout: (task: () => void, ms: number) => unknown;
  clearTimeout: (handle: never) => void;
}

/**
 * A scheduler for the next idle moment: `requestIdleCallback` with a deadline of `timeoutMs`, so
 * the task waits for a quiet moment but never longer than that; where the browser has no idle
 * callbacks, a short timer stands in.
 *
 * @example const cancel = idleScheduler(window)(() => keepStudy()) // runs once the page is idle
 */
export function idleScheduler(host: IdleHost, timeoutMs = 250): Scheduler {
  return (task) => {
    if (typeof host.requestIdleCallback === 'function') {
      const handle = host.requestIdleCallback(task, { timeout: timeoutMs });
      return () => host.cancelIdleCallback?.(handle);
    }
    const handle = host.setTimeout(task, Math.min(timeoutMs, 50));
    return () => host.clearTimeout(handle as never);
  };
}
