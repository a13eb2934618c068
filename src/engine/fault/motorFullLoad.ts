import type { Motor } from '../study/index.ts';

/**
 * A motor's full-load current in amps at `volts` (line-to-line, three-phase): the nameplate value
 * when given; else from its kVA rating, `S / (√3 · V)`; else from horsepower taking 1 hp ≈ 1 kVA of
 * input for induction motors (common practice; NEC Table 430.250 values are close to it at 460 V).
 *
 * @example motorFullLoadAmps({ hp: 100, ... }, 460) // 125.5 A (table value 124 A, from memory)
 */
export function motorFullLoadAmps(motor: Pick<Motor, 'hp' | 'rating' | 'fullLoadAmps'>, volts: number): number {
  if (motor.fullLoadAmps !== undefined) return motor.fullLoadAmps;
  const va = motor.rating ?? (motor.hp ?? 0) * 1000;
  return va / (Math.sqrt(3) * volts);
}
