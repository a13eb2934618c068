import type { Characteristic } from '../devices/index.ts';
import { INVERSE_CURVES } from '../devices/inverseCurves.ts';
import { formatAmps, significant } from '../quantity/format.ts';

/**
 * A device's settings in the trade's words, every value with its unit, one element per entry:
 * `['CT 600:5', '51 IEEE very inverse: pickup 4 A (480 A primary), time dial 2', …]`. For the
 * report's settings table and anyone reading a study without the workbench. A breaker's interrupting
 * time is given in cycles of the system `frequency` (Hz) too when it is a whole or half number of them,
 * as breakers are rated.
 * @example settingsText({ kind: 'fuse', label: '65E', … }) // ['fuse 65E', 'curve from 12 points']
 */
export function settingsText(characteristic: Characteristic, frequency = 60): string[] {
  const s = (value: number) => significant(value, 4);
  switch (characteristic.kind) {
    case 'relay': {
      const { ct, timeOvercurrent: toc, instantaneous: inst } = characteristic;
      const ratio = ct.primary / ct.secondary;
      const lines = [`CT ${s(ct.primary)}:${s(ct.secondary)}`];
      if (toc) {
        const time =
          toc.timeDial !== undefined
            ? `time dial ${s(toc.timeDial)}`
            : toc.timeMultiplier !== undefined
              ? `time multiplier ${s(toc.timeMultiplier)}`
              : `delay ${s(toc.delay ?? 0)} s`;
        lines.push(
          `time-overcurrent ${toc.curve === 'definite-time' ? 'definite-time' : INVERSE_CURVES[toc.curve].label}: pickup ${s(toc.pickup)} A (${formatAmps(toc.pickup * ratio)} primary), ${time}`,
        );
      }
      if (inst)
        lines.push(
          `instantaneous: pickup ${s(inst.pickup)} A (${formatAmps(inst.pickup * ratio)} primary), delay ${s(inst.delay)} s`,
        );
      lines.push(`breaker interrupting time ${cyclesText(characteristic.breakerTime, frequency)}`);
      return lines;
    }
    case 'trip-unit': {
      const { sensor, longTime, shortTime, instantaneous, ground } = characteristic;
      const lines = [`sensor ${formatAmps(sensor)}`];
      const ir = sensor * (longTime?.pickup ?? 1);
      if (longTime)
        lines.push(
          `long-time: pickup ${s(longTime.pickup)} × (${formatAmps(ir)}), delay ${s(longTime.delay)} s at ${s(longTime.delayAt)} × pickup`,
        );
      if (shortTime)
        lines.push(
          `short-time: pickup ${s(shortTime.pickup)} × pickup (${formatAmps(shortTime.pickup * ir)}), delay ${s(shortTime.delay)} s, I²t ${shortTime.i2t ? 'in' : 'out'}`,
        );
      if (instantaneous)
        lines.push(
          `instantaneous: pickup ${s(instantaneous.pickup)} × sensor (${formatAmps(instantaneous.pickup * sensor)})`,
        );
      if (ground)
        lines.push(
          `ground-fault: pickup ${s(ground.pickup)} × sensor (${formatAmps(ground.pickup * sensor)}), delay ${s(ground.delay)} s, I²t ${ground.i2t ? 'in' : 'out'}`,
        );
      return lines;
    }
    case 'thermal-magnetic': {
      const { rating, magnetic, label } = characteristic;
      const pickupAmps = magnetic.pickupAmps ?? (magnetic.pickup ?? 0) * rating;
      return [
        `${label ? `${label}, ` : ''}rating ${formatAmps(rating)}${characteristic.illustrative ? ' (illustrative curve)' : ''}`,
        `magnetic pickup ${formatAmps(pickupAmps)}${magnetic.pickup !== undefined ? ` (${s(magnetic.pickup)} × rating)` : ''}, tolerance ±${s(magnetic.tolerance)} %`,
      ];
    }
    case 'fuse':
      return [
        `fuse${characteristic.label ? ` ${characteristic.label}` : ''}${characteristic.illustrative ? ' (illustrative curve)' : ''}`,
        'minimum melting and total clearing from digitised points',
      ];
  }
}

/** A time as `5 cycles (0.08333 s)` when it is a whole or half number of cycles at `frequency`, else in seconds. */
function cyclesText(seconds: number, frequency: number): string {
  const halfCycles = seconds * frequency * 2;
  const whole = Math.round(halfCycles);
  if (whole === 0 || Math.abs(halfCycles - whole) > 1e-6 * whole) return `${significant(seconds, 4)} s`;
  return `${whole / 2} cycle${whole === 2 ? '' : 's'} (${significant(seconds, 4)} s)`;
}
