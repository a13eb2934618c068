export { motorFullLoadAmps, motorFullLoadOf, tableFullLoadAmps } from './motorFullLoad.ts';
export type { MotorFullLoad, MotorFullLoadInput } from './motorFullLoad.ts';
export { MOTOR_VOLTAGE_COLUMNS, TABLE_430_248, TABLE_430_250 } from './motorTables.ts';
export type { MotorCurrentTable } from './motorTables.ts';
export {
  addImpedance,
  scaleImpedance,
  magnitudeOf,
  xrOf,
  impedanceOfMagnitude,
  invertImpedance,
  parallelImpedance,
  formatImpedance,
  multiplyComplex,
  divideComplex,
  ZERO_IMPEDANCE,
} from './impedance.ts';
export type { Impedance } from './impedance.ts';
export { sourceImpedanceOf, sourcePowerOf } from './sourceImpedance.ts';
export type { SourceLevel } from './sourceImpedance.ts';
export {
  transformerImpedanceOf,
  fullLoadAmpsOf,
  effectivePerUnit,
  IMPEDANCE_TOLERANCE,
} from './transformerImpedance.ts';
export type { TransformerData } from './transformerImpedance.ts';
export { motorImpedanceOf, motorRatingText, DEFAULT_MOTOR_XR } from './motorImpedance.ts';
export { reflectAmps, reflectImpedance } from './reflect.ts';
export {
  DELTA_WYE_TABLE,
  unbalancedLineCurrents,
  shiftFactorsOf,
  isGroundedSecondary,
  isPhaseShifting,
} from './deltaWye.ts';
export type { Connection, FaultType, UnbalancedCase, UnbalancedCurrents } from './deltaWye.ts';
export { faultTreeOf, isSinglePhase } from './faultTree.ts';
export type { FaultCondition, FaultTree } from './faultTree.ts';
export { faultLevelsOf } from './faultLevels.ts';
export { MAXIMUM_FAULT_TEMPERATURE, MINIMUM_FAULT_TEMPERATURE } from './conductorTemperatures.ts';
export type { FaultLevel, BusFault, TransformerFault, FaultLevels } from './faultLevels.ts';
export { transformerFaultOf } from './transformerFault.ts';
export { transformerCalculation } from './transformerCalculation.ts';
export type { TransformerCalculationInput, TransformerCalculation } from './transformerCalculation.ts';
export { num, impedanceStep } from './workSteps.ts';
export { stepsTo, faultSteps, zeroSequenceStepsTo, singlePhaseSteps } from './faultWork.ts';
export { withLazy, withLazySteps, withLazyWork } from './workSteps.ts';
export { asymmetryOf } from './asymmetry.ts';
export {
  zeroSequenceOf,
  sourceZeroSequenceOf,
  cableZeroSequenceOf,
  neutralImpedanceOf,
  CABLE_ZERO_SEQUENCE_MULTIPLE,
} from './zeroSequence.ts';
export type { Grounding, ZeroSequenceNetwork } from './zeroSequence.ts';
export {
  singlePhaseBusesOf,
  primaryConnectionOf,
  secondaryWindingOf,
  HALF_WINDING_MULTIPLIERS,
} from './singlePhase.ts';
export type { SinglePhaseBus, SinglePhaseLoop } from './singlePhase.ts';
export { throughFaultOf } from './throughFault.ts';
export type { ThroughFault } from './throughFault.ts';
export { deviceFaultOf, largestFaultOf } from './deviceFault.ts';
export type { DeviceFault } from './deviceFault.ts';
