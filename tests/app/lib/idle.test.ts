import { describe, it, expect } from 'vitest';
import { idleScheduler, type IdleHost } from '../../../src/app/lib/idle.ts';

/** A host whose callbacks run only when the test says so. */
function fakeHost(withIdle: boolean) {
  const queued = new Map<number, () => void>();
  const asked: { kind: string; wait: number }[] = [];
  let next = 1;
  const add = (task: () => void) => {
    queued.set(next, task);
    return next++;
  };
  const host: IdleHost = {
    setTimeout: (task, ms) => (asked.push({ kind: 'timer', wait: ms }), add(task)),
    clearTimeout: (handle) => void queued.delete(handle as number),
    ...(withIdle && {
      requestIdleCallback: (task: () => void, options?: { timeout: number }) => (
        asked.push({ kind: 'idle', wait: options?.timeout ?? Infinity }),
        add(task)
      ),
      cancelIdleCallback: (handle: number) => void queued.delete(handle),
    }),
  };
  const runAll = () => {
    for (const [handle, task] of [...queued]) {
      queued.delete(handle);
      task();
    }
  };
  return { host, asked, runAll, queued };
}

describe('idleScheduler', () => {
  it('has the expected defaults: the next idle moment, at most 250 ms away', () => {
    const { host, asked, runAll } = fakeHost(true);
    let ran = 0;
    idleScheduler(host)(() => ran++);
    expect(asked).toEqual([{ kind: 'idle', wait: 250 }]);
    expect(ran).toBe(0);
    runAll();
    expect(ran).toBe(1);
  });

  it('a cancelled task never runs', () => {
    const { host, runAll } = fakeHost(true);
    let ran = 0;
    const cancel = idleScheduler(host)(() => ran++);
    cancel();
    runAll();
    expect(ran).toBe(0);
  });

  it('without idle callbacks a short timer stands in (and can be cancelled)', () => {
    const { host, asked, runAll } = fakeHost(false);
    let ran = 0;
    idleScheduler(host, 250)(() => ran++);
    idleScheduler(host, 250)(() => ran++)();
    expect(asked).toEqual([
      { kind: 'timer', wait: 50 },
      { kind: 'timer', wait: 50 },
    ]);
    runAll();
    expect(ran).toBe(1);
  });
});
