export {
  characteristicSchema,
  createCharacteristicSchema,
  DEVICE_KINDS,
  type Characteristic,
  type CharacteristicInput,
} from './characteristic.ts';
export { compositeEdge, definiteElement, i2tElement, uniqueAscending } from './composite.ts';
export type { CompositeEdge, EdgeElement } from './composite.ts';
export { fuseBand, fuseSchema, type Fuse } from './fuse.ts';
export {
  INVERSE_CURVES,
  INVERSE_CURVE_NAMES,
  inverseMultiple,
  inverseTime,
  resetTime,
  type InverseCurveConstants,
  type InverseCurveName,
  type ResetTimeOptions,
} from './inverseCurves.ts';
export { isValidTable, pointProblem, pointTableSchema, tableElement, upperBelowLower } from './pointTable.ts';
export type { PointTable, PointTableOptions } from './pointTable.ts';
export { parsePointsCsv, type PointsCsv } from './pointsCsv.ts';
export { readCharacteristic, type ReadCharacteristicOptions } from './readCharacteristic.ts';
export { createRelaySchema, relayBand, relaySchema, RELAY_CURVES, type Relay } from './relay.ts';
export { createThermalMagneticSchema, thermalMagneticBand, thermalMagneticSchema } from './thermalMagnetic.ts';
export type { ThermalMagnetic } from './thermalMagnetic.ts';
export {
  createTripUnitSchema,
  groundBandOf,
  LONG_TIME_RAMPS,
  longTimeRampBasis,
  tripUnitBand,
  tripUnitSchema,
  type TripUnit,
} from './tripUnit.ts';
