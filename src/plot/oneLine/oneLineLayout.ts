import type { Network } from '../../engine/network/index.ts';
import type { Device } from '../../engine/study/index.ts';

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
}

/** Text of one run's labels, measured by the caller (px). */
export type MeasureDrop = (drop: Omit<Drop, 'x' | 'width'>) => number;

/** A switch that connects nothing in the drawn network (an open tie, a transfer switch's idle side). */
export interface OpenSwitch {
  id: string;
  /** The drawn bus its run hangs from. */
  bus: string;
  /** The bus on its other side, which may be in no tree drawn. */
  across: string;
}

/** Options of {@link layoutOneLine}. */
export interface OneLineLayoutOptions {
  /** Switches drawn open, each a run ending at the switch under its bus, after the bus's branches. @default [] */
  open?: readonly OpenSwitch[];
}

/**
 * Lays a radial network out top-down: one column per run, a run's column at least as wide as its own
 * labels and as all the runs hanging below it side by side, so that no two labels or symbols share
 * space. Iterative (no recursion), linear in the number of elements.
 * @example layoutOneLine(network, () => 120).drops[0].kind // 'source'
 */
export function layoutOneLine(
  network: Network,
  measure: MeasureDrop,
  options: OneLineLayoutOptions = {},
): { drops: Drop[]; width: number; depth: number } {
  const { open = [] } = options;
  const { study } = network;
  const openOn = new Map<string, OpenSwitch[]>();
  for (const item of open) openOn.set(item.bus, [...(openOn.get(item.bus) ?? []), item]);
  const top: Drop = {
    elementId: study.source.id,
    kind: 'source',
    main: network.deviceFeeding.get(study.source.bus),
    childBus: study.source.bus,
    depth: 0,
    x: 0,
    width: 0,
  };
  // Breadth-first: every run after its parent, children in study order.
  const drops: Drop[] = [top];
  const childrenOf = new Map<Drop, Drop[]>();
  for (let i = 0; i < drops.length; i++) {
    const drop = drops[i];
    if (drop.childBus === undefined) continue;
    const children: Drop[] = [];
    for (const branch of network.branchesFrom.get(drop.childBus) ?? []) {
      children.push({
        elementId: branch.item.id,
        kind: branch.type,
        feeder: network.deviceFeeding.get(branch.item.id),
        main: network.deviceFeeding.get(branch.item.to),
        childBus: branch.item.to,
        depth: drop.depth + 1,
        x: 0,
        width: 0,
      });
    }
    for (const item of openOn.get(drop.childBus) ?? [])
      children.push({ elementId: item.id, kind: 'switch', open: item, depth: drop.depth + 1, x: 0, width: 0 });
    for (const motor of network.motorsOn.get(drop.childBus) ?? []) {
      children.push({
        elementId: motor.id,
        kind: 'motor',
        feeder: network.deviceFeeding.get(motor.id),
        depth: drop.depth + 1,
        x: 0,
        width: 0,
      });
    }
    childrenOf.set(drop, children);
    drops.push(...children);
  }
  // Widths bottom-up: own labels, or the children side by side, whichever is wider.
  for (let i = drops.length - 1; i >= 0; i--) {
    const drop = drops[i];
    const childWidth = (childrenOf.get(drop) ?? []).reduce((sum, child) => sum + child.width, 0);
    drop.width = Math.max(measure(drop), childWidth);
  }
  // Positions top-down: children packed from the parent's left edge.
  for (const drop of drops) {
    let x = drop.x;
    for (const child of childrenOf.get(drop) ?? []) {
      child.x = x;
      x += child.width;
    }
  }
  const depth = drops.reduce((most, drop) => Math.max(most, drop.depth), 0);
  return { drops, width: top.width, depth };
}
