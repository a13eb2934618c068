import { expectedGot, InputError } from '../errors.ts';
import type { Cable } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import type { Impedance } from '../fault/impedance.ts';
import { formatImpedance } from '../fault/impedance.ts';
import { withLazySteps } from '../fault/workSteps.ts';
import { parseConductorSize } from './conductorSize.ts';
import { NEC_TABLE_9, TABLE_9_SPAN, TABLE_9_TEMPERATURE } from './table9.ts';

/** Metres per foot (exact, international foot). */
const METRES_PER_FOOT = 0.3048;

/** Inferred absolute-zero offsets of the resistance–temperature line (NEC Chapter 9 Table 8 note). */
const TEMPERATURE_OFFSET = { copper: 234.5, aluminium: 228 } as const;

/** Options of `cableImpedanceOf`. */
export interface CableImpedanceOptions {
  /** Conductor temperature for the resistance (°C); Table 9 is at 75 °C. @default 75 */
  temperature?: number;
  /** Why the resistance is taken at `temperature`, for its step's source. @default 'temperature as asked' */
  temperatureBasis?: string;
  /** Field path of the cable, for errors. @default 'cable' */
  path?: string;
}

/**
 * Corrects a 75 °C resistance to `temperature`: `R_T = R_75 · (234.5 + T) / 309.5` copper,
 * `(228 + T) / 303` aluminium (the temperature coefficients of NFPA 70 Chapter 9 Table 8's note).
 *
 * @example resistanceAtTemperature(0.029, 'copper', 90) // 0.030405 Ω/1000 ft
 */
export function resistanceAtTemperature(r75: number, material: Cable['material'], temperature: number): number {
  const offset = TEMPERATURE_OFFSET[material];
  return (r75 * (offset + temperature)) / (offset + TABLE_9_TEMPERATURE);
}

/**
 * The phase impedance of a cable in ohms, one-way length, parallel sets dividing:
 * `Z = (R + jX) · L_ft / 1000 / n` (NFPA 70 Chapter 9 Table 9 and its notes). R and X come from
 * `cable.resistance` / `cable.reactance` (Ω per 1000 ft, for MV cables) when given — used as entered,
 * with no temperature correction, since the data states its own temperature — else from Table 9.
 *
 * @example cableImpedanceOf({ size: '500 kcmil', sets: 2, length: 30.48, material: 'copper', conduit: 'steel', ... })
 *   // { z: { r: 0.00145, x: 0.0024 }, steps: [...] }
 */
export function cableImpedanceOf(
  cable: Pick<Cable, 'id' | 'size' | 'material' | 'conduit' | 'length' | 'sets' | 'resistance' | 'reactance'>,
  options: CableImpedanceOptions = {},
): { z: Impedance; steps: WorkStep[] } {
  const { temperature = TABLE_9_TEMPERATURE, temperatureBasis = 'temperature as asked', path = 'cable' } = options;
  const needsTable = cable.resistance === undefined || cable.reactance === undefined;
  const size = needsTable ? parseConductorSize(cable.size, `${path}.size`) : cable.size;
  const row = needsTable ? NEC_TABLE_9[size] : undefined;
  if (needsTable && !row)
    throw new InputError(
      `${path}.size`,
      expectedGot(`a size in NEC Table 9 (${TABLE_9_SPAN}), or "resistance" and "reactance" per 1000 ft`, cable.size),
    );
  const listed = row?.resistance[cable.material];
  if (cable.resistance === undefined && !listed)
    throw new InputError(
      `${path}.size`,
      expectedGot(`a size NEC Table 9 lists in ${cable.material}, or "resistance" per 1000 ft`, cable.size),
    );
  const feet = cable.length / METRES_PER_FOOT;
  const r75 = cable.resistance ?? listed![cable.conduit];
  const r = cable.resistance ?? resistanceAtTemperature(r75, cable.material, temperature);
  const x = cable.reactance ?? row!.reactance[cable.conduit];
  const z = { r: (r * feet) / 1000 / cable.sets, x: (x * feet) / 1000 / cable.sets };
  const per =
    cable.resistance === undefined ? `NEC Ch. 9 Table 9, ${cable.material} in ${cable.conduit} conduit` : 'cable data';
  const corrected = cable.resistance === undefined && temperature !== TABLE_9_TEMPERATURE;
  const steps = (): WorkStep[] => [
    ...(corrected
      ? [
          {
            label: `${cable.id} resistance at ${temperature} °C`,
            formula: `R_T = R_75 · (${TEMPERATURE_OFFSET[cable.material]} + T) / (${TEMPERATURE_OFFSET[cable.material] + TABLE_9_TEMPERATURE})`,
            substituted: `R_T = ${r75} Ω/1000 ft × (${TEMPERATURE_OFFSET[cable.material]} + ${temperature} °C) / ${TEMPERATURE_OFFSET[cable.material] + TABLE_9_TEMPERATURE} °C`,
            value: r,
            unit: 'Ω/1000 ft',
            source: `NEC Ch. 9 Table 8 note coefficients; ${temperatureBasis}`,
          },
        ]
      : []),
    {
      label: `${cable.id} impedance (${cable.size}, ${cable.sets} set${cable.sets > 1 ? 's' : ''}, ${round(feet)} ft)`,
      formula: 'Z = (R + jX) · L / 1000 / n',
      substituted: `Z = (${round(r)} + j${round(x)}) Ω/1000 ft × ${round(feet)} ft / 1000 / ${cable.sets} = ${formatImpedance(z)} Ω; |Z|`,
      value: Math.hypot(z.r, z.x),
      unit: 'Ω',
      source: per,
    },
  ];
  return withLazySteps({ z }, steps);
}

function round(value: number): string {
  return String(Number(value.toPrecision(6)));
}
