/**
 * Conductor temperature for maximum fault (°C), a study's default: IEC 60909-0:2016 takes line
 * resistances at 20 °C for the maximum short-circuit currents (a reference temperature: conductors in
 * a colder place run cooler, and a study may set a lower one). NFPA 70 Chapter 9 Table 9 states its
 * resistances at 75 °C, a loaded conductor's: taken as they stand they understate the fault current of a
 * cable-fed bus, by up to 18 % (copper 254.5 / 309.5, aluminium 248 / 303) where the cable's resistance
 * alone sets it.
 */
export const MAXIMUM_FAULT_TEMPERATURE = 20;

/**
 * Conductor temperature for minimum fault (°C), a study's default: operating temperature, common
 * practice. IEC 60909-0:2016 takes the minimum short-circuit currents at the conductor's temperature at
 * the end of the fault, which a study may set (up to 250 °C, the short-circuit limit of XLPE and EPR
 * insulation in ICEA P-32-382).
 */
export const MINIMUM_FAULT_TEMPERATURE = 90;

/** The span a study's conductor temperatures may take (°C): a cold site's ambient to the short-circuit limit of XLPE and EPR insulation (ICEA P-32-382). */
export const CONDUCTOR_TEMPERATURE_SPAN = { min: -50, max: 250 } as const;
