/** Where an object made lazy keeps its builders, each replaced by its value once built. */
const LAZY = Symbol('lazy fields');
type LazyState = Record<string, unknown>;
type WithState = { [LAZY]: LazyState };

/**
 * One accessor per field name, shared by every lazy object: the state lives on the object, so making a
 * field lazy allocates no closure, and objects made alike share their hidden class's transitions.
 */
const accessors = new Map<string, PropertyDescriptor>();
function accessorOf(key: string): PropertyDescriptor {
  let accessor = accessors.get(key);
  if (!accessor) {
    accessor = {
      enumerable: true,
      configurable: true,
      get(this: WithState) {
        const state = this[LAZY];
        const value = state[key];
        // A builder is the only function held; a built value (text, work steps) never is one.
        return typeof value === 'function' ? (state[key] = (value as () => unknown)()) : value;
      },
      set(this: WithState, value: unknown) {
        this[LAZY][key] = value;
      },
    };
    accessors.set(key, accessor);
  }
  return accessor;
}

/**
 * Makes fields of `result` lazy: each is built by its builder the first time it is read, then kept.
 * A field already in `result` keeps its place in the key order; a new one is added last. The fields
 * stay enumerable, so `JSON.stringify`, structured cloning and deep equality see plain values;
 * assigning one replaces it. `builders` is kept (not copied) and holds each value once built.
 *
 * @example withLazyFields(bus, { work: () => stepsOf(bus) }) // bus.work is built on first read
 */
export function withLazyFields<T extends object>(result: T, builders: Record<string, () => unknown>): T {
  const held = (result as Partial<WithState>)[LAZY];
  if (held) Object.assign(held, builders);
  else Object.defineProperty(result, LAZY, { value: builders, writable: true });
  for (const key in builders) Object.defineProperty(result, key, accessorOf(key));
  return result;
}

/**
 * Makes some string fields of `result` lazy (see `withLazyFields`), then adds the fields of `after`,
 * if given, behind them. A large study's analysis builds thousands of findings whose sentences are
 * seldom all read (the workbench shows a screenful, a report reads them once); the numbers stay eager.
 * Leaving the lazy fields out of `result` and giving the ones that follow them in `after` keeps the
 * key order and gives every finding made alike one compact shape.
 *
 * @example withLazyText<Finding>({ id: 'x' }, { explanation: () => explain(interval) }, { referenceVolts: 480 })
 */
export function withLazyText<T extends object>(
  result: Partial<T>,
  builders: { [K in keyof NoInfer<T>]?: () => string },
  after?: NoInfer<Partial<T>>,
): T {
  withLazyFields(result, builders as Record<string, () => string>);
  return (after ? Object.assign(result, after) : result) as T;
}
