import type { Motor } from '../study/index.ts';
import { MOTOR_VOLTAGE_COLUMNS, TABLE_430_248, TABLE_430_250, type MotorCurrentTable } from './motorTables.ts';

/** What `motorFullLoadOf` needs of a motor; `phases` defaults to 3. */
export type MotorFullLoadInput = Pick<Motor, 'hp' | 'rating' | 'fullLoadAmps'> & { phases?: 1 | 3 };

/** A motor's full-load current and where it came from, in words for work steps and curve notes. */
export interface MotorFullLoad {
  /** Full-load current (A). */
  amps: number;
  /** Its basis, e.g. "NFPA 70 Table 430.250, 15 hp at 460 V (12 hp taken at the next larger size)". */
  basis: string;
}

/**
 * A motor's full-load current in amps on a bus of `volts` (line-to-line), first found of:
 * 1. the nameplate `fullLoadAmps` (the motor's own current; NFPA 70 430.6(A)(2) uses it for overloads,
 *    and the starting curve is compared with the overload device);
 * 2. a kVA `rating`: `S / (√3 · V)`, or `S / V` single-phase;
 * 3. horsepower in NFPA 70 Table 430.250 (three-phase) or 430.248 (single-phase), in the column
 *    serving the bus (`MOTOR_VOLTAGE_COLUMNS`: 460 V for 480 V, 575 V for 600 V, 230 V for 240 V…);
 *    between rows the next larger horsepower (common practice);
 * 4. horsepower outside the tables (too large, or no column serves the bus): 1 hp ≈ 1 kVA of input
 *    (common practice for induction motors).
 *
 * @example motorFullLoadOf({ hp: 100 }, 480).amps // 124 (Table 430.250, 460 V column)
 */
export function motorFullLoadOf(motor: MotorFullLoadInput, volts: number): MotorFullLoad {
  const phases = motor.phases ?? 3;
  const divisor = phases === 1 ? volts : Math.sqrt(3) * volts;
  const formula = phases === 1 ? 'S / V' : 'S / (√3 · V)';
  if (motor.fullLoadAmps !== undefined) return { amps: motor.fullLoadAmps, basis: 'nameplate' };
  if (motor.rating !== undefined) {
    return { amps: motor.rating / divisor, basis: `${formula} from ${motor.rating / 1000} kVA` };
  }
  const hp = motor.hp ?? 0;
  const listed = tableFullLoadAmps(hp, volts, phases);
  if (listed) {
    const rounded = listed.hp === hp ? '' : ` (${hp} hp taken at the next larger size, common practice)`;
    return {
      amps: listed.amps,
      basis: `NFPA 70 Table ${listed.table}, ${hpText(listed.hp)} hp at ${listed.column} V${rounded}`,
    };
  }
  return {
    amps: (hp * 1000) / divisor,
    basis: `${formula} with 1 hp ≈ 1 kVA (common practice; NFPA 70 Table ${phases === 1 ? '430.248' : '430.250'} has no row or column for ${hp} hp at ${volts} V)`,
  };
}

/**
 * A motor's full-load current in amps at `volts` (see `motorFullLoadOf` for the order of sources).
 * @example motorFullLoadAmps({ hp: 100 }, 460) // 124 A (NFPA 70 Table 430.250)
 */
export function motorFullLoadAmps(motor: MotorFullLoadInput, volts: number): number {
  // The same order as `motorFullLoadOf`, without writing its basis (the load check asks for every
  // motor below every feeder).
  if (motor.fullLoadAmps !== undefined) return motor.fullLoadAmps;
  const divisor = motor.phases === 1 ? volts : Math.sqrt(3) * volts;
  if (motor.rating !== undefined) return motor.rating / divisor;
  const hp = motor.hp ?? 0;
  return tableFullLoadAmps(hp, volts, motor.phases ?? 3)?.amps ?? (hp * 1000) / divisor;
}

/**
 * The NFPA 70 table current for `hp` on a bus of `volts`: the column serving the bus and the
 * smallest listed horsepower at or above `hp` with a value in that column; undefined when no column
 * serves the bus or `hp` is above the column's last row.
 *
 * @example tableFullLoadAmps(12, 480, 3) // { amps: 21, hp: 15, column: 460, table: '430.250' }
 */
export function tableFullLoadAmps(
  hp: number,
  volts: number,
  phases: 1 | 3,
): { amps: number; hp: number; column: number; table: string } | undefined {
  const table: MotorCurrentTable = phases === 1 ? TABLE_430_248 : TABLE_430_250;
  const served = columnServing(volts);
  const index = served ? table.volts.indexOf(served.column) : -1;
  if (!served || index < 0 || !(hp > 0)) return undefined;
  // A relative 1e-9 lets 0.333 hp entered as 1/3 match its row.
  const row = table.rows.find(([rowHp, amps]) => rowHp >= hp * (1 - 1e-9) && Number.isFinite(amps[index]));
  return row && { amps: row[1][index], hp: row[0], column: served.column, table: table.table };
}

/** Horsepower as the tables print it: ½, ¾, 1½, 7½, ⅙, ¼, ⅓ or a whole number. */
function hpText(hp: number): string {
  const fractions: Record<string, string> = { '0.5': '½', '0.75': '¾', '0.25': '¼', '1.5': '1½', '7.5': '7½' };
  if (Math.abs(hp - 1 / 6) < 1e-9) return '⅙';
  if (Math.abs(hp - 1 / 3) < 1e-9) return '⅓';
  return fractions[String(hp)] ?? String(hp);
}

/**
 * The motor voltage of NFPA 70's tables that serves a bus of `volts` (460 V for 480 V, 575 V for 600 V,
 * 230 V for 240 V…); undefined where none does.
 *
 * @example columnServing(480)?.column // 460
 */
export function columnServing(volts: number): (typeof MOTOR_VOLTAGE_COLUMNS)[number] | undefined {
  return MOTOR_VOLTAGE_COLUMNS.find(({ from, to }) => volts >= from * 0.995 && volts <= to * 1.005);
}

/**
 * A motor's rated voltage on a bus of `volts`: the column serving the bus in the table for its phases
 * (NFPA 70 Table 430.250 three-phase, 430.248 single-phase), else the bus voltage, as its full-load
 * current is read.
 *
 * @example motorRatedVolts(480, 3) // 460
 * @example motorRatedVolts(480, 1) // 480 (Table 430.248 has no 460 V column)
 */
export function motorRatedVolts(volts: number, phases: 1 | 3 = 3): number {
  const column = columnServing(volts)?.column;
  const table = phases === 1 ? TABLE_430_248 : TABLE_430_250;
  return column !== undefined && table.volts.includes(column) ? column : volts;
}
