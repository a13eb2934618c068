import { locationBusOf, type Network } from '../../engine/network/index.ts';
import type { View } from '../../engine/study/index.ts';
import { busFaultLineOf } from '../../plot/busFaultLine.ts';
import type { SheetFaultLine } from '../../plot/sheetInput.ts';
import type { ScenarioView } from './scenarioParts.ts';

/** Relative difference under which two scenarios' fault currents at a bus are one line. */
const SAME_LEVEL = 1e-6;

/**
 * The maximum fault current of every scenario at a view's fault buses (`view.faults`, else the buses
 * its devices sit on), each drawn on the view's reference voltage as the sheet's own lines are
 * (`busFaultLineOf`: line-to-ground on a ground-fault view, through a transformer where the sheet is
 * at its primary) and headed by its scenario's name. A bus no source reaches in a
 * scenario has no line there; scenarios giving a bus the same current share one line naming them all.
 * `network` is the whole study's (it places devices whatever the scenario).
 *
 * @example scenarioFaultLinesOf(network, view, scenarios).map((f) => f.scenario) // ['Normal, Dock on the office feeder', 'On generator']
 */
export function scenarioFaultLinesOf(
  network: Network,
  view: Pick<View, 'devices' | 'faults' | 'referenceVoltage' | 'groundFault'>,
  scenarios: readonly ScenarioView[],
): SheetFaultLine[] {
  const busIds = view.faults ?? [
    ...new Set(
      view.devices.flatMap((id) => {
        const device = network.devices.get(id);
        return device ? [locationBusOf(network, device).id] : [];
      }),
    ),
  ];
  const lines: { line: SheetFaultLine; scenarios: string[] }[] = [];
  for (const busId of busIds)
    for (const scenario of scenarios) {
      const part = scenario.parts.find((p) => p.network.buses.has(busId) && p.faults.buses.has(busId));
      if (!part) continue;
      const line = busFaultLineOf(part.network, part.faults, busId, view.referenceVoltage, view.groundFault);
      if (!line) continue;
      const same = lines.find(
        (drawn) =>
          drawn.line.busId === busId &&
          Math.abs(drawn.line.amps - line.amps) <= SAME_LEVEL * line.amps &&
          Math.abs(drawn.line.ownAmps - line.ownAmps) <= SAME_LEVEL * line.ownAmps,
      );
      if (same) {
        same.scenarios.push(scenario.label);
        continue;
      }
      lines.push({ line, scenarios: [scenario.label] });
    }
  return lines.map(({ line, scenarios: labels }) => ({ ...line, scenario: labels.join(', ') }));
}
