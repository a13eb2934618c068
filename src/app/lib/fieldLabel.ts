/** Setting names as the trade writes them, where a field's key is shorthand. */
const TRADE_NAMES: Record<string, string> = {
  xr: 'X/R',
  timeDial: 'time dial',
  timeMultiplier: 'time multiplier',
  longTime: 'long-time',
  shortTime: 'short-time',
  groundFault: 'ground-fault',
  i2t: 'I²t',
  minimumMelting: 'minimum melting',
  totalClearing: 'total clearing',
  referenceVoltage: 'reference voltage',
  fullLoadAmps: 'full-load amps',
  lockedRotor: 'locked-rotor multiple',
  codeLetter: 'locked-rotor code letter',
  accelerationTime: 'acceleration time',
  interruptingRating: 'interrupting rating',
  ctRatio: 'CT ratio',
  hp: 'horsepower',
  kva: 'kVA',
};

/**
 * The label a field shows: the trade's name where there is one, else its key in plain words
 * (`faultFrequency` → "fault frequency"); list items show their position from 1.
 *
 * @example fieldLabel('timeDial') // 'time dial'
 */
export function fieldLabel(key: string | number): string {
  if (typeof key === 'number') return `#${key + 1}`;
  return (
    TRADE_NAMES[key] ??
    key
      .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
      .replace(/_/g, ' ')
      .toLowerCase()
  );
}
