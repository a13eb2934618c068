export {
  characteristicSchema,
  createCharacteristicSchema,
  DEVICE_KINDS,
  type Characteristic,
  type CharacteristicInput,
} from './characteristic.ts';
export { compositeEdge, definiteElement, i2tElement, uniqueAscending } from './composite.ts';
export type { CompositeEdge, EdgeElement } from './composite.ts';
export { fuseBand } from './fuse.ts';
export { fuseSchema, type Fuse } from './fuseSchema.ts';
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
export { isValidTable, pointProblem, tableElement, upperBelowLower } from './pointTable.ts';
export { pointTableSchema } from './pointTableSchema.ts';
export type { PointTable, PointTableOptions } from './pointTable.ts';
export { parsePointsCsv, type PointsCsv } from './pointsCsv.ts';
export { characteristicProblems, readCharacteristic, type ReadCharacteristicOptions } from './readCharacteristic.ts';
export { relayBand } from './relay.ts';
export { createRelaySchema, relaySchema, RELAY_CURVES, type Relay } from './relaySchema.ts';
export { thermalMagneticBand } from './thermalMagnetic.ts';
export { createThermalMagneticSchema, thermalMagneticSchema, type ThermalMagnetic } from './thermalMagneticSchema.ts';
export { groundBandOf, longTimeRampBasis, tripUnitBand } from './tripUnit.ts';
export { createTripUnitSchema, LONG_TIME_RAMPS, tripUnitSchema, type TripUnit } from './tripUnitSchema.ts';
