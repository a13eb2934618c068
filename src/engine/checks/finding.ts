import type { Work } from '../work.ts';

/** What a check looked at (DEVELOPERS.md, names "finding"). */
export type FindingKind =
  | 'coordination'
  | 'transformer-withstand'
  | 'transformer-inrush'
  | 'nec-450.3'
  | 'cable-withstand'
  | 'cable-ampacity'
  | 'motor-starting'
  | 'carry-load'
  | 'interrupting-duty'
  | 'short-circuit-rating'
  | 'sensitivity'
  | 'code-selectivity'
  | 'generator-decrement'
  | 'generator-withstand'
  | 'setting';

/** How bad: `ok` passes, `info` is advice, `warning` a thin margin or an unprovable region, `fail` an overlap or a protection failure. */
export type Severity = 'ok' | 'info' | 'warning' | 'fail';

/** A current interval, both at the sheet's reference voltage and at each involved device's own voltage. */
export interface CurrentRange {
  /** Amps at the reference voltage. */
  fromAmps: number;
  toAmps: number;
  /** The same interval at each named voltage: e.g. `{ volts: 480, fromAmps, toAmps }`. */
  atVoltages: { volts: number; fromAmps: number; toAmps: number }[];
}

/**
 * A result of a check: kind, severity, where on the current axis, the worst margin and where, a
 * plain explanation and a suggested direction. Findings are data; reports and the sheet render them.
 */
export interface Finding {
  /** Stable id, e.g. 'coordination:MAIN/FDR-MCC:2'. */
  id: string;
  kind: FindingKind;
  severity: Severity;
  /** Short title: 'MAIN and FDR-MCC overlap'. */
  title: string;
  /** Devices and elements involved (ids), upstream first. */
  subjects: string[];
  /** The current interval the finding covers, if it is about a range of currents. */
  range?: CurrentRange;
  /** The worst point: current (A at the reference voltage), margin in seconds (negative = overlap) and as a time ratio. */
  worst?: { amps: number; marginSeconds: number; ratio: number; upTime: number; downTime: number };
  /** Interval class for coordination findings. */
  status?: 'selective' | 'thin margin' | 'overlap' | 'not provable from curves';
  /** Plain-language explanation a new engineer understands. */
  explanation: string;
  /** What to change ("raise the upstream pickup", "add short-time delay"). */
  suggestion?: string;
  /** Required margin used and why, e.g. '0.12 s (relay over LV breaker band, IEEE 242 ch. 15)'. */
  basis?: string;
  /** The reference voltage the ranges are given at. */
  referenceVolts: number;
  /** Optional worked steps behind the finding (code limits, ratings). */
  work?: Work;
  /** The operating scenarios it holds in, for a study with more than one way to feed its loads. */
  scenarios?: string[];
}
