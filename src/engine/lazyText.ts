/**
 * Makes some string fields of `result` lazy: each is written by its builder the first time it is read,
 * then kept. A large study's analysis builds thousands of findings whose sentences are seldom all read
 * (the workbench shows a screenful, a report reads them once); the numbers stay eager. The fields keep
 * their place in `result`'s key order and stay enumerable, so `JSON.stringify`, structured cloning and
 * deep equality see plain strings; assigning one replaces it.
 *
 * @example const finding = withLazyText({ id: 'x', explanation: '' }, { explanation: () => explain(interval) })
 */
export function withLazyText<T extends object>(result: T, builders: { [K in keyof T]?: () => string }): T {
  for (const key of Object.keys(builders) as (keyof T & string)[]) {
    const build = builders[key]!;
    let text: string | undefined;
    Object.defineProperty(result, key, {
      enumerable: true,
      configurable: true,
      get: () => (text ??= build()),
      set: (value: string) => void (text = value),
    });
  }
  return result;
}
