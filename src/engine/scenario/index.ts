export {
  scenariosOf,
  hasScenarios,
  scenarioLabel,
  sourcesInService,
  NORMAL_SCENARIO,
  GENERATOR_SCENARIO,
} from './scenarios.ts';
export { connectionsOf, energisedTrees, feedersIn, switchPosition } from './connections.ts';
export type { Connection, DoubleFeed } from './connections.ts';
export { scenarioPartsOf, splitScenario, switchSettingsOf, treeHolding } from './scenarioParts.ts';
export type { ScenarioPart, SwitchSetting } from './scenarioParts.ts';
export { analyseScenarios, scenarioNamed, scenarioResultOf } from './scenarioAnalysis.ts';
export type { ScenarioResult, ScenarioOptions } from './scenarioAnalysis.ts';
