import { tick } from 'svelte';
import { offsetsOf, windowRangeOf, type WindowRange } from '../lib/windowRange.ts';

/** Options of a {@link ListWindow}. */
export interface ListWindowOptions {
  /**
   * Lists of up to this many rows are drawn whole: windowing only pays when the rows are many, and a
   * short list drawn whole keeps the browser's find-in-page.
   * @default 200
   */
  drawnWhole?: number;
  /** Rows drawn beyond each edge of the visible part. @default 8 */
  overscan?: number;
  /** Pixels between rows (the rows' bottom margin), added to each measured height. @default 0 */
  gap?: number;
}

/**
 * A long list drawn only where it is on screen. Rows are measured as they are drawn (by key, so an edit
 * that reorders them keeps their heights); a row not yet drawn counts as the mean of those measured.
 * The component draws its rows from `range.start` to `range.end`, pads its list by `range.before` above and
 * `range.after` below, marks each drawn row with `data-window-key`, and calls `attach` on the list.
 *
 * @example const rows = new ListWindow(() => ['a', 'b'], { gap: 1 }); rows.range // { start: 0, end: 2, before: 0, after: 0 }
 */
export class ListWindow {
  /**
   * The rows' keys, in list order: the same array while they read the same, so a list redrawn with the
   * same rows (a large study's findings after an edit changed a few of them) lays nothing out again.
   */
  readonly keys: readonly string[] = $derived.by(() => {
    const next = this.#keysOf();
    const previous = this.#lastKeys;
    if (previous && previous.length === next.length && previous.every((key, i) => key === next[i])) return previous;
    this.#lastKeys = next;
    return next;
  });
  #keysOf: () => readonly string[];
  #lastKeys: readonly string[] | undefined;
  #top = $state(0);
  #height = $state(0);
  // Replaced whole when a height changes (never changed in place), so a plain Map is the state.
  // eslint-disable-next-line svelte/prefer-svelte-reactivity -- see above
  #heights = $state.raw(new Map<string, number>());
  #list: HTMLElement | undefined;
  #scroller: HTMLElement | undefined;
  #drawnWhole: number;
  #overscan: number;
  #gap: number;

  /** `keys` gives the rows' keys in list order (read reactively). */
  constructor(keys: () => readonly string[], options: ListWindowOptions = {}) {
    this.#keysOf = keys;
    const { drawnWhole = 200, overscan = 8, gap = 0 } = options;
    this.#drawnWhole = drawnWhole;
    this.#overscan = overscan;
    this.#gap = gap;
  }

  /** True when the list is long enough to be drawn only where it is on screen. */
  readonly windowed = $derived.by(() => this.keys.length > this.#drawnWhole);

  // Each row's top, from the measured heights and the mean of them for rows not yet drawn.
  readonly #offsets = $derived.by(() => {
    const heights = this.#heights;
    let sum = 0;
    for (const h of heights.values()) sum += h;
    const guess = heights.size > 0 ? sum / heights.size : 24;
    return offsetsOf(this.keys.map((key) => heights.get(key) ?? guess));
  });

  /** The rows to draw and the room to leave above and below them. */
  readonly range: WindowRange = $derived.by(() => {
    if (!this.windowed) return { start: 0, end: this.keys.length, before: 0, after: 0 };
    return windowRangeOf(this.#offsets, { top: this.#top, height: this.#height, overscan: this.#overscan });
  });

  /**
   * Follows the scrolling of `list`'s nearest scrolling ancestor (or `list` itself when it scrolls), for
   * use as `{@attach}`. Returns the cleanup.
   */
  attach = (list: HTMLElement): (() => void) => {
    this.#list = list;
    const scroller = scrollerOf(list);
    this.#scroller = scroller;
    const follow = () => {
      this.#top = scroller.scrollTop - this.#listTopIn(scroller);
      this.#height = scroller.clientHeight;
    };
    follow();
    scroller.addEventListener('scroll', follow, { passive: true });
    const resized = new ResizeObserver(follow);
    resized.observe(scroller);
    return () => {
      scroller.removeEventListener('scroll', follow);
      resized.disconnect();
      this.#list = this.#scroller = undefined;
    };
  };

  /** Measures the rows drawn now (call after they are drawn); heights that changed are kept. */
  measure(): void {
    const list = this.#list;
    if (!list || !this.windowed) return;
    let next: Map<string, number> | undefined;
    for (const row of list.querySelectorAll<HTMLElement>('[data-window-key]')) {
      const key = row.dataset.windowKey!;
      const height = row.getBoundingClientRect().height + this.#gap;
      if (height > 0 && Math.abs((this.#heights.get(key) ?? -1) - height) > 0.5) {
        // eslint-disable-next-line svelte/prefer-svelte-reactivity -- a copy that replaces the state whole
        next ??= new Map(this.#heights);
        next.set(key, height);
      }
    }
    if (next) this.#heights = next;
  }

  /**
   * Scrolls the list the least that brings the row of `key` into view, and resolves once it is drawn.
   * @example await rows.reveal('bus:MCC'); list.querySelector('[data-key="bus:MCC"]')?.focus();
   */
  async reveal(key: string): Promise<void> {
    const drawnRow = () => this.#list?.querySelector<HTMLElement>(`[data-window-key="${CSS.escape(key)}"]`);
    // Rows not yet drawn are only guessed at, so the first jump may land short of the row: the rows it
    // draws are measured, and the next jump lands closer.
    for (let tries = 0; tries < 8; tries++) {
      const row = drawnRow();
      if (row) {
        row.scrollIntoView({ block: 'nearest' });
        return;
      }
      const scroller = this.#scroller;
      const at = this.keys.indexOf(key);
      if (!scroller || at < 0) return;
      const offsets = this.#offsets;
      const listTop = this.#listTopIn(scroller);
      const rowTop = listTop + offsets[at];
      const rowBottom = listTop + offsets[at + 1];
      if (rowTop < scroller.scrollTop) scroller.scrollTop = rowTop;
      else if (rowBottom > scroller.scrollTop + scroller.clientHeight)
        scroller.scrollTop = rowBottom - scroller.clientHeight;
      this.#top = scroller.scrollTop - listTop;
      await tick();
    }
  }

  // Where the list starts within its scroller's content (the scroller may hold a heading above it).
  #listTopIn(scroller: HTMLElement): number {
    const list = this.#list;
    if (!list || list === scroller) return 0;
    return list.getBoundingClientRect().top - scroller.getBoundingClientRect().top + scroller.scrollTop;
  }
}

// The element that scrolls `element`: itself or its nearest ancestor with scrolling overflow.
function scrollerOf(element: HTMLElement): HTMLElement {
  for (let at: HTMLElement | null = element; at; at = at.parentElement) {
    const { overflowY } = getComputedStyle(at);
    if (overflowY === 'auto' || overflowY === 'scroll') return at;
  }
  return document.scrollingElement as HTMLElement;
}
