import type { Network } from '../../engine/network/index.ts';
import type { Device } from '../../engine/study/index.ts';
import { addToList } from '../../engine/addToList.ts';

/**
 * One vertical run of the one-line diagram, from a bus (or the source) down to what it feeds: the
 * device feeding the element, the element itself (transformer, cable, switch, motor or the source),
 * the device feeding the child bus directly (a main), then the child bus.
 */
export interface Drop {
  /** The element the run carries: a transformer, cable, switch or motor id, or the source id for the top run. */
  elementId: string;
  kind: 'source' | 'transformer' | 'cable' | 'switch' | 'motor';
  /** The device whose `feeds` is the element. */
  feeder?: Device;
  /** The device whose `feeds` is the child bus (a main). */
  main?: Device;
  /** The bus at the bottom of the run; none for a motor or a switch drawn open. */
  childBus?: string;
  /** For a switch drawn open: the bus its run hangs from and the bus across it. */
  open?: OpenSwitch;
  /** Depth of the child bus (the source bus is 0); a motor sits at its bus's depth + 1. */
  depth: number;
  /** Left edge of the run's column and its width (px); the run's line is at `x + gutter`. */
  x: number;
  width: number;
  /**
   * Top of the run, in the unit of {@link OneLineLayoutOptions.levelHeight}: the source's run at 0, and
   * in a diagram that never wraps `depth × levelHeight`.
   */
  top: number;
  /** Which bar of its parent bus the run hangs from: 0 the bus's own, 1 its first continuation, … */
  barRow: number;
}

/** Text of one run's labels, measured by the caller (px). */
export type MeasureDrop = (drop: Omit<Drop, 'x' | 'width' | 'top' | 'barRow'>) => number;

/** A switch that connects nothing in the drawn network (an open tie, a transfer switch's idle side). */
export interface OpenSwitch {
  id: string;
  /** The drawn bus its run hangs from. */
  bus: string;
  /** The bus on its other side, which may be in no tree drawn. */
  across: string;
}

/**
 * A bus continued on a bar of its own below its first row of branches, because all its branches side
 * by side would have made the diagram wider than {@link OneLineLayoutOptions.maxWidth}.
 */
export interface Continuation {
  /** The run ending at the bus continued. */
  busDrop: Drop;
  /** Which continuation this is: 1 the first bar below the bus's own. */
  barRow: number;
  /** Top of the runs hanging from this bar (same unit as {@link Drop.top}). */
  top: number;
  /** The runs hanging from this bar, left to right. */
  runs: Drop[];
  /** The bus's branches in study order: this bar carries numbers `first` to `first + runs.length − 1` of `of`. */
  first: number;
  of: number;
}

/** Options of {@link layoutOneLine}. */
export interface OneLineLayoutOptions {
  /** Switches drawn open, each a run ending at the switch under its bus, after the bus's branches. @default [] */
  open?: readonly OpenSwitch[];
  /**
   * px: the widest the diagram's columns may be. A bus whose branches side by side would be wider goes
   * on under a continuation bar below, as often as needed. @default Infinity (never wrap)
   */
  maxWidth?: number;
  /** px kept free left of a wrapped bus's branches for the line linking its bars. @default 0 */
  linkLane?: number;
  /** Width a wrapped bus's column needs for its continuation bars' labels (px). @default () => 0 */
  measureContinued?: MeasureDrop;
  /** From a run's top to the top of the runs under its bus bar. @default 1 */
  levelHeight?: number;
  /** From a run's top to the lowest point of a run that ends without a bus (a motor, an open switch). @default 1 */
  leafHeight?: number;
  /** From the lowest point of a row of branches to the top of the runs under the bar continuing it. @default 1 */
  continuedHeight?: number;
}

/** What {@link layoutOneLine} returns: every run placed, the columns' width, the deepest bus and the continuation bars. */
export interface OneLineLayout {
  drops: Drop[];
  width: number;
  depth: number;
  /** Lowest point of the diagram, in the unit of {@link Drop.top}. */
  bottom: number;
  continuations: Continuation[];
}

/**
 * Lays a radial network out top-down: one column per run, a run's column at least as wide as its own
 * labels and as the rows of runs hanging below it, so that no two labels or symbols share space. A
 * bus's branches go side by side in one row while that keeps the diagram within `maxWidth`; past it they
 * are dealt, in study order, into as few rows as fit, each row as narrow as that many rows allow (so the
 * bus leaves room beside it for its neighbours), each row after the first under a continuation bar.
 * Iterative (no recursion), linear in the number of elements for a diagram that never wraps.
 * @example layoutOneLine(network, () => 120).drops[0].kind // 'source'
 */
export function layoutOneLine(
  network: Network,
  measure: MeasureDrop,
  options: OneLineLayoutOptions = {},
): OneLineLayout {
  const {
    open = [],
    maxWidth = Infinity,
    linkLane = 0,
    measureContinued = () => 0,
    levelHeight = 1,
    leafHeight = 1,
    continuedHeight = 1,
  } = options;
  const { study } = network;
  const openOn = new Map<string, OpenSwitch[]>();
  for (const item of open) addToList(openOn, item.bus, item);
  const run = (drop: Omit<Drop, 'x' | 'width' | 'top' | 'barRow'>): Drop => ({
    ...drop,
    x: 0,
    width: 0,
    top: 0,
    barRow: 0,
  });
  const source = run({
    elementId: study.source.id,
    kind: 'source',
    main: network.deviceFeeding.get(study.source.bus),
    childBus: study.source.bus,
    depth: 0,
  });
  // Breadth-first: every run after its parent, children in study order.
  const drops: Drop[] = [source];
  const childrenOf = new Map<Drop, Drop[]>();
  for (let i = 0; i < drops.length; i++) {
    const drop = drops[i];
    if (drop.childBus === undefined) continue;
    const children: Drop[] = [];
    for (const branch of network.branchesFrom.get(drop.childBus) ?? []) {
      children.push(
        run({
          elementId: branch.item.id,
          kind: branch.type,
          feeder: network.deviceFeeding.get(branch.item.id),
          main: network.deviceFeeding.get(branch.item.to),
          childBus: branch.item.to,
          depth: drop.depth + 1,
        }),
      );
    }
    for (const item of openOn.get(drop.childBus) ?? [])
      children.push(run({ elementId: item.id, kind: 'switch', open: item, depth: drop.depth + 1 }));
    for (const motor of network.motorsOn.get(drop.childBus) ?? []) {
      children.push(
        run({ elementId: motor.id, kind: 'motor', feeder: network.deviceFeeding.get(motor.id), depth: drop.depth + 1 }),
      );
    }
    childrenOf.set(drop, children);
    drops.push(...children);
  }

  // A wrapped bus's lane is added to its widest row, so a branch as wide as the whole budget would overrun
  // it: narrow the budget by the overrun until the diagram fits (or no wrapping can narrow it further).
  const measured = new Map(drops.map((drop) => [drop, measure(drop)]));
  const continuedWidth = new Map<Drop, number>();
  const sized = (budget: number) =>
    sizeRuns(drops, childrenOf, budget, {
      linkLane,
      levelHeight,
      leafHeight,
      continuedHeight,
      measured,
      continuedWidthOf: (drop) => {
        if (!continuedWidth.has(drop)) continuedWidth.set(drop, measureContinued(drop));
        return continuedWidth.get(drop)!;
      },
    });
  let budget = maxWidth;
  let { rowsOf, reachOf } = sized(budget);
  for (let tries = 0; tries < 8 && source.width > maxWidth; tries++) {
    const narrower = budget - (source.width - maxWidth);
    if (!(narrower < budget) || narrower <= 0) break;
    budget = narrower;
    ({ rowsOf, reachOf } = sized(budget));
  }

  // Top-down: children packed from the parent's left edge (past the link's lane when wrapped), row under row.
  const continuations: Continuation[] = [];
  for (const drop of drops) {
    const rows = rowsOf.get(drop) ?? [];
    const wrapped = rows.length > 1;
    let rowTop = drop.top + levelHeight;
    let lowest = rowTop;
    let first = 1;
    const of = rows.reduce((n, row) => n + row.length, 0);
    rows.forEach((row, r) => {
      if (r > 0) {
        rowTop = lowest + continuedHeight;
        continuations.push({ busDrop: drop, barRow: r, top: rowTop, runs: row, first, of });
      }
      let x = drop.x + (wrapped ? linkLane : 0);
      for (const child of row) {
        child.x = x;
        child.top = rowTop;
        child.barRow = r;
        x += child.width;
        lowest = Math.max(lowest, rowTop + reachOf.get(child)!);
      }
      first += row.length;
    });
  }
  const depth = drops.reduce((most, drop) => Math.max(most, drop.depth), 0);
  return { drops, width: source.width, depth, bottom: reachOf.get(source)!, continuations };
}

// Accepts runs in order and the widest a row may be; the fewest rows greedy filling allows, each as narrow as that count allows.
function balancedRows(runs: Drop[], rowWidth: number): Drop[][] {
  const fewest = rowsWithin(runs, rowWidth).length;
  // The row count only falls as the width grows, so bisect for the narrowest width keeping the fewest rows.
  let narrow = runs.reduce((most, run) => Math.max(most, run.width), 0);
  let wide = Math.max(rowWidth, narrow);
  if (rowsWithin(runs, narrow).length <= fewest) return rowsWithin(runs, narrow);
  while (wide - narrow > 0.5) {
    const mid = (narrow + wide) / 2;
    if (rowsWithin(runs, mid).length <= fewest) wide = mid;
    else narrow = mid;
  }
  return rowsWithin(runs, wide);
}

// Accepts runs in order and a row's width; the runs dealt greedily into rows no wider than it (a run wider alone gets its own row).
function rowsWithin(runs: Drop[], rowWidth: number): Drop[][] {
  const rows: Drop[][] = [];
  let used = Infinity;
  for (const run of runs) {
    if (used + run.width > rowWidth) {
      rows.push([]);
      used = 0;
    }
    rows[rows.length - 1].push(run);
    used += run.width;
  }
  return rows;
}

// Accepts the runs breadth-first, each run's children, the budget and the heights; sets each run's width
// bottom-up, its children dealt into rows, and how far each run's subtree reaches below its top.
function sizeRuns(
  drops: Drop[],
  childrenOf: Map<Drop, Drop[]>,
  budget: number,
  heights: {
    linkLane: number;
    levelHeight: number;
    leafHeight: number;
    continuedHeight: number;
    measured: Map<Drop, number>;
    continuedWidthOf: (drop: Drop) => number;
  },
): { rowsOf: Map<Drop, Drop[][]>; reachOf: Map<Drop, number> } {
  const { linkLane, levelHeight, leafHeight, continuedHeight, measured, continuedWidthOf } = heights;
  const rowsOf = new Map<Drop, Drop[][]>();
  const reachOf = new Map<Drop, number>();
  for (let i = drops.length - 1; i >= 0; i--) {
    const drop = drops[i];
    const children = childrenOf.get(drop) ?? [];
    const sideBySide = children.reduce((sum, child) => sum + child.width, 0);
    const rows = sideBySide <= budget ? [children] : balancedRows(children, budget - linkLane);
    const wrapped = rows.length > 1;
    const widest = rows.reduce(
      (most, row) =>
        Math.max(
          most,
          row.reduce((sum, child) => sum + child.width, 0),
        ),
      0,
    );
    drop.width = Math.max(
      measured.get(drop)!,
      wrapped ? linkLane + widest : widest,
      wrapped ? continuedWidthOf(drop) : 0,
    );
    rowsOf.set(drop, rows);
    if (drop.childBus === undefined) {
      reachOf.set(drop, leafHeight);
      continue;
    }
    // Each row hangs below the lowest point of the row before it, by the room its continuation bar needs.
    let rowTop = levelHeight;
    let reach = levelHeight;
    rows.forEach((row, r) => {
      if (r > 0) rowTop = reach + continuedHeight;
      for (const child of row) reach = Math.max(reach, rowTop + reachOf.get(child)!);
    });
    reachOf.set(drop, reach);
  }
  return { rowsOf, reachOf };
}
