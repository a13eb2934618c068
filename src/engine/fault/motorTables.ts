/**
 * Motor full-load currents of NFPA 70 (National Electrical Code) Article 430, Part XIV, as data:
 * Table 430.250 (three-phase alternating-current induction motors, squirrel-cage and wound-rotor)
 * and Table 430.248 (single-phase alternating-current motors), in amperes, by horsepower and rated
 * motor voltage. Values as printed in the 2008 edition; later editions keep the layout. Check them
 * against the edition adopted where the work is done.
 */

/** One table: the rated motor voltages (columns), then rows of `[hp, amps per column]` (`NaN`: not listed). */
export interface MotorCurrentTable {
  /** Table number as printed, e.g. "430.250". */
  table: string;
  /** Rated motor voltages of the columns (V). */
  volts: readonly number[];
  /** Rows in ascending horsepower; each current array follows `volts`. */
  rows: readonly (readonly [hp: number, amps: readonly number[]])[];
}

const _ = NaN;

/**
 * NFPA 70 Table 430.250, three-phase induction motors (A). Some later printings list ½ hp at 230 V
 * and 575 V as 2.1 A and 0.8 A and ¾ hp at 230 V as 3.1 A; check the edition adopted.
 */
export const TABLE_430_250: MotorCurrentTable = {
  table: '430.250',
  volts: [115, 200, 208, 230, 460, 575, 2300],
  rows: [
    [0.5, [4.4, 2.5, 2.4, 2.2, 1.1, 0.9, _]],
    [0.75, [6.4, 3.7, 3.5, 3.2, 1.6, 1.3, _]],
    [1, [8.4, 4.8, 4.6, 4.2, 2.1, 1.7, _]],
    [1.5, [12.0, 6.9, 6.6, 6.0, 3.0, 2.4, _]],
    [2, [13.6, 7.8, 7.5, 6.8, 3.4, 2.7, _]],
    [3, [_, 11.0, 10.6, 9.6, 4.8, 3.9, _]],
    [5, [_, 17.5, 16.7, 15.2, 7.6, 6.1, _]],
    [7.5, [_, 25.3, 24.2, 22, 11, 9, _]],
    [10, [_, 32.2, 30.8, 28, 14, 11, _]],
    [15, [_, 48.3, 46.2, 42, 21, 17, _]],
    [20, [_, 62.1, 59.4, 54, 27, 22, _]],
    [25, [_, 78.2, 74.8, 68, 34, 27, _]],
    [30, [_, 92, 88, 80, 40, 32, _]],
    [40, [_, 120, 114, 104, 52, 41, _]],
    [50, [_, 150, 143, 130, 65, 52, _]],
    [60, [_, 177, 169, 154, 77, 62, 16]],
    [75, [_, 221, 211, 192, 96, 77, 20]],
    [100, [_, 285, 273, 248, 124, 99, 26]],
    [125, [_, 359, 343, 312, 156, 125, 31]],
    [150, [_, 414, 396, 360, 180, 144, 37]],
    [200, [_, 552, 528, 480, 240, 192, 49]],
    [250, [_, _, _, _, 302, 242, 60]],
    [300, [_, _, _, _, 361, 289, 72]],
    [350, [_, _, _, _, 414, 336, 83]],
    [400, [_, _, _, _, 477, 382, 95]],
    [450, [_, _, _, _, 515, 412, 103]],
    [500, [_, _, _, _, 590, 472, 118]],
  ],
};

/** NFPA 70 Table 430.248, single-phase motors (A). */
export const TABLE_430_248: MotorCurrentTable = {
  table: '430.248',
  volts: [115, 200, 208, 230],
  rows: [
    [1 / 6, [4.4, 2.5, 2.4, 2.2]],
    [0.25, [5.8, 3.3, 3.2, 2.9]],
    [1 / 3, [7.2, 4.1, 4.0, 3.6]],
    [0.5, [9.8, 5.6, 5.4, 4.9]],
    [0.75, [13.8, 7.9, 7.6, 6.9]],
    [1, [16, 9.2, 8.8, 8.0]],
    [1.5, [20, 11.5, 11.0, 10]],
    [2, [24, 13.8, 13.2, 12]],
    [3, [34, 19.6, 18.7, 17]],
    [5, [56, 32.2, 30.8, 28]],
    [7.5, [80, 46.0, 44.0, 40]],
    [10, [100, 57.5, 55.0, 50]],
  ],
};

/**
 * Which rated-motor-voltage column serves a bus: the tables' headings permit the 115, 230, 460 and
 * 575 V columns for systems of 110–120, 220–240, 440–480 and 550–600 V; the 200 and 208 V columns
 * serve 200 V and 208 V systems only; the 2300 V column serves 2300–2400 V (common practice). A
 * bus within 0.5 % of a range counts as in it (a nominal voltage entered with rounding).
 */
export const MOTOR_VOLTAGE_COLUMNS: readonly { column: number; from: number; to: number }[] = [
  { column: 115, from: 110, to: 120 },
  { column: 200, from: 200, to: 200 },
  { column: 208, from: 208, to: 208 },
  { column: 230, from: 220, to: 240 },
  { column: 460, from: 440, to: 480 },
  { column: 575, from: 550, to: 600 },
  { column: 2300, from: 2300, to: 2400 },
];
