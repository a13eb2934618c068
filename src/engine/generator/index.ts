export {
  baseOhmsOf,
  DEFAULT_GENERATOR_XR,
  GENERATOR_X0_FRACTION,
  generatorPath,
  ratedAmpsOf,
  requireGeneratorRating,
} from './rating.ts';
export type { GeneratorRating } from './rating.ts';
export { generatorDecrement } from './generatorDecrement.ts';
export type { GeneratorDecrement, GeneratorDecrementOptions } from './generatorDecrement.ts';
export { generatorSourceLevels } from './generatorSourceLevels.ts';
export type { GeneratorLevel, GeneratorSourceLevels } from './generatorSourceLevels.ts';
export { generatorDamageCurve, ARMATURE_THERMAL_CONSTANT, ARMATURE_THERMAL_SECONDS } from './generatorDamageCurve.ts';
export type { DamagePoint, GeneratorDamageCurveOptions, GeneratorWithstandCurve } from './generatorDamageCurve.ts';
export { decrementOperatingTime } from './decrementOperatingTime.ts';
export type { CurrentAgainstTime, DecrementOperatingTimeOptions } from './decrementOperatingTime.ts';
export { edgeOperationOnCurrent, edgeTimeOnCurrent } from './edgeTimeOnCurrent.ts';
export type { EdgeTimeOptions } from './edgeTimeOnCurrent.ts';
