import { locationBusOf } from '../network/index.ts';
import { formatAmps, significant } from '../quantity/format.ts';
import type { Device, Transformer } from '../study/index.ts';
import { transformerRatedAmps } from '../withstand/index.ts';
import type { WorkStep } from '../work.ts';
import { nameOf, protectingDevice, type CheckContext } from './context.ts';
import { ratingOf } from './deviceRating.ts';
import type { Finding } from './finding.ts';
import { nextERating, nextStandardRating } from './standardRatings.ts';

/** The cell of NEC Table 450.3(A) or (B) that limits one device, in percent of rated current. */
interface Limit {
  percent: number;
  /** Note 1: a higher rating or setting is permitted where the percentage does not land on one. */
  nextHigher: boolean;
  cell: string;
}

/** A transformer outside Table 450.3(A): above 10 % impedance in a row that depends on it. */
interface OutsideTable {
  outside: string;
}

/** How far Note 1 of Table 450.3(A)/(B) lets a device go above the computed limit, and on what basis. */
interface Allowance {
  amps: number;
  /** The work step's label and source, or undefined where nothing above the limit is permitted. */
  step?: { label: string; substituted: string; source: string };
  /** The clause of the explanation after "allows N %". */
  text: string;
}

/**
 * Checks the ratings of a transformer's primary and secondary devices against NFPA 70 450.3:
 * Table 450.3(A) for a primary over 1000 V (600 V before the 2020 edition), else 450.3(B), choosing the
 * "primary and secondary" method when a secondary device feeds the secondary bus. Ratings are the device's
 * ampere rating, an adjustable breaker's maximum setting (240.6(B)), or a relay's pickup in primary amps.
 *
 * @example nec450Findings(context, t1, '2023')
 */
export function nec450Findings(context: CheckContext, transformer: Transformer, edition: string): Finding[] {
  const { network } = context;
  const primaryDevice = protectingDevice(context, transformer.id);
  const secondaryDevice = network.deviceFeeding.get(transformer.to);
  const threshold = edition === '2017' ? 600 : 1000;
  const overThreshold = transformer.primary > threshold;
  const table = overThreshold ? '450.3(A)' : '450.3(B)';
  const z = transformer.impedance;
  const findings: Finding[] = [];
  const name = transformer.name ?? transformer.id;

  const sides: {
    device: Device | undefined;
    side: 'primary' | 'secondary';
    volts: number;
    limit: Limit | undefined;
  }[] = [
    { device: primaryDevice, side: 'primary', volts: transformer.primary, limit: undefined },
    { device: secondaryDevice, side: 'secondary', volts: transformer.secondary, limit: undefined },
  ];
  for (const side of sides) {
    const fla = transformerRatedAmps(transformer, side.volts);
    const limit = overThreshold
      ? limitA(
          side.side,
          side.device,
          z,
          transformer.supervised,
          secondaryDevice !== undefined,
          side.volts > threshold,
          threshold,
        )
      : limitB(side.side, fla, secondaryDevice !== undefined);
    if (limit && 'outside' in limit) {
      findings.push({
        id: `nec-450.3:${transformer.id}:${side.side}`,
        kind: 'nec-450.3',
        severity: 'warning',
        title: `${name} at ${significant(z, 3)} % impedance is outside NEC Table ${table} (${side.side})`,
        subjects: [...(side.device ? [side.device.id] : []), transformer.id],
        explanation: `NEC Table ${table} lists transformers of at most 10 % impedance for ${limit.outside}; ${name} is ${significant(z, 3)} %, so the table sets no limit for its ${side.side} device and the 6–10 % row does not apply.`,
        suggestion: `Set the ${side.side} protection under engineering supervision from the transformer's own data and the adopted code, and record the basis.`,
        basis: `NFPA 70 ${edition}, Table ${table} (rows up to 10 % impedance)`,
        referenceVolts: side.volts,
      });
    } else side.limit = limit;
  }
  if (overThreshold && !transformer.supervised && !secondaryDevice) {
    findings.push({
      id: `nec-450.3:${transformer.id}:secondary-missing`,
      kind: 'nec-450.3',
      severity: 'fail',
      title: `${name} needs secondary protection (NEC ${table})`,
      subjects: [transformer.id],
      explanation: `NEC Table ${table} requires a secondary device for a transformer over ${threshold} V outside supervised locations, and none feeds ${transformer.to}.`,
      suggestion: `Add a secondary main at ${transformer.to} rated within ${transformer.secondary > threshold ? '250–300' : '125'} % of the secondary rated current.`,
      referenceVolts: transformer.secondary,
    });
  }
  for (const { device, side, volts, limit } of sides) {
    if (!device || !limit) continue;
    const fla = transformerRatedAmps(transformer, volts);
    const rating = ratingOf(device);
    if (!rating) {
      findings.push({
        id: `nec-450.3:${transformer.id}:${side}`,
        kind: 'nec-450.3',
        severity: 'info',
        title: `${nameOf(device)} has no ampere rating to check against NEC ${table}`,
        subjects: [device.id, transformer.id],
        explanation: `Give ${nameOf(device)} its ampere rating ("rating" on the device) so its ${side} limit for ${name} can be checked.`,
        referenceVolts: locationBusOf(network, device).voltage,
      });
      continue;
    }
    const limitAmps = (limit.percent / 100) * fla;
    const allowance = allowanceOf(limit, limitAmps, device, volts, threshold);
    const allowed = allowance.amps;
    // A relative 1e-9 forgives a setting entered to the printed digits of the computed limit.
    const ok = rating.amps <= allowed * (1 + 1e-9) + 1e-6;
    const percent = (100 * rating.amps) / fla;
    const work: WorkStep[] = [
      {
        label: `${side} rated current`,
        formula: transformer.phases === 3 ? 'I = S / (√3 · V)' : 'I = S / V',
        substituted: `I = ${transformer.rating} / (${transformer.phases === 3 ? '1.7320508 × ' : ''}${volts})`,
        value: fla,
        unit: 'A',
        source: 'textbook identity',
      },
      {
        label: `limit, ${limit.cell}`,
        formula: 'I_max = limit % × I',
        substituted: `I_max = ${limit.percent} % × ${significant(fla, 6)}`,
        value: limitAmps,
        unit: 'A',
        source: `NFPA 70 ${edition}, Table ${table}`,
      },
      ...(allowance.step
        ? [
            {
              label: allowance.step.label,
              formula: 'Table ' + table + ' note 1',
              substituted: allowance.step.substituted,
              value: allowed,
              unit: 'A',
              source: allowance.step.source,
            },
          ]
        : []),
      {
        label: `${nameOf(device)} ${rating.what}`,
        formula: 'rating / I × 100',
        substituted: `${significant(rating.amps, 6)} / ${significant(fla, 6)} × 100`,
        value: percent,
        unit: '%',
      },
    ];
    findings.push({
      id: `nec-450.3:${transformer.id}:${side}`,
      kind: 'nec-450.3',
      severity: ok ? 'ok' : 'fail',
      title: `${nameOf(device)} ${ok ? 'is within' : 'exceeds'} NEC ${table} for ${name} (${side})`,
      subjects: [device.id, transformer.id],
      explanation: `${nameOf(device)}'s ${rating.what} is ${formatAmps(rating.amps, 4)}, ${significant(percent, 3)} % of ${name}'s ${side} rated current ${formatAmps(fla, 4)}; ${limit.cell} allows ${limit.percent} %${allowance.text}.`,
      suggestion: ok
        ? undefined
        : `Choose a ${side} device rated at most ${formatAmps(allowed, 4)}, or check whether another method of ${table} applies.`,
      basis: `NFPA 70 ${edition}, Table ${table} and its note 1; check the edition adopted where the work is done`,
      referenceVolts: locationBusOf(network, device).voltage,
      work,
    });
  }
  return findings;
}

/**
 * Table 450.3(A), over 1000 V. Rows: any location with %Z ≤ 6 % or 6–10 %; supervised locations
 * (primary only: any %Z; primary and secondary: ≤ 6 % or 6–10 %). Above 10 % a row that depends on
 * impedance does not apply: the transformer is outside the table.
 */
function limitA(
  side: 'primary' | 'secondary',
  device: Device | undefined,
  z: number,
  supervised: boolean,
  hasSecondary: boolean,
  sideOver: boolean,
  threshold: number,
): Limit | OutsideTable | undefined {
  if (!device) return undefined;
  const fuse = device.characteristic.kind === 'fuse';
  const type = fuse ? 'fuse' : 'breaker';
  if (side === 'primary' && supervised && !hasSecondary) {
    return { percent: fuse ? 250 : 300, nextHigher: true, cell: `supervised location, primary only, ${type}` };
  }
  if (z > 10) return { outside: supervised ? 'supervised locations with secondary protection' : 'any location' };
  const low = z <= 6;
  const row = `${supervised ? 'supervised location' : 'any location'}, %Z ${low ? '≤ 6 %' : 'over 6 % to 10 %'}`;
  if (side === 'primary') {
    return {
      percent: fuse ? 300 : low ? 600 : 400,
      nextHigher: true,
      cell: `${row}, primary over ${threshold} V, ${type}`,
    };
  }
  if (sideOver) {
    return {
      percent: fuse ? (low ? 250 : 225) : low ? 300 : 250,
      nextHigher: true,
      cell: `${row}, secondary over ${threshold} V, ${type}`,
    };
  }
  return { percent: supervised ? 250 : 125, nextHigher: true, cell: `${row}, secondary ${threshold} V or less` };
}

/**
 * What Note 1 of Table 450.3(A) (and of 450.3(B) for 125 %) permits above the computed limit:
 * - at the threshold voltage and below, the next higher standard rating of NFPA 70 240.6(A);
 * - above it, the next higher commercially available rating or setting: for an E-rated fuse the next
 *   rating of the fuse's `availableRatings`, else of `E_RATINGS` (common practice); for a relay, whose pickup is continuously adjustable,
 *   the computed value itself; for any other device above 1000 V, the computed value (its available
 *   ratings are not known here).
 */
function allowanceOf(limit: Limit, limitAmps: number, device: Device, volts: number, threshold: number): Allowance {
  const exact = { amps: limitAmps, text: ` (${formatAmps(limitAmps, 4)})` };
  if (!limit.nextHigher) return exact;
  const kind = device.characteristic.kind;
  if (volts <= threshold) {
    const amps = nextStandardRating(limitAmps, kind === 'fuse');
    return {
      amps,
      text: ` or the next standard rating, ${formatAmps(amps, 4)}`,
      step: {
        label: `next higher standard rating permitted (note 1, ${threshold} V and below)`,
        substituted: `next standard rating ≥ ${significant(limitAmps, 6)} A`,
        source: 'NFPA 70 240.6(A) and Table 450.3 note 1',
      },
    };
  }
  if (kind === 'fuse') {
    const own = device.characteristic.availableRatings;
    const amps = nextERating(limitAmps, own);
    if (amps === undefined) {
      return { ...exact, text: `${exact.text}; no available rating of the fuse reaches it` };
    }
    return {
      amps,
      text: ` or the next E rating commercially available, ${significant(amps, 4)}E`,
      step: {
        label: `next higher commercially available E rating (note 1, above ${threshold} V)`,
        substituted: `next E rating ≥ ${significant(limitAmps, 6)} A`,
        source: own
          ? "Table 450.3(A) note 1; the fuse family's ratings as entered"
          : 'Table 450.3(A) note 1; E-rating series of common practice (ANSI C37.46 fuses)',
      },
    };
  }
  if (kind === 'relay') {
    return {
      amps: limitAmps,
      text: ` (${formatAmps(limitAmps, 4)}; a continuously adjustable pickup is not rounded up above ${threshold} V)`,
    };
  }
  return exact;
}

/** Table 450.3(B), 1000 V and less (NFPA 70). */
function limitB(side: 'primary' | 'secondary', fla: number, hasSecondary: boolean): Limit {
  if (side === 'primary') {
    if (hasSecondary) return { percent: 250, nextHigher: false, cell: 'primary and secondary protection, primary' };
    if (fla >= 9) return { percent: 125, nextHigher: true, cell: 'primary only, primary current 9 A or more' };
    if (fla >= 2) return { percent: 167, nextHigher: false, cell: 'primary only, primary current under 9 A' };
    return { percent: 300, nextHigher: false, cell: 'primary only, primary current under 2 A' };
  }
  return fla >= 9
    ? { percent: 125, nextHigher: true, cell: 'primary and secondary protection, secondary current 9 A or more' }
    : { percent: 167, nextHigher: false, cell: 'primary and secondary protection, secondary current under 9 A' };
}
