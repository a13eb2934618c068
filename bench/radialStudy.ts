// A generator of large radial studies for the P2 and P4 benchmarks: invented data with the demo's device
// mix — relays over service transformers, trip units with short-time (flat and I²t) and ground-fault
// elements, thermal-magnetic breakers and fuses (the illustrative templates in curves/), dry-type
// transformers and motors.
import { readFileSync } from 'node:fs';
import type { StudyInput } from '../src/engine/study/index.ts';
import { ROOT } from './root.ts';

type Characteristic = NonNullable<StudyInput['devices']>[number]['characteristic'];

/** The input form of a template in curves/, exactly as a study file would carry it. */
function template(file: string, id: string): Characteristic {
  const data = JSON.parse(readFileSync(`${ROOT}curves/${file}`, 'utf8')) as {
    templates: { id: string; characteristic: Characteristic }[];
  };
  const found = data.templates.find((t) => t.id === id);
  if (!found) throw new Error(`curves/${file}: no template ${id}`);
  return found.characteristic;
}

const BREAKER_30 = template('thermal-magnetic-illustrative.json', 'thermal-magnetic-illustrative-30');
const BREAKER_100 = template('thermal-magnetic-illustrative.json', 'thermal-magnetic-illustrative-100');
const FUSE_100 = template('fuse-illustrative-time-delay.json', 'fuse-illustrative-time-delay-100');
const FUSE_200 = template('fuse-illustrative-time-delay.json', 'fuse-illustrative-time-delay-200');

/** Devices per service transformer: a larger study has more substations, not a deeper tree. */
const PER_SUBSTATION = 400;

/**
 * A radial study with exactly `devices` devices. A 12.47 kV utility feeds one 2500 kVA Δ–Y
 * transformer per 400 devices, each behind an extremely inverse relay (with instantaneous and
 * tolerance) and under a 4000 A main (long-time, short-time, ground). Each main feeds 800 A feeders
 * (short-time, alternately flat and I²t, and ground) to panels; each panel feeds a mix of branch
 * devices: thermal-magnetic breakers and time-delay fuses on motors, 250 A trip units on sub-panels,
 * and every tenth panel a fused 112.5 kVA dry-type transformer to a 208 V panel with its own main.
 *
 * @example parseStudy(radialStudy(2000)).devices.length // 2000
 */
export function radialStudy(devices: number): StudyInput {
  const buses: StudyInput['buses'] = [{ id: 'MV', voltage: '12.47 kV' }];
  const transformers: NonNullable<StudyInput['transformers']> = [];
  const cables: NonNullable<StudyInput['cables']> = [];
  const motors: NonNullable<StudyInput['motors']> = [];
  const list: NonNullable<StudyInput['devices']> = [];
  const full = () => list.length >= devices;
  const add = (id: string, feeds: string, characteristic: Characteristic) => {
    if (!full()) list.push({ id, feeds, characteristic });
  };
  const cable = (id: string, from: string, to: string, size: string, length: number) =>
    cables.push({ id, from, to, size, length: `${length} ft` });

  let n = 0;
  for (let s = 0; !full(); s++) {
    const lv = `LV${s}`;
    buses.push({ id: lv, voltage: 480 });
    transformers.push({
      id: `T${s}`,
      from: 'MV',
      to: lv,
      rating: '2500 kVA',
      primary: '12.47 kV',
      secondary: 480,
      impedance: '5.75 %',
      xr: 7,
      connection: 'delta-wye',
    });
    add(`R${s}`, `T${s}`, {
      kind: 'relay',
      ct: '200:5',
      timeOvercurrent: { curve: 'ieee-extremely-inverse', pickup: 4, timeDial: 6 },
      instantaneous: { pickup: 80 },
      tolerance: { pickup: 5, time: 5 },
    });
    add(`MAIN${s}`, lv, {
      kind: 'trip-unit',
      sensor: 4000,
      longTime: { pickup: 0.8, delay: 10 },
      shortTime: { pickup: 4, delay: 0.4 },
      ground: { pickup: 0.3, delay: 0.5 },
    });
    const stop = list.length + PER_SUBSTATION - 2;
    for (let f = 0; !full() && list.length < stop; f++) {
      const panel = `P${s}-${f}`;
      buses.push({ id: panel, voltage: 480 });
      cable(`C${panel}`, lv, panel, '500 kcmil', 80 + 20 * (f % 5));
      add(`F${panel}`, `C${panel}`, {
        kind: 'trip-unit',
        sensor: 800,
        longTime: { pickup: 1, delay: 4 },
        shortTime: { pickup: 6, delay: 0.2, ...(f % 2 === 0 ? { i2t: true } : {}) },
        ground: { pickup: 0.5, delay: 0.2 },
      });
      for (let b = 0; b < 12 && !full() && list.length < stop; b++, n++) {
        const kind = b % 4;
        if (kind === 0 || kind === 1) {
          // A motor branch: thermal-magnetic breaker or time-delay fuse.
          const motor = `M${n}`;
          motors.push({ id: motor, bus: panel, hp: kind === 0 ? 15 : 40, accelerationTime: 3 });
          add(`B${n}`, motor, kind === 0 ? BREAKER_30 : FUSE_100);
        } else if (kind === 2 && f % 10 === 0) {
          // A fused dry-type transformer to a 208 V panel with its own main.
          const primary = `X${n}P`;
          const secondary = `X${n}S`;
          buses.push({ id: primary, voltage: 480 }, { id: secondary, voltage: 208 });
          cable(`C${primary}`, panel, primary, '4/0', 40);
          transformers.push({
            id: `TX${n}`,
            from: primary,
            to: secondary,
            rating: '112.5 kVA',
            primary: 480,
            secondary: 208,
            impedance: '3.5 %',
            xr: 2,
            connection: 'delta-wye',
            construction: 'dry',
          });
          add(`B${n}`, `C${primary}`, FUSE_200);
          add(`XM${n}`, secondary, {
            kind: 'trip-unit',
            sensor: 400,
            longTime: { pickup: 1, delay: 4 },
            instantaneous: { pickup: 10 },
          });
        } else {
          // A sub-panel on a 250 A trip unit, with one motor breaker below it.
          const sub = `S${n}`;
          buses.push({ id: sub, voltage: 480 });
          cable(`C${sub}`, panel, sub, '250 kcmil', 60 + 10 * (b % 3));
          add(`B${n}`, `C${sub}`, {
            kind: 'trip-unit',
            sensor: 250,
            longTime: { pickup: 1, delay: 5 },
            instantaneous: { pickup: 10 },
            ground: { pickup: 1, delay: 0.1 },
          });
          const motor = `M${n}`;
          motors.push({ id: motor, bus: sub, hp: 10, accelerationTime: 3 });
          add(`SB${n}`, motor, BREAKER_100);
        }
      }
    }
  }
  return {
    discern: 1,
    name: `generated radial study, ${devices} devices`,
    source: {
      kind: 'utility',
      id: 'U',
      bus: 'MV',
      max: { available: '500 MVA', xr: 15 },
      min: { available: '300 MVA', xr: 12 },
    },
    buses,
    transformers,
    cables,
    motors,
    devices: list,
    views: [
      {
        id: 'main',
        title: 'Service and first feeder',
        referenceVoltage: 480,
        devices: list.slice(0, 4).map((d) => d.id),
      },
    ],
  };
}
