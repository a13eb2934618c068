import { expectedGot, InputError } from '../errors.ts';

/** Areas of AWG sizes in circular mils (NFPA 70 Chapter 9 Table 8). */
export const AWG_AREA_CMIL: Readonly<Record<string, number>> = Object.freeze({
  '14 AWG': 4110,
  '12 AWG': 6530,
  '10 AWG': 10380,
  '8 AWG': 16510,
  '6 AWG': 26240,
  '4 AWG': 41740,
  '3 AWG': 52620,
  '2 AWG': 66360,
  '1 AWG': 83690,
  '1/0': 105600,
  '2/0': 133100,
  '3/0': 167800,
  '4/0': 211600,
});

const EXPECTED = 'a conductor size such as "4/0", "12 AWG" or "500 kcmil"';
const AWG = /^#?\s*(\d{1,2})\s*(?:awg)?$/i;
const AUGHT = /^([1-4])\s*\/\s*0\s*(?:awg)?$/i;
const KCMIL = /^(\d+(?:\.\d+)?)\s*(?:kcmil|mcm)$/i;

/**
 * Reads a conductor size as written on drawings and returns its canonical name: `"4/0"`,
 * `"4/0 AWG"` → `"4/0"`; `"12 AWG"`, `"#12"` → `"12 AWG"`; `"500 kcmil"`, `"250 MCM"` → `"500 kcmil"`,
 * `"250 kcmil"`. A bare number is refused because "250" could be read two ways.
 * Throws `InputError` naming `path` when the text is not a size.
 *
 * @example parseConductorSize('250 MCM', 'study.cables[0].size') // "250 kcmil"
 */
export function parseConductorSize(text: unknown, path = 'size'): string {
  const value = typeof text === 'string' ? text.trim() : '';
  const aught = AUGHT.exec(value);
  if (aught) return `${aught[1]}/0`;
  const kcmil = KCMIL.exec(value);
  if (kcmil && Number(kcmil[1]) > 0) return `${Number(kcmil[1])} kcmil`;
  const awg = AWG.exec(value);
  if (awg && /awg|#/i.test(value) && `${Number(awg[1])} AWG` in AWG_AREA_CMIL) return `${Number(awg[1])} AWG`;
  throw new InputError(path, expectedGot(EXPECTED, text));
}

/**
 * A conductor's cross-section in circular mils (cmil), for cable withstand (ICEA P-32-382):
 * AWG sizes from NEC Chapter 9 Table 8, kcmil sizes as size × 1000.
 *
 * @example conductorAreaCmil('4/0') // 211600
 * @example conductorAreaCmil('500 kcmil') // 500000
 */
export function conductorAreaCmil(size: string, path = 'size'): number {
  const canonical = parseConductorSize(size, path);
  if (canonical.endsWith(' kcmil')) return Number(canonical.slice(0, -' kcmil'.length)) * 1000;
  return AWG_AREA_CMIL[canonical];
}
