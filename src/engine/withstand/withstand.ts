/**
 * A withstand ("damage") curve: the time-current limit of a transformer or cable, drawn dashed on
 * the sheet. Currents are in amps at the equipment's own voltage (for a transformer, the winding
 * given by `volts`).
 */
export interface WithstandCurve {
  /** Id of the transformer, cable or generator. */
  elementId: string;
  kind: 'transformer' | 'cable' | 'generator';
  /** e.g. 'C57.109 Category II, frequent faults' or 'ICEA P-32-382, 4/0 Cu 90 to 250 °C'. */
  label: string;
  /** Voltage the currents are given at (V). */
  volts: number;
  /**
   * The curve as a polyline, in the order it is drawn (current non-decreasing; a vertical step is
   * two points at the same current). `amps[i]`, `seconds[i]`.
   */
  amps: Float64Array;
  seconds: Float64Array;
  /**
   * Time in seconds the equipment withstands at `amps`: `Infinity` below the curve's lowest current;
   * beyond its highest current (where the curve ends) the last point's time is held. At a vertical
   * step the lower (conservative) time is returned. Never NaN.
   */
  timeAt(amps: number): number;
  /** Source, method and choices, for the work panel and the findings. */
  notes: string[];
}

/** A point or line on the sheet (DEVELOPERS.md, names "marker"). */
export interface Marker {
  /** `ampacity`: a cable's ampacity, the current its overload protection is held to (a vertical line). */
  kind: 'inrush' | 'locked-rotor' | 'full-load' | 'fault' | 'ampacity';
  label: string;
  /** Voltage the current is given at (V). */
  volts: number;
  amps: number;
  /** Time of a point marker (s); omitted for a vertical line at `amps`. */
  seconds?: number;
  /** Id of the element it belongs to. */
  elementId: string;
}

/**
 * A motor starting curve: FLA at long times, locked-rotor current until the acceleration time,
 * and the asymmetrical first-cycle point. A load curve the motor's device must stay above.
 */
export interface StartingCurve {
  elementId: string;
  label: string;
  volts: number;
  /** Polyline of the starting current in time (current non-increasing as time rises). */
  amps: Float64Array;
  seconds: Float64Array;
  notes: string[];
}
