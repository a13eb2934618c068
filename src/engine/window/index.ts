export { settingWindowOf, windowIn, overridesOf } from './settingWindow.ts';
export type { SettingWindow, SettingWindowOptions, SettingRow, SwitchRow } from './settingWindow.ts';
export { constraintsOf } from './constraints.ts';
export type { Constraint, ConstraintKind, ConstraintResult, ConstraintsOptions, Favours } from './constraints.ts';
export { notKeptOf, recommendationOf, TIE_BREAK } from './recommendation.ts';
export type {
  Recommendation,
  RecommendedSetting,
  ConstraintMargin,
  Attempt,
  RecommendationOptions,
} from './recommendation.ts';
export { noWindowOf } from './noWindow.ts';
export type { NoWindow, Remedy, NoWindowOptions } from './noWindow.ts';
export { feasibleMapOf } from './feasibleMap.ts';
export type { FeasibleMap, MapAxis, MapColumn } from './feasibleMap.ts';
export { intervalOf, bindingOf, rangeBinding } from './settingInterval.ts';
export type { Binding, SettingInterval, SettingAxis } from './settingInterval.ts';
export { thresholdOf, EDGE_TOLERANCE } from './threshold.ts';
export type { Threshold } from './threshold.ts';
export {
  adjustableSettingsOf,
  switchesOf,
  characteristicWith,
  deviceWith,
  settingValue,
  mainPairsOf,
} from './settings.ts';
export type {
  SettingSpec,
  SwitchSpec,
  SettingValue,
  SettingRangeOverride,
  AdjustableSettingsOptions,
} from './settings.ts';
export { settingText, changesText } from './settingText.ts';
export { trialOf } from './trial.ts';
export type { Trial, ProtectedElements } from './trial.ts';
export { proposeSettings, PROPOSAL_ORDER } from './proposal.ts';
export type { Proposal, ProposalOptions, DeviceProposal, SettingChange } from './proposal.ts';
export { withSettingChanges } from './settingChanges.ts';
export type { DocumentSettingChange } from './settingChanges.ts';
export type { Memo } from './evaluation.ts';
export { evaluateAt } from './evaluation.ts';
