import { asymmetryOf, type FaultLevel } from '../fault/index.ts';
import { locationBusOf } from '../network/index.ts';
import { formatAmps, formatVolts, significant } from '../quantity/format.ts';
import type { Bus, Device } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import { capitalise, nameOf, rangeOf, type CheckContext } from './context.ts';
import type { Finding } from './finding.ts';

/** What was tested to earn an interrupting or short-circuit rating: a breaker construction, a fuse, or equipment. */
export type RatedConstruction = NonNullable<Device['construction']> | 'fuse' | 'mv-fuse' | 'equipment' | 'mv-equipment';

/** How a rating's test circuit compares with the system: its X/R and whether peaks or RMS currents are compared. */
export interface RatingBasis {
  construction: RatedConstruction;
  /** `peak`: first-peak ratio (moulded-case, insulated-case, fuses); `rms`: half-cycle RMS asymmetrical ratio. */
  compare: 'peak' | 'rms';
  /** X/R of the rating's test circuit. */
  testXr: number;
  /** Test circuit power factor (0–1) the X/R comes from, where the standard gives one. */
  testPowerFactor?: number;
  /** The published basis, in words, for the finding's basis line. */
  source: string;
}

/** A device or bus checked against the maximum fault where it sits. */
export interface DutyCase {
  /** Which bolted fault sets the duty: 'three-phase', 'line-to-ground', or their single-phase names. */
  fault: string;
  /** Symmetrical RMS fault current (A). */
  symmetricalAmps: number;
  /** X/R of that fault. */
  xr: number;
  /** Multiplying factor for X/R above the test X/R (1 at or below it). */
  factor: number;
  /** `factor × symmetricalAmps` (A): what the rating must meet. */
  dutyAmps: number;
}

/** Standard DC time constant behind medium-voltage breaker ratings, s (IEEE C37.04: X/R 17 at 60 Hz). */
export const MV_BREAKER_TIME_CONSTANT = 0.045;

/** Above this line-to-line voltage a breaker is taken as a medium-voltage breaker (V). */
const LOW_VOLTAGE_LIMIT = 1000;

/**
 * The X/R of a test circuit with power factor `pf`: `tan(acos(pf))`.
 * @example xrOfPowerFactor(0.2) // 4.8990
 */
export function xrOfPowerFactor(pf: number): number {
  return Math.tan(Math.acos(pf));
}

/**
 * UL 489 test circuit power factor by interrupting rating, lowest of each published band (the lowest
 * test X/R, so the largest factor): 50 % up to 10 kA, 30 % above 10 kA up to 20 kA, 20 % above 20 kA.
 *
 * @example ul489PowerFactor(25_000) // 0.2
 */
export function ul489PowerFactor(ratingAmps: number): number {
  return ratingAmps <= 10_000 ? 0.5 : ratingAmps <= 20_000 ? 0.3 : 0.2;
}

/**
 * The construction a device's interrupting rating belongs to: `fuse` for a fuse (`mv-fuse` above
 * 1000 V); else the device's
 * `construction`; else `mv-breaker` above 1000 V, `power-breaker` for a relay-tripped breaker at
 * 1000 V or less, and `moulded-case` for trip units and thermal-magnetic breakers (its UL 489 test X/R
 * is the lowest, so the duty factor the largest: the safe side when the construction is not known).
 *
 * @example inferConstruction(device, 480) // 'moulded-case'
 */
export function inferConstruction(device: Device, volts: number): RatedConstruction {
  if (device.characteristic.kind === 'fuse') return volts > LOW_VOLTAGE_LIMIT ? 'mv-fuse' : 'fuse';
  if (device.construction) return device.construction;
  if (volts > LOW_VOLTAGE_LIMIT) return 'mv-breaker';
  return device.characteristic.kind === 'relay' ? 'power-breaker' : 'moulded-case';
}

/**
 * The test circuit behind a rating (construction, rating in A, system frequency in Hz). A user-given
 * `testXr` (from the device's listing) replaces the default X/R but keeps the comparison.
 *
 * - moulded-case, insulated-case (UL 489): power factor by rating (`ul489PowerFactor`), peaks compared;
 * - LV power circuit breakers (IEEE C37.13, UL 1066): power factor 15 %, X/R 6.59, RMS compared;
 * - fuses (UL 248-1): power factor 20 % or less, X/R 4.90, peaks compared; a fuse above 1000 V the same
 *   unless its listed test X/R is entered (a lower test X/R gives a larger factor: the safe side);
 * - MV breakers (IEEE C37.04/C37.010): X/R = 2πf × 45 ms (17 at 60 Hz), RMS compared as a first-cycle screen;
 * - equipment at 1000 V or less: tested like a moulded-case breaker of the same rating (common practice);
 *   equipment above 1000 V: like an MV breaker.
 *
 * @example ratingBasisOf('power-breaker', 65_000, 60).testXr // 6.5917
 */
export function ratingBasisOf(
  construction: RatedConstruction,
  ratingAmps: number,
  frequency: number,
  testXr?: number,
): RatingBasis {
  const basis = ((): RatingBasis => {
    switch (construction) {
      case 'moulded-case':
      case 'insulated-case':
      case 'equipment': {
        const pf = ul489PowerFactor(ratingAmps);
        const tested =
          construction === 'equipment'
            ? 'equipment short-circuit test taken as that of a UL 489 breaker of the same rating (common practice)'
            : `${construction} breaker, UL 489`;
        return {
          construction,
          compare: 'peak',
          testXr: xrOfPowerFactor(pf),
          testPowerFactor: pf,
          source: `${tested} test circuit power factor ${pf * 100} % for ratings ${ratingBand(ratingAmps)}; peak currents compared, as IEEE 1015-2006 applies it`,
        };
      }
      case 'power-breaker':
        return {
          construction,
          compare: 'rms',
          testXr: xrOfPowerFactor(0.15),
          testPowerFactor: 0.15,
          source:
            'low-voltage power circuit breaker, IEEE C37.13 / UL 1066 test circuit power factor 15 %; RMS asymmetrical currents compared, as IEEE 1015-2006 applies it',
        };
      case 'fuse':
      case 'mv-fuse':
        return {
          construction,
          compare: 'peak',
          testXr: xrOfPowerFactor(0.2),
          testPowerFactor: 0.2,
          source:
            construction === 'fuse'
              ? 'fuse, UL 248-1 test circuit power factor 20 % or less; peak currents compared'
              : 'medium-voltage fuse taken at the UL 248-1 low-voltage test circuit, power factor 20 %, which overstates the duty of a fuse tested at a higher X/R (enter its listed IEEE C37.41 test X/R); peak currents compared',
        };
      case 'mv-breaker':
      case 'mv-equipment':
        return {
          construction,
          compare: 'rms',
          testXr: 2 * Math.PI * frequency * MV_BREAKER_TIME_CONSTANT,
          source: `${construction === 'mv-breaker' ? 'medium-voltage breaker' : 'medium-voltage equipment'}, symmetrical-current basis of IEEE C37.04 / C37.010 with the 45 ms standard time constant; first-cycle RMS asymmetrical currents compared as a screening check, not the contact-parting E/X calculation of IEEE C37.010`,
        };
    }
  })();
  return testXr === undefined
    ? basis
    : { ...basis, testXr, testPowerFactor: undefined, source: `${basis.source}; test X/R ${testXr} as entered` };
}

/**
 * The multiplying factor for a system X/R above a rating's test X/R (1 at or below it), from the
 * half-cycle asymmetry factors (`asymmetryOf`): the ratio of peaks, `(1 + e^(−π/(X/R)sys)) / (1 + e^(−π/(X/R)test))`,
 * or of RMS asymmetrical currents, `√(1 + 2e^(−2π/(X/R)sys)) / √(1 + 2e^(−2π/(X/R)test))`.
 *
 * @example dutyFactorOf('peak', 10, xrOfPowerFactor(0.2)) // 1.1334
 */
export function dutyFactorOf(compare: 'peak' | 'rms', systemXr: number, testXr: number): number {
  if (!(systemXr > testXr)) return 1;
  const system = asymmetryOf(systemXr);
  const test = asymmetryOf(testXr);
  return compare === 'peak' ? system.peak / test.peak : system.rms / test.rms;
}

/**
 * The duty at a bus for a rating basis: each bolted fault of the maximum level with its own X/R
 * (three-phase, and line-to-ground where a zero-sequence path exists), multiplied up for X/R, and the
 * largest of them first.
 *
 * @example dutyCasesOf(faults.buses.get('SWBD')!.max, 3, basis)[0].dutyAmps
 */
export function dutyCasesOf(level: FaultLevel, phases: 1 | 3, basis: RatingBasis): DutyCase[] {
  const names = phases === 1 ? ['full-winding', 'line-to-neutral'] : ['three-phase', 'line-to-ground'];
  const faults = [{ fault: names[0], symmetricalAmps: level.threePhase, xr: level.xr }];
  if (level.lineToGround > 0 && !Number.isNaN(level.lineToGroundXr))
    faults.push({ fault: names[1], symmetricalAmps: level.lineToGround, xr: level.lineToGroundXr });
  return faults
    .map(({ fault, symmetricalAmps, xr }) => {
      const factor = dutyFactorOf(basis.compare, xr, basis.testXr);
      // Written out: a spread followed by new fields gives each object a hidden class of its own (V8).
      return { fault, symmetricalAmps, xr, factor, dutyAmps: factor * symmetricalAmps };
    })
    .sort((a, b) => b.dutyAmps - a.dutyAmps);
}

/** What a device's interrupting rating is held to: the bus it sits at, the rating's test basis and the largest duty. */
export interface InterruptingDuty {
  /** The interrupting rating (A). */
  rating: number;
  /** The bus taken as the device's line terminals. */
  bus: Bus;
  basis: RatingBasis;
  /** The largest X/R-corrected bolted fault at the bus (`dutyCasesOf`). */
  worst: DutyCase;
}

/**
 * The duty NFPA 70 110.9 holds a device's interrupting rating to: the largest bolted fault at the bus
 * where it sits, multiplied up for X/R above its rating's test X/R (`ratingBasisOf`, `dutyCasesOf`).
 * `undefined` for a device without an interrupting rating. A fault unbounded by an infinite source has
 * an infinite `worst.symmetricalAmps`.
 *
 * @example interruptingDutyOf(context, fdrMcc, 60)?.worst.dutyAmps
 */
export function interruptingDutyOf(
  context: Pick<CheckContext, 'network' | 'faults'>,
  device: Device,
  frequency = 60,
): InterruptingDuty | undefined {
  const rating = device.interruptingRating;
  if (rating === undefined) return undefined;
  const bus = locationBusOf(context.network, device);
  const construction = inferConstruction(device, bus.voltage);
  const basis = ratingBasisOf(construction, rating, frequency, device.interruptingTestXr);
  return { rating, bus, basis, worst: worstDutyAt(context, bus, basis) };
}

/**
 * NFPA 70 110.9: a device with an interrupting rating must interrupt the maximum fault at its line
 * terminals. The line terminals are taken at the bus where the device sits (the bolted fault there,
 * motors included, is what a fault just below the device draws through the bus). One finding: `fail`
 * when the X/R-corrected duty exceeds the rating, `warning` when the fault there is unbounded (an
 * infinite source), else `ok`. No finding for a device without an interrupting rating.
 *
 * @example interruptingFindings(context, main, 60)
 */
export function interruptingFindings(context: CheckContext, device: Device, frequency = 60): Finding[] {
  const duty = interruptingDutyOf(context, device, frequency);
  if (duty === undefined) return [];
  const { rating, bus, basis } = duty;
  return [
    dutyFinding(context, {
      id: `interrupting-duty:${device.id}`,
      kind: 'interrupting-duty',
      subject: device.id,
      what: `${nameOf(device)}'s interrupting rating`,
      name: nameOf(device),
      rating,
      bus,
      basis,
      clause: 'NFPA 70 110.9',
      remedy: `Use a device rated to interrupt at least the duty, a tested series combination (NFPA 70 240.86), or lower the available fault at ${bus.name ?? bus.id}.`,
    }),
  ];
}

/**
 * NFPA 70 110.10: equipment with a short-circuit rating (a bus's `shortCircuitRating`) must withstand
 * the maximum fault at the bus, corrected for X/R as for a breaker tested the same way (`ratingBasisOf`
 * 'equipment' at 1000 V or less, 'mv-equipment' above). No finding for a bus without a rating.
 *
 * @example busRatingFindings(context, swbd, 60)
 */
export function busRatingFindings(context: CheckContext, bus: Bus, frequency = 60): Finding[] {
  const rating = bus.shortCircuitRating;
  if (rating === undefined) return [];
  const construction = bus.voltage > LOW_VOLTAGE_LIMIT ? 'mv-equipment' : 'equipment';
  const name = bus.name ?? bus.id;
  return [
    dutyFinding(context, {
      id: `short-circuit-rating:${bus.id}`,
      kind: 'short-circuit-rating',
      subject: bus.id,
      what: `${name}'s equipment short-circuit rating`,
      name,
      rating,
      bus,
      basis: ratingBasisOf(construction, rating, frequency),
      clause: 'NFPA 70 110.10',
      remedy: `Use equipment with a higher short-circuit rating, protect it with a current-limiting device ahead of it, or lower the available fault at ${name}.`,
    }),
  ];
}

/** What one duty finding is about. */
interface DutySubject {
  id: string;
  kind: 'interrupting-duty' | 'short-circuit-rating';
  subject: string;
  /** "MAIN's interrupting rating" */
  what: string;
  name: string;
  rating: number;
  bus: Bus;
  basis: RatingBasis;
  clause: string;
  remedy: string;
}

/** The finding for one rating against the largest X/R-corrected fault at its bus. */
function dutyFinding(context: CheckContext, subject: DutySubject): Finding {
  const { bus, basis, rating } = subject;
  const busName = bus.name ?? bus.id;
  const worst = worstDutyAt(context, bus, basis);
  const common = {
    id: subject.id,
    kind: subject.kind,
    subjects: [subject.subject],
    basis: `${subject.clause}; ${basis.source}.`,
    referenceVolts: bus.voltage,
  };
  if (!Number.isFinite(worst.symmetricalAmps)) {
    return {
      ...common,
      severity: 'warning',
      title: `${subject.name}: interrupting duty unbounded at ${busName}`,
      explanation: `The source at ${busName} is entered as infinite, so the fault there has no limit and ${subject.what} (${formatAmps(rating, 3)}) cannot be checked.`,
      suggestion: `Enter the utility's available fault and X/R at ${busName}.`,
    };
  }
  const range = rangeOf(worst.dutyAmps, worst.dutyAmps, bus.voltage, []);
  const work = dutyWork(worst, basis, rating);
  const factorText =
    worst.factor > 1
      ? `, above the test X/R ${significant(basis.testXr, 3)}, so the duty is ${significant(worst.factor, 4)} × ${formatAmps(worst.symmetricalAmps, 3)} = ${formatAmps(worst.dutyAmps, 3)}`
      : `, not above the test X/R ${significant(basis.testXr, 3)}, so the duty is the symmetrical current`;
  const situation = `The largest fault at ${busName} (${formatVolts(bus.voltage)}) is ${formatAmps(worst.symmetricalAmps, 3)} symmetrical ${worst.fault} at X/R ${significant(worst.xr, 3)}${factorText}.`;
  if (worst.dutyAmps > rating) {
    return {
      ...common,
      severity: 'fail',
      title: `${subject.name}: rated ${formatAmps(rating, 3)}, duty ${formatAmps(worst.dutyAmps, 3)}`,
      range,
      explanation: `${situation} ${capitalise(subject.what)}, ${formatAmps(rating, 3)}, is below it: a fault here may exceed what it can safely interrupt or withstand.`,
      suggestion: subject.remedy,
      work,
    };
  }
  return {
    ...common,
    severity: 'ok',
    title: `${subject.name}: rated ${formatAmps(rating, 3)}, duty ${formatAmps(worst.dutyAmps, 3)}`,
    range,
    explanation: `${situation} ${capitalise(subject.what)}, ${formatAmps(rating, 3)}, meets it (${significant((100 * worst.dutyAmps) / rating, 3)} % used).`,
    work,
  };
}

/** The largest duty case at a bus for a rating basis, from its maximum fault level. */
function worstDutyAt(context: Pick<CheckContext, 'faults'>, bus: Bus, basis: RatingBasis): DutyCase {
  const fault = context.faults.buses.get(bus.id)!;
  return dutyCasesOf(fault.max, fault.phases, basis)[0];
}

/** The worked steps behind a duty finding. */
function dutyWork(worst: DutyCase, basis: RatingBasis, rating: number): WorkStep[] {
  const pf = basis.testPowerFactor;
  const formula =
    basis.compare === 'peak'
      ? 'MF = (1 + e^(−π/(X/R)sys)) / (1 + e^(−π/(X/R)test))'
      : 'MF = √(1 + 2e^(−2π/(X/R)sys)) / √(1 + 2e^(−2π/(X/R)test))';
  return [
    {
      label: 'test circuit X/R',
      formula: pf === undefined ? '(X/R)test' : '(X/R)test = tan(acos(PF))',
      substituted: pf === undefined ? `${significant(basis.testXr, 6)}` : `tan(acos(${pf}))`,
      value: basis.testXr,
      unit: '',
      source: basis.source,
    },
    {
      label: `multiplying factor at system X/R ${significant(worst.xr, 4)}`,
      formula: `${formula}; 1 when (X/R)sys ≤ (X/R)test`,
      substituted: `(X/R)sys = ${significant(worst.xr, 6)}, (X/R)test = ${significant(basis.testXr, 6)}`,
      value: worst.factor,
      unit: '',
      source: 'IEEE 1015-2006',
    },
    {
      label: `duty for the ${worst.fault} fault`,
      formula: 'I_duty = MF · I_sym',
      substituted: `${significant(worst.factor, 6)} × ${significant(worst.symmetricalAmps, 6)}`,
      value: worst.dutyAmps,
      unit: 'A',
    },
    {
      label: 'duty as a share of the rating',
      formula: '100 · I_duty / I_rating',
      substituted: `100 × ${significant(worst.dutyAmps, 6)} / ${significant(rating, 6)}`,
      value: (100 * worst.dutyAmps) / rating,
      unit: '%',
    },
  ];
}

/** "up to 10 kA", "above 10 kA up to 20 kA", "above 20 kA" */
function ratingBand(ratingAmps: number): string {
  return ratingAmps <= 10_000 ? 'up to 10 kA' : ratingAmps <= 20_000 ? 'above 10 kA up to 20 kA' : 'above 20 kA';
}
