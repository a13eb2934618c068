import { locationBusOf, type Network } from '../../engine/network/index.ts';
import type { View } from '../../engine/study/index.ts';
import type { SheetFaultLine } from '../../plot/sheetInput.ts';
import type { ScenarioView } from './scenarioParts.ts';

/** Relative difference under which two scenarios' fault currents at a bus are one line. */
const SAME_LEVEL = 1e-6;

/**
 * The maximum fault current of every scenario at a view's fault buses (`view.faults`, else the buses
 * its devices sit on), each drawn on the view's reference voltage and headed by its scenario's name;
 * line-to-ground on a ground-fault view, as the sheet's own lines are. A bus no source reaches in a
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
      const part = scenario.parts.find((p) => p.network.buses.has(busId));
      const level = part?.faults.buses.get(busId)?.max;
      if (!part || !level) continue;
      const ownAmps = view.groundFault ? level.lineToGround : level.threePhase;
      if (!(Number.isFinite(ownAmps) && ownAmps > 0)) continue;
      const same = lines.find(
        ({ line }) => line.busId === busId && Math.abs(line.ownAmps - ownAmps) <= SAME_LEVEL * ownAmps,
      );
      if (same) {
        same.scenarios.push(scenario.label);
        continue;
      }
      const ownVolts = part.network.buses.get(busId)!.voltage;
      lines.push({
        line: {
          busId,
          label: view.groundFault ? `${busId} L-G` : busId,
          amps: (ownAmps * ownVolts) / view.referenceVoltage,
          ownVolts,
          ownAmps,
          kind: 'max',
        },
        scenarios: [scenario.label],
      });
    }
  return lines.map(({ line, scenarios: labels }) => ({ ...line, scenario: labels.join(', ') }));
}
