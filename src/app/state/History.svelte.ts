/** One remembered state and the edit that left it. */
interface Entry<T> {
  value: T;
  /** What the edit did, in plain words ("pickup of MAIN"). */
  label: string;
  /** Edits with the same key close together merge into one undo step (typing, arrow steps, drags). */
  key?: string;
  at: number;
}

/** Options for {@link History.commit}. */
export interface CommitOptions {
  /** Merge with the previous edit when it had the same key and came less than `mergeWithinMs` ago. */
  key?: string;
  /** Time of the edit in ms (the caller's clock, so the class stays testable). @default performance.now() */
  at?: number;
}

/** Edits closer than this on the same field are one undo step. */
const MERGE_WITHIN_MS = 1500;
/** The oldest states are dropped beyond this many steps. */
const DEPTH = 500;

/**
 * Undo and redo over whole immutable values (study documents). Every edit replaces `current`;
 * the previous value goes on the undo stack. Values are never mutated, so each entry shares all
 * untouched branches with its neighbours.
 *
 * @example const history = new History(study); history.commit(next, 'pickup of MAIN'); history.undo();
 */
export class History<T> {
  current: T = $state.raw() as T;
  #past: Entry<T>[] = $state.raw([]);
  #future: Entry<T>[] = $state.raw([]);

  /** True when there is an edit to undo. */
  readonly canUndo = $derived.by(() => this.#past.length > 0);
  /** True when there is an undone edit to redo. */
  readonly canRedo = $derived.by(() => this.#future.length > 0);
  /** The label of the edit `undo` would reverse. */
  readonly undoLabel = $derived.by(() => this.#past.at(-1)?.label);
  /** The label of the edit `redo` would repeat. */
  readonly redoLabel = $derived.by(() => this.#future.at(-1)?.label);

  /**
   * Told of each value as it stops being current, the value taking its place and how (an edit, an undo,
   * a redo), so what was shown with it can be kept.
   */
  onleave: ((left: T, next: T, how: 'commit' | 'undo' | 'redo') => void) | undefined;

  constructor(initial: T) {
    this.current = initial;
  }

  /** Makes `next` current, remembering the previous value (or merging with the last edit by key). */
  commit(next: T, label: string, options: CommitOptions = {}): void {
    if (next === this.current) return;
    const { key, at = performance.now() } = options;
    const last = this.#past.at(-1);
    const merge = key !== undefined && last?.key === key && at - last.at < MERGE_WITHIN_MS;
    if (merge) this.#past = [...this.#past.slice(0, -1), { ...last, at }];
    else this.#past = [...this.#past.slice(-(DEPTH - 1)), { value: this.current, label, key, at }];
    this.#future = [];
    this.onleave?.(this.current, next, 'commit');
    this.current = next;
  }

  /** Steps back one edit; does nothing when there is none. */
  undo(): void {
    const last = this.#past.at(-1);
    if (!last) return;
    this.#past = this.#past.slice(0, -1);
    this.#future = [...this.#future, { value: this.current, label: last.label, at: last.at }];
    this.onleave?.(this.current, last.value, 'undo');
    this.current = last.value;
  }

  /** Repeats the last undone edit; does nothing when there is none. */
  redo(): void {
    const next = this.#future.at(-1);
    if (!next) return;
    this.#future = this.#future.slice(0, -1);
    this.#past = [...this.#past, { value: this.current, label: next.label, at: next.at }];
    this.onleave?.(this.current, next.value, 'redo');
    this.current = next.value;
  }

  /** Starts over from `value` with no history (a new or opened file). */
  reset(value: T): void {
    this.#past = [];
    this.#future = [];
    this.current = value;
  }
}
