import { CAUTION } from '../../engine/caution.ts';
import { expectedGot, InputError } from '../../engine/errors.ts';
import { faultLevelsOf, type BusFault, type FaultLevels } from '../../engine/fault/index.ts';
import { networkOf } from '../../engine/network/index.ts';
import { significant } from '../../engine/quantity/index.ts';
import { hasScenarios, scenarioLabel, scenarioPartsOf, scenariosOf } from '../../engine/scenario/index.ts';
import type { Scenario, Study } from '../../engine/study/index.ts';
import { parseArgs } from '../args.ts';
import type { Command } from '../command.ts';
import { scenarioFlag } from '../scenarioFlag.ts';
import { loadStudyFile } from '../studyFile.ts';
import { formatTable, tableAmps } from '../table.ts';

const HELP = `discern faults <study.json> — bolted fault currents at every bus, maximum and minimum

  --json             print every bus and transformer result, with its work, as JSON
  --scenario NAME    one operating scenario only, by id or name (e.g. on-generator)
  --all-scenarios    every scenario one after another (the default)

A study with generators, switches or scenarios is worked out in every scenario, one after another,
each under a heading naming it (so the largest duty and the smallest fault of every way the system
is fed are both on the page); within a scenario each energised source's tree has its own table,
headed "fed from G1 (generator)". --scenario prints one scenario only. With --json, the top-level
buses are those of the first scenario's first tree and "scenarios" holds every scenario's trees.

Maximum: maximum source, motors contributing (first cycle), Table 9 cable resistance at 20 °C (IEC 60909-0).
Minimum: minimum source, no motors, Table 9 cable resistance at 90 °C. A study may set both temperatures
("conductorTemperatures": {"maximumFault": 20, "minimumFault": 90}, °C); a cable's own resistance is used as given.
Line-to-line and line-to-ground come from the sequence networks (Z2 = Z1): source Z0 as entered (else
Z0 = Z1, solidly grounded), transformer connection and neutral grounding, cable Z0 as entered (else 3 × Z1).
"at … kV" shows what a fault at the bus draws through the nearest transformer fed at that voltage, as
its line current there: motors on the bus's side of that transformer feed the fault without passing it.
Single-phase buses (below a single-phase transformer) show the full-winding fault as L-L and the
line-to-neutral (half-winding) fault as L-G; they have no three-phase fault.
`;

/**
 * `discern faults <study>`: a table of every bus (nominal voltage; three- or single-phase; max and min
 * three-phase, line-to-line and line-to-ground; X/R of the three-phase and line-to-ground faults; motor
 * contribution; what a fault there draws through the transformers above it, at their primary voltages), then each
 * transformer's secondary fault and its primary-side line currents.
 *
 * @example await faultsCommand.run(['demo/harrowmere-selective.json'], io)
 */
export const faultsCommand: Command = {
  verb: 'faults',
  summary: 'fault currents at every bus of a study, maximum and minimum, and reflected values',
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, {
      json: 'switch',
      scenario: 'value',
      'all-scenarios': 'switch',
      help: 'switch',
    });
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    const [path, extra] = parsed.positionals;
    if (extra !== undefined) throw new InputError('faults', expectedGot('one study file', extra));
    const study = loadStudyFile(path, io, 'faults');
    const only = scenarioFlag(parsed, study);
    if (!hasScenarios(study)) {
      const levels = faultLevelsOf(networkOf(study));
      io.stdout(
        parsed.flags.has('json') ? `${JSON.stringify(jsonOf(study, levels), null, 2)}\n` : textOf(study, levels),
      );
      return 0;
    }
    const scenarios = (only ? [only] : scenariosOf(study)).map((scenario) => scenarioLevelsOf(study, scenario));
    io.stdout(
      parsed.flags.has('json')
        ? `${JSON.stringify(scenariosJsonOf(study, scenarios), null, 2)}\n`
        : scenariosTextOf(study, scenarios),
    );
    return 0;
  },
};

/** One scenario's fault levels: each energised source's tree, the study's own source first. */
interface ScenarioLevels {
  scenario: Scenario;
  trees: { study: Study; levels: FaultLevels }[];
  deEnergised: string[];
}

// Accepts a study that can be switched and one of its scenarios; the fault levels of each tree.
function scenarioLevelsOf(study: Study, scenario: Scenario): ScenarioLevels {
  const parts = scenarioPartsOf(study, scenario);
  parts.sort((a, b) => Number(b.sourceId === study.source.id) - Number(a.sourceId === study.source.id));
  const trees = parts.map((part) => ({ study: part.study, levels: faultLevelsOf(networkOf(part.study)) }));
  const energised = new Set(parts.flatMap((part) => part.study.buses.map((b) => b.id)));
  return { scenario, trees, deEnergised: study.buses.filter((b) => !energised.has(b.id)).map((b) => b.id) };
}

// Accepts a tree's study; "fed from G1 (generator)".
function fedFrom(tree: Study): string {
  const { source } = tree;
  return `fed from ${source.id} (${source.kind === 'generator' ? 'generator' : 'utility'})`;
}

function scenariosTextOf(study: Study, scenarios: ScenarioLevels[]): string {
  const parts = [`${study.name}: bolted fault currents (symmetrical RMS), scenario by scenario`];
  for (const { scenario, trees, deEnergised } of scenarios) {
    parts.push('', `== Scenario: ${scenarioLabel(scenario)} (${scenario.id}) ==`);
    if (deEnergised.length > 0) parts.push(`de-energised: ${deEnergised.join(', ')}`);
    for (const tree of trees) parts.push('', `${fedFrom(tree.study)}:`, '', ...tablesOf(tree.study, tree.levels));
  }
  parts.push('', ...footer());
  return parts.join('\n');
}

function scenariosJsonOf(study: Study, scenarios: ScenarioLevels[]) {
  const first = scenarios[0].trees[0];
  return {
    ...jsonOf(study, first.levels),
    scenarios: scenarios.map(({ scenario, trees, deEnergised }) => ({
      id: scenario.id,
      name: scenarioLabel(scenario),
      deEnergised,
      trees: trees.map((tree) => ({
        source: tree.study.source.id,
        kind: tree.study.source.kind === 'generator' ? 'generator' : 'utility',
        ...levelsJson(tree.levels),
      })),
    })),
  };
}

function textOf(study: Study, levels: FaultLevels): string {
  return [
    `${study.name}: bolted fault currents (symmetrical RMS)`,
    '',
    ...tablesOf(study, levels),
    '',
    ...footer(),
  ].join('\n');
}

// Accepts one radial tree; the bus table, single-phase notes, transformer table and diagnostics as lines.
function tablesOf(study: Study, levels: FaultLevels): string[] {
  const voltages = [...new Set(study.buses.map((b) => b.voltage))].sort((a, b) => b - a);
  const buses = [...levels.buses.values()];
  const headers = [
    'bus',
    'kV',
    'system',
    '3φ max A',
    '3φ min A',
    'L-L max A',
    'L-L min A',
    'L-G max A',
    'L-G min A',
    'X/R 3φ',
    'X/R L-G',
    'motors A',
    ...voltages.map((v) => `at ${significant(v / 1000, 4)} kV max/min`),
  ];
  const ratio = (xr: number) => (Number.isNaN(xr) ? '—' : xr === Infinity ? '∞' : significant(xr, 3));
  const rows = buses.map((b) => {
    const single = b.phases === 1;
    return [
      b.busId,
      significant(b.volts / 1000, 4),
      single ? '1φ' : '3φ',
      single ? '—' : tableAmps(b.max.threePhase),
      single ? '—' : tableAmps(b.min.threePhase),
      tableAmps(b.max.lineToLine),
      tableAmps(b.min.lineToLine),
      tableAmps(b.max.lineToGround),
      tableAmps(b.min.lineToGround),
      ratio(b.max.xr),
      ratio(b.max.lineToGroundXr),
      tableAmps(b.max.motorAmps),
      ...voltages.map((v) => (v === b.volts ? 'here' : reflectedCell(b, v))),
    ];
  });
  const right = headers.map((_, c): 'left' | 'right' => (c === 0 || c === 2 ? 'left' : 'right'));
  const parts = [formatTable(headers, rows, right)];
  const singles = buses.filter((b) => b.phases === 1);
  if (singles.length > 0)
    parts.push(
      '',
      ...singles.map(
        (b) =>
          `${b.busId}: ${b.system}; L-L is the full-winding fault, L-G the ${b.system.includes('centre-tapped') ? 'line-to-neutral (half-winding)' : 'grounded-leg'} fault.`,
      ),
    );
  if (levels.transformers.size > 0) {
    const tHeaders = [
      'transformer',
      'kVA',
      'FLA pri A',
      'FLA sec A',
      'infinite bus A',
      'secondary max A',
      'through, at primary A',
      'L-L: worst primary line A',
      'L-G: worst primary line A',
    ];
    const tRows = [...levels.transformers.values()].map((t) => {
      const item = study.transformers.find((x) => x.id === t.transformerId)!;
      return [
        t.transformerId,
        significant(item.rating / 1000, 6),
        tableAmps(t.fullLoadAmps.primary),
        tableAmps(t.fullLoadAmps.secondary),
        tableAmps(t.infiniteBusAmps),
        tableAmps(t.secondaryAmps),
        tableAmps(t.reflectedToPrimary),
        tableAmps(Math.max(...t.unbalanced.lineToLine.primaryLineAmps)),
        tableAmps(Math.max(...t.unbalanced.lineToGround.primaryLineAmps)),
      ];
    });
    parts.push(
      '',
      'Transformer secondary faults',
      '',
      formatTable(
        tHeaders,
        tRows,
        tHeaders.map((_, c): 'left' | 'right' => (c === 0 ? 'left' : 'right')),
      ),
    );
  }
  if (levels.diagnostics.length > 0) parts.push('', ...levels.diagnostics.map((d) => `note: ${d}`));
  return parts;
}

// The method note and the caution that end the text output.
function footer(): string[] {
  return [
    'Unbalanced faults by symmetrical components with Z2 = Z1 (IEEE 399). Without entered data: a solidly grounded source with Z0 = Z1, transformer Z0 = Z1, cable Z0 = 3 × Z1, half-winding 1.5 × R and 1.2 × X (common practice).',
    CAUTION,
    '',
  ];
}

function reflectedCell(bus: BusFault, volts: number): string {
  const r = bus.reflected.find((x) => x.volts === volts);
  return r ? `${tableAmps(r.maxAmps)} / ${tableAmps(r.minAmps)}` : '';
}

function jsonOf(study: Study, levels: FaultLevels) {
  return { study: study.name, ...levelsJson(levels) };
}

function levelsJson(levels: FaultLevels) {
  return {
    buses: [...levels.buses.values()],
    transformers: [...levels.transformers.values()],
    diagnostics: levels.diagnostics,
  };
}
