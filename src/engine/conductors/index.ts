export { NEC_TABLE_9, TABLE_9_SPAN, TABLE_9_TEMPERATURE } from './table9.ts';
export type { Table9Row } from './table9.ts';
export { parseConductorSize, conductorAreaCmil, AWG_AREA_CMIL } from './conductorSize.ts';
export { cableImpedanceOf, resistanceAtTemperature } from './cableImpedance.ts';
export type { CableImpedanceOptions } from './cableImpedance.ts';
export { TABLE_310_16_75C, cableAmpacityOf, tableAmpacity } from './table310_16.ts';
