import { InputError, expectedGot } from '../errors.ts';
import { significant } from '../quantity/format.ts';
import type { Transformer } from '../study/index.ts';
import { elementPath, requireNumberAbove } from './inputs.ts';
import { transformerRatedAmps } from './transformerRatedAmps.ts';
import type { Marker } from './withstand.ts';

/**
 * Magnetising-inrush rules of thumb (common practice): multiples of the primary
 * full-load current and the time they are drawn at.
 */
export const INRUSH = {
  /** 8 × FLA at 0.1 s for units up to `largeUnitVa`. */
  multiple: 8,
  /** 12 × FLA at 0.1 s above `largeUnitVa` (the top of the 10–12 × range). */
  largeUnitMultiple: 12,
  /** Rating above which `largeUnitMultiple` applies (VA): 3000 kVA. */
  largeUnitVa: 3_000_000,
  seconds: 0.1,
  /** 25 × FLA at 0.01 s, drawn for dry-type units and for units up to `smallUnitVa`. */
  halfCycleMultiple: 25,
  halfCycleSeconds: 0.01,
  /** Rating up to which the half-cycle point is drawn by default (VA): 500 kVA. */
  smallUnitVa: 500_000,
} as const;

/** Options of `inrushMarkersOf`. */
export interface InrushOptions {
  /**
   * Multiple of primary FLA drawn at 0.1 s. Use 10–12 for a conservative check on smaller units.
   * @default 8 up to 3000 kVA, 12 above; range > 1
   */
  multiple?: number;
  /**
   * Also draw 25 × FLA at 0.01 s.
   * @default true for dry-type units and for units of 500 kVA or less; false otherwise
   */
  halfCyclePoint?: boolean;
}

/**
 * The default 0.1 s inrush multiple for a rating: 8 × up to 3000 kVA, 12 × above (common practice).
 * @example inferInrushMultiple(2_500_000) // 8
 */
export function inferInrushMultiple(ratingVa: number): number {
  return ratingVa > INRUSH.largeUnitVa ? INRUSH.largeUnitMultiple : INRUSH.multiple;
}

/**
 * Transformer magnetising-inrush markers at the primary voltage (common practice):
 * points the primary device must not operate at or below/left of. Real inrush depends on residual
 * flux, source strength and core steel; these are rules of thumb.
 *
 * @example inrushMarkersOf(t2500kva, { multiple: 12, halfCyclePoint: true })
 *   // [{ amps: 1255.11, seconds: 0.1, ... }, { amps: 2614.81, seconds: 0.01, ... }] at 13.8 kV
 */
export function inrushMarkersOf(transformer: Transformer, options: InrushOptions = {}): Marker[] {
  const path = elementPath('transformers', transformer.id);
  const volts = requireNumberAbove(`${path}.primary`, transformer.primary, 0, 'a voltage in V');
  const fullLoadAmps = transformerRatedAmps(transformer, volts);
  const {
    multiple = inferInrushMultiple(transformer.rating),
    halfCyclePoint = transformer.construction === 'dry' || transformer.rating <= INRUSH.smallUnitVa,
  } = options;
  requireNumberAbove('options.multiple', multiple, 1, 'a multiple of full-load current');
  if (typeof halfCyclePoint !== 'boolean') {
    throw new InputError('options.halfCyclePoint', expectedGot('true or false', halfCyclePoint));
  }

  const markerAt = (times: number, seconds: number): Marker => ({
    kind: 'inrush',
    label: `inrush ${significant(times, 3)} × FLA at ${seconds} s (common practice)`,
    volts,
    amps: times * fullLoadAmps,
    seconds,
    elementId: transformer.id,
  });
  const markers = [markerAt(multiple, INRUSH.seconds)];
  if (halfCyclePoint) markers.push(markerAt(INRUSH.halfCycleMultiple, INRUSH.halfCycleSeconds));
  return markers;
}
