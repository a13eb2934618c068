import { InputError, expectedGot } from '../errors.ts';
import { motorFullLoadAmps, motorFullLoadOf, motorRatedVolts } from '../fault/motorFullLoad.ts';
import { withLazyFields } from '../lazyText.ts';
import { significant } from '../quantity/format.ts';
import type { Motor } from '../study/index.ts';
import { elementPath, requireNumberAbove } from './inputs.ts';
import { LOCKED_ROTOR_KVA_PER_HP, lockedRotorAmpsFromCode } from './lockedRotorCode.ts';
import type { Marker, StartingCurve } from './withstand.ts';

/** Times of the starting curve (s): the asymmetrical current from one half-cycle to 0.1 s, FLA up to 1000 s (common practice). */
export const STARTING_TIMES = { halfCycle: 0.01, asymmetricalUntil: 0.1, longest: 1000 } as const;

/** Options of `motorStartingOf`. */
export interface MotorStartingOptions {
  /** Multiplies FLA for the long-time running current. @default 1.0; range ≥ 1 */
  serviceFactor?: number;
  /** First-half-cycle asymmetrical current as a multiple of LRA (common practice 1.5–1.7). @default 1.6; range ≥ 1 */
  asymmetryFactor?: number;
  /** Locked-rotor current (A). @default from `motor.codeLetter` and its hp where given, else motor.lockedRotor × FLA */
  lockedRotorAmps?: number;
  /** Top of the FLA line (s). @default 1000 */
  longestSeconds?: number;
}

/** A motor's starting curve and its locked-rotor marker. */
export interface MotorStarting {
  curve: StartingCurve;
  /** A point at (LRA, acceleration time). */
  lockedRotor: Marker;
  /** Full-load current (A) at `volts`, before the service factor. */
  fullLoadAmps: number;
}

/**
 * A motor's starting curve at `volts` (common practice, as IEEE 3004.8 and IEEE 242 draw it), in the order of time:
 * the asymmetrical current `asymmetryFactor × LRA` from 0.01 s to 0.1 s, the locked-rotor current
 * `LRA = lockedRotor × FLA` (or from the motor's code letter and horsepower, NFPA 70 Table 430.7(B)) from 0.1 s
 * to the acceleration time, then `FLA × serviceFactor` up to 1000 s.
 * FLA comes from `motorFullLoadOf` (nameplate, else kVA, else hp through NFPA 70 Table 430.250 or
 * 430.248), so the locked-rotor current follows the table too. The motor's device must stay
 * above and to the right of it.
 *
 * @param volts the motor's bus voltage (V, line-to-line).
 * @example motorStartingOf(motor100hp, 460, { lockedRotorAmps: 789.46 }).lockedRotor.amps // 789.46
 */
export function motorStartingOf(motor: Motor, volts: number, options: MotorStartingOptions = {}): MotorStarting {
  const {
    serviceFactor,
    asymmetryFactor,
    longestSeconds,
    fullLoadAmps,
    runningAmps,
    lockedRotorAmps,
    asymmetricalAmps,
    asymmetricalUntil,
    accelerationTime,
    amps,
    seconds,
  } = startingPointsOf(motor, volts, options);
  const name = motor.name ?? motor.id;
  const lraText = `${significant(lockedRotorAmps, 4)} A`;
  // Written once for both labels (and the notes): a study has thousands of motors.
  const accelerationText = `${significant(accelerationTime, 3)} s`;
  return {
    fullLoadAmps,
    // The notes are written when first read: a large study has thousands of motors, seldom all opened.
    curve: withLazyFields(
      {
        elementId: motor.id,
        label: `${name} starting: LRA ${lraText} for ${accelerationText}`,
        volts,
        // Read by index, not destructured: a study has thousands of motors.
        amps,
        seconds,
      },
      {
        notes: () => [
          `FLA ${significant(fullLoadAmps, 6)} A at ${significant(volts, 6)} V (${motorFullLoadOf(motor, volts).basis})` +
            (serviceFactor === 1
              ? ''
              : `; running current × service factor ${serviceFactor} = ${significant(runningAmps, 6)} A`),
          options.lockedRotorAmps !== undefined
            ? `LRA ${lraText} given`
            : motor.codeLetter !== undefined
              ? `LRA ${lraText} from code letter ${motor.codeLetter}: ${LOCKED_ROTOR_KVA_PER_HP[motor.codeLetter][1]} kVA per hp, the letter's upper value (NFPA 70 Table 430.7(B)), × ${significant(motor.hp!, 6)} hp at ${significant(motorRatedVolts(volts, motor.phases), 6)} V`
              : `LRA = ${motor.lockedRotor} × FLA = ${lraText} (common practice without data: about 6 × FLA)`,
          `asymmetrical first-cycle current ${asymmetryFactor} × LRA = ${significant(asymmetricalAmps, 4)} A from ` +
            `${STARTING_TIMES.halfCycle} s to ${asymmetricalUntil} s (common practice: 1.5–1.7 × LRA)`,
          `acceleration time ${accelerationText}, then the running current up to ${longestSeconds} s (common practice)`,
        ],
      },
    ),
    lockedRotor: {
      kind: 'locked-rotor',
      label: `${name} locked rotor ${lraText} for ${accelerationText}`,
      volts,
      amps: lockedRotorAmps,
      seconds: accelerationTime,
      elementId: motor.id,
    },
  };
}

// Accepts a motor with a code letter, its bus voltage and its field path; the locked-rotor current the
// letter gives with the motor's horsepower (NFPA 70 Table 430.7(B), the letter's upper value), at the
// motor's rated voltage as its full-load current is (a 460 V motor on a 480 V bus).
function codeLetterAmps(motor: Motor, volts: number, path: string): number {
  if (motor.hp === undefined)
    throw new InputError(`${path}.hp`, expectedGot('the horsepower a code letter is read with (kVA per hp)', motor.hp));
  return lockedRotorAmpsFromCode(
    motor.codeLetter!,
    motor.hp,
    motorRatedVolts(volts, motor.phases),
    'upper',
    motor.phases,
  );
}

/** The currents and times of a motor's starting curve, with the currents and options they come from. */
export interface StartingPoints {
  /** The options as used, defaults filled in. */
  serviceFactor: number;
  asymmetryFactor: number;
  longestSeconds: number;
  /** Full-load current (A) at the bus voltage, before the service factor. */
  fullLoadAmps: number;
  /** `fullLoadAmps × serviceFactor` (A). */
  runningAmps: number;
  lockedRotorAmps: number;
  /** `asymmetryFactor × lockedRotorAmps` (A), until `asymmetricalUntil` (s). */
  asymmetricalAmps: number;
  asymmetricalUntil: number;
  /** s */
  accelerationTime: number;
  /** The curve's currents (A), in the order of time. */
  amps: Float64Array;
  /** The curve's times (s). */
  seconds: Float64Array;
}

/**
 * The points of `motorStartingOf`'s curve alone, checked as it checks them, without its words: what the
 * motor-starting check compares with the device above (a study has thousands of motors).
 *
 * @example startingPointsOf(motor100hp, 460, { lockedRotorAmps: 789.46 }).amps[0] // 1263.1 A, 1.6 × LRA
 */
export function startingPointsOf(motor: Motor, volts: number, options: MotorStartingOptions = {}): StartingPoints {
  const path = elementPath('motors', motor.id);
  const { serviceFactor = 1, asymmetryFactor = 1.6, longestSeconds = STARTING_TIMES.longest } = options;
  requireNumberAbove('volts', volts, 0, 'a voltage in V');
  requireNumberAbove('options.serviceFactor', serviceFactor, 1, 'a service factor', true);
  requireNumberAbove('options.asymmetryFactor', asymmetryFactor, 1, 'a multiple of locked-rotor current', true);
  const fullLoadAmps = motorFullLoadAmps(motor, volts);
  if (!(fullLoadAmps > 0 && Number.isFinite(fullLoadAmps))) {
    throw new InputError(
      `${path}.fullLoadAmps`,
      expectedGot('a full-load current, or hp or rating to infer it', motor.fullLoadAmps),
    );
  }
  const accelerationTime = requireNumberAbove(
    `${path}.accelerationTime`,
    motor.accelerationTime,
    STARTING_TIMES.halfCycle,
    'a time in s',
  );
  requireNumberAbove('options.longestSeconds', longestSeconds, accelerationTime, 'a time in s');

  // Currents of the three steps; each must exceed the next so the curve falls as time rises.
  const runningAmps = fullLoadAmps * serviceFactor;
  const lockedRotorAmps =
    options.lockedRotorAmps !== undefined
      ? requireNumberAbove('options.lockedRotorAmps', options.lockedRotorAmps, 0, 'a current in A')
      : motor.codeLetter !== undefined
        ? codeLetterAmps(motor, volts, path)
        : requireNumberAbove(`${path}.lockedRotor`, motor.lockedRotor, 0, 'a multiple of full-load current') *
          fullLoadAmps;
  if (!(lockedRotorAmps > runningAmps)) {
    const field =
      options.lockedRotorAmps !== undefined
        ? 'options.lockedRotorAmps'
        : motor.codeLetter !== undefined
          ? `${path}.codeLetter`
          : `${path}.lockedRotor`;
    throw new InputError(
      field,
      expectedGot(
        `a locked-rotor current above the running current ${significant(runningAmps)} A`,
        significant(lockedRotorAmps),
      ),
    );
  }
  const asymmetricalAmps = asymmetryFactor * lockedRotorAmps;
  const asymmetricalUntil = Math.min(STARTING_TIMES.asymmetricalUntil, accelerationTime);

  const stepAmps = [asymmetricalAmps, asymmetricalAmps, lockedRotorAmps, lockedRotorAmps, runningAmps, runningAmps];
  const stepSeconds = [
    STARTING_TIMES.halfCycle,
    asymmetricalUntil,
    asymmetricalUntil,
    accelerationTime,
    accelerationTime,
    longestSeconds,
  ];
  // A start shorter than 0.1 s leaves two equal points; keep one.
  const same = (i: number) => stepAmps[i] === stepAmps[i - 1] && stepSeconds[i] === stepSeconds[i - 1];
  let count = 1;
  for (let i = 1; i < stepAmps.length; i++) if (!same(i)) count++;
  const amps = new Float64Array(count);
  const seconds = new Float64Array(count);
  amps[0] = stepAmps[0];
  seconds[0] = stepSeconds[0];
  for (let i = 1, k = 1; i < stepAmps.length; i++) {
    if (same(i)) continue;
    amps[k] = stepAmps[i];
    seconds[k++] = stepSeconds[i];
  }
  return {
    serviceFactor,
    asymmetryFactor,
    longestSeconds,
    fullLoadAmps,
    runningAmps,
    lockedRotorAmps,
    asymmetricalAmps,
    asymmetricalUntil,
    accelerationTime,
    amps,
    seconds,
  };
}
