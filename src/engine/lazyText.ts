import { Stamped } from './hiddenSlot.ts';

type LazyState = Record<string, unknown>;

/**
 * Where an object made lazy keeps its builders, each replaced by its value once built: a private field
 * stamped on the object itself (`Stamped` makes `new` add the field to the object it is given). The
 * field is invisible to keys, JSON, cloning and deep equality, and adding it is a plain store, where
 * defining a hidden property cost a runtime call per object (measured: half of making a finding lazy). A proxy does not carry private fields, so a lazy field is
 * read on the object itself, never through a deep reactive proxy (the workbench keeps results in
 * `$state.raw`; structured cloning, as to and from the worker, reads the values first).
 */
class LazyFields extends Stamped {
  #state: LazyState;
  private constructor(target: object, state: LazyState) {
    super(target);
    this.#state = state;
  }
  static stamp(target: object, state: LazyState): void {
    new LazyFields(target, state);
  }
  static heldBy(target: object): LazyState | undefined {
    return #state in target ? (target as LazyFields).#state : undefined;
  }
  static of(target: object): LazyState {
    return (target as LazyFields).#state;
  }
  /** The object's state to write to: its own, made from the shared builders it was given before its first write. */
  static writable(target: object): LazyState {
    const state = (target as LazyFields).#state;
    if (!(state instanceof SharedBuilders)) return state;
    return ((target as LazyFields).#state = { ...state });
  }
}

/**
 * Builders that many objects share (`sharedBuilders`): an object keeps the shared set, not a copy of
 * its own, until it first builds or is given a value (most of a large analysis's findings never are).
 */
class SharedBuilders {
  constructor(builders: LazyState) {
    Object.assign(this, builders);
    Object.freeze(this);
  }
}

/**
 * One set of builders for many objects made alike (module functions that find what they need from
 * the object they are given). Each object gets a copy of its own only when a field is first built or
 * assigned, so objects whose lazy fields are never read keep no state of their own.
 *
 * @example const SENTENCES = sharedBuilders({ explanation: explanationOf }) // then withLazyText(finding, SENTENCES)
 */
export function sharedBuilders<B extends Record<string, (target: never) => unknown>>(builders: B): Readonly<B> {
  return new SharedBuilders(builders) as unknown as Readonly<B>;
}

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
      get(this: object) {
        const value = LazyFields.of(this)[key];
        // A builder is the only function held; a built value (text, work steps) never is one. It is
        // given the object, so one builder can serve many objects (each keeps its own value). The
        // state is looked up again after building: a builder may read another lazy field first.
        if (typeof value !== 'function') return value;
        const built = (value as (target: object) => unknown)(this);
        LazyFields.writable(this)[key] = built;
        return built;
      },
      set(this: object, value: unknown) {
        LazyFields.writable(this)[key] = value;
      },
    };
    accessors.set(key, accessor);
  }
  return accessor;
}

/**
 * Makes fields of `result` lazy: each is built by its builder, given `result`, the first time it is
 * read, then kept.
 * A field already in `result` keeps its place in the key order; a new one is added last. Leave a lazy
 * field out of `result` where its place allows: turning a field that is there into an accessor turns
 * the whole object into a slow dictionary (several times the memory). The fields stay enumerable, so
 * `JSON.stringify`, structured cloning and deep equality see plain values; assigning one replaces it.
 * `builders` is kept (not copied) and holds each value once built; builders made by `sharedBuilders`
 * are shared, and copied for the object when it first builds a value.
 *
 * @example withLazyFields(bus, { work: () => stepsOf(bus) }) // bus.work is built on first read
 */
export function withLazyFields<T extends object, B extends Record<string, (target: T) => unknown>>(
  result: T,
  builders: B,
): T & { [K in keyof B]: ReturnType<B[K]> } {
  if (LazyFields.heldBy(result)) Object.assign(LazyFields.writable(result), builders);
  else LazyFields.stamp(result, builders);
  for (const key in builders) Object.defineProperty(result, key, accessorOf(key));
  return result as T & { [K in keyof B]: ReturnType<B[K]> };
}

/**
 * Makes some fields of `result` lazy (see `withLazyFields`), then adds the fields of `after`, if
 * given, behind them. A large study's analysis builds thousands of findings whose sentences and
 * ranges are seldom all read (the workbench shows a screenful, a report reads them once).
 * Leaving the lazy fields out of `result` and giving the ones that follow them in `after` keeps the
 * key order and gives every finding made alike one compact shape.
 *
 * @example withLazyText<Finding>({ id: 'x' }, { explanation: () => explain(interval) }, { referenceVolts: 480 })
 */
export function withLazyText<T extends object>(
  result: Partial<T>,
  builders: { [K in keyof NoInfer<T>]?: (target: NoInfer<T>) => NoInfer<T>[K] },
  after?: NoInfer<Partial<T>>,
): T {
  withLazyFields(result, builders as Record<string, (target: Partial<T>) => unknown>);
  return (after ? Object.assign(result, after) : result) as T;
}
