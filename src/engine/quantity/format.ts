/**
 * Formats an SI value for people: amps as `31 378 A` or `31.4 kA`, volts as `480 V` or `12.47 kV`.
 * Significant digits default to 4; thin spaces are not used so output pastes cleanly into reports.
 *
 * @example formatAmps(31377.7) // "31.38 kA"
 */
export function formatAmps(amps: number, digits = 4): string {
  return formatSI(amps, 'A', digits);
}

/** @example formatVolts(12470) // "12.47 kV" */
export function formatVolts(volts: number, digits = 4): string {
  return formatSI(volts, 'V', digits);
}

/** @example formatSeconds(0.0834) // "0.0834 s" */
export function formatSeconds(seconds: number, digits = 3): string {
  if (seconds === Infinity) return 'no operation';
  return `${significant(seconds, digits)} s`;
}

/**
 * Formats with an engineering prefix (k, M) once the value reaches 10 000 (amps) or 1 000 (others).
 * An infinite value (an infinite bus's fault current) reads "no limit"; NaN is a defect and is refused.
 */
export function formatSI(value: number, unit: string, digits = 4): string {
  if (!Number.isFinite(value)) return significant(value, digits);
  const threshold = unit === 'A' ? 10_000 : 1_000;
  const magnitude = Math.abs(value);
  if (magnitude >= 1e6 * (threshold / 1_000)) return `${significant(value / 1e6, digits)} M${unit}`;
  if (magnitude >= threshold) return `${significant(value / 1e3, digits)} k${unit}`;
  return `${significant(value, digits)} ${unit}`;
}

/**
 * Rounds to `digits` significant figures and drops trailing zeros: 0.30000 → "0.3". ±Infinity reads
 * "no limit" so no output ever prints "Infinity"; NaN throws a `RangeError` (it means a defect upstream).
 */
export function significant(value: number, digits = 4): string {
  if (Number.isNaN(value)) throw new RangeError('expected a number to format, got "NaN"');
  if (!Number.isFinite(value)) return 'no limit';
  if (value === 0) return '0';
  const rounded = Number(value.toPrecision(digits));
  return Math.abs(rounded) >= 1e15 || Math.abs(rounded) < 1e-6 ? rounded.toExponential() : String(rounded);
}
