import { parseConductorSize } from './conductorSize.ts';

/**
 * NFPA 70 Table 310.16 (numbered 310.15(B)(16) in the 2014 and 2017 editions): allowable ampacities of
 * insulated conductors rated up to 2000 V, not more than three current-carrying conductors in a
 * raceway, cable or earth, 30 °C ambient; the 75 °C column, the one a conductor is used at where its
 * terminations are rated 75 °C (NFPA 70 110.14(C), common practice above 100 A). Amperes per
 * conductor, copper and aluminium (or copper-clad aluminium).
 *
 * Every size from memory, checked against public reproductions of the table; check them against the
 * edition you cite. Other installations (another ambient, more conductors, 60 °C terminations, cables
 * above 2000 V) give the cable's own `ampacity`.
 */
export const TABLE_310_16_75C: Readonly<Record<'copper' | 'aluminium', Readonly<Record<string, number>>>> =
  Object.freeze({
    copper: Object.freeze({
      '14 AWG': 20,
      '12 AWG': 25,
      '10 AWG': 35,
      '8 AWG': 50,
      '6 AWG': 65,
      '4 AWG': 85,
      '3 AWG': 100,
      '2 AWG': 115,
      '1 AWG': 130,
      '1/0': 150,
      '2/0': 175,
      '3/0': 200,
      '4/0': 230,
      '250 kcmil': 255,
      '300 kcmil': 285,
      '350 kcmil': 310,
      '400 kcmil': 335,
      '500 kcmil': 380,
      '600 kcmil': 420,
      '700 kcmil': 460,
      '750 kcmil': 475,
      '800 kcmil': 490,
      '900 kcmil': 520,
      '1000 kcmil': 545,
      '1250 kcmil': 590,
      '1500 kcmil': 625,
      '1750 kcmil': 650,
      '2000 kcmil': 665,
    }),
    aluminium: Object.freeze({
      '12 AWG': 20,
      '10 AWG': 30,
      '8 AWG': 40,
      '6 AWG': 50,
      '4 AWG': 65,
      '3 AWG': 75,
      '2 AWG': 90,
      '1 AWG': 100,
      '1/0': 120,
      '2/0': 135,
      '3/0': 155,
      '4/0': 180,
      '250 kcmil': 205,
      '300 kcmil': 230,
      '350 kcmil': 250,
      '400 kcmil': 270,
      '500 kcmil': 310,
      '600 kcmil': 340,
      '700 kcmil': 375,
      '750 kcmil': 385,
      '800 kcmil': 395,
      '900 kcmil': 425,
      '1000 kcmil': 445,
      '1250 kcmil': 485,
      '1500 kcmil': 520,
      '1750 kcmil': 545,
      '2000 kcmil': 560,
    }),
  });

/**
 * One conductor's ampacity from Table 310.16 at 75 °C, or `undefined` for a size the table does not
 * list in that material.
 *
 * @example tableAmpacity('500 kcmil', 'copper') // 380
 */
export function tableAmpacity(size: string, material: 'copper' | 'aluminium', path = 'size'): number | undefined {
  return TABLE_310_16_75C[material][parseConductorSize(size, path)];
}

/**
 * The ampacity of a cable's conductors, the current its overload protection is held to (NFPA 70 240.4):
 * the cable's own `ampacity` per conductor where given (another ambient, more current-carrying
 * conductors, 60 °C terminations), else Table 310.16 at 75 °C, times its parallel sets; `undefined` for
 * a size the table does not list in that material.
 *
 * @example cableAmpacityOf({ size: '250 kcmil', material: 'copper', sets: 2 }) // 510
 */
export function cableAmpacityOf(cable: {
  size: string;
  material: 'copper' | 'aluminium';
  sets: number;
  ampacity?: number;
}): number | undefined {
  const perConductor = cable.ampacity ?? tableAmpacity(cable.size, cable.material);
  return perConductor === undefined ? undefined : perConductor * cable.sets;
}
