import type { Scenario, Study } from '../study/index.ts';

/** The id of the scenario every study has when it declares none. */
export const NORMAL_SCENARIO = 'normal';
/** The id of the scenario added when a study with generators and transfer switches declares none. */
export const GENERATOR_SCENARIO = 'on-generator';

/**
 * The scenarios a study is analysed in: those it declares, in order; else "normal" (every switch in
 * its normal position, the utility source in service) and, when the study has generators and
 * transfer switches, "on generator" (the utility out, every generator in service, every transfer
 * switch on its emergency side) — the two states NFPA 70 700.32 asks an emergency system to be
 * selective in.
 *
 * @example scenariosOf(study).map((s) => s.id) // ['normal', 'on-generator']
 */
export function scenariosOf(study: Study): Scenario[] {
  if (study.scenarios.length > 0) return study.scenarios;
  const normal: Scenario = { id: NORMAL_SCENARIO, name: 'Normal', switches: {}, outOfService: [] };
  const transfers = study.switches.filter((item) => item.kind === 'transfer');
  if (study.generators.length === 0 || transfers.length === 0) return [normal];
  return [
    normal,
    {
      id: GENERATOR_SCENARIO,
      name: 'On generator',
      sources: study.generators.map((g) => g.id),
      switches: Object.fromEntries(transfers.map((item) => [item.id, 'emergency' as const])),
      outOfService: [],
    },
  ];
}

/** Whether a study can be switched at all: generators, switches or declared scenarios. */
export function hasScenarios(study: Study): boolean {
  return study.generators.length > 0 || study.switches.length > 0 || study.scenarios.length > 0;
}

/** A scenario's name as the user reads it. */
export function scenarioLabel(scenario: Scenario): string {
  return scenario.name ?? scenario.id;
}

/** The sources in service in a scenario: those it names, else the study's source alone. */
export function sourcesInService(study: Study, scenario: Scenario): string[] {
  return scenario.sources ?? [study.source.id];
}
