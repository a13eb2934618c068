export type { WithstandCurve, Marker, StartingCurve } from './withstand.ts';
export { transformerCategoryOf, CATEGORY_LIMITS_KVA } from './transformerCategory.ts';
export type { TransformerCategory } from './transformerCategory.ts';
export { transformerRatedAmps } from './transformerRatedAmps.ts';
export {
  thermalCurveOf,
  THERMAL_I2T,
  LIQUID_THERMAL_TABLE,
  LIQUID_JOIN_SECONDS,
  DRY_LONGEST_SECONDS,
} from './transformerThermal.ts';
export type { ThermalCurve } from './transformerThermal.ts';
export {
  transformerWithstandOf,
  throughFaultReachOf,
  MECHANICAL_FRACTION,
  MECHANICAL_SECONDS_AT_MAX,
} from './transformerWithstand.ts';
export type { TransformerWithstandOptions } from './transformerWithstand.ts';
export {
  CABLE_OVERLOAD_NOTE,
  cableWithstandOf,
  ICEA_CONDUCTOR,
  ICEA_LONGEST_SECONDS,
  ICEA_TEMPERATURES,
} from './cableWithstand.ts';
export type { CableWithstandOptions } from './cableWithstand.ts';
export { scaleWithstand } from './scaleWithstand.ts';
export type { ScaleWithstandOptions } from './scaleWithstand.ts';
export { inrushMarkersOf, inferInrushMultiple, INRUSH } from './inrush.ts';
export type { InrushOptions } from './inrush.ts';
export { motorStartingOf, startingPointsOf, STARTING_TIMES, type StartingPoints } from './motorStarting.ts';
export type { MotorStartingOptions, MotorStarting } from './motorStarting.ts';
export { lockedRotorAmpsFromCode, LOCKED_ROTOR_KVA_PER_HP } from './lockedRotorCode.ts';
