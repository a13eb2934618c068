import type { Network } from '../network/index.ts';

/**
 * Whether two devices in series have no load connected in parallel with the downstream one, as the
 * study models them: the downstream device is the main of a bus whose feeding branch (a transformer or a
 * cable) the upstream device feeds, so everything the upstream device supplies passes through the
 * downstream one (a transformer's primary device and its one secondary main; a feeder and the main of the
 * panel it alone supplies). NFPA 70 708.54 does not ask such a pair to be selective (its Exception:
 * "between two overcurrent devices located in series if no loads are connected in parallel with the
 * downstream device"), and 700.32 and 701.32 carry the same Exception (from memory: check it against the
 * edition you work to). A bus between the two, where a load could be tapped, is never taken as bare.
 *
 * @example inSeriesAlone(network, 'R-T1', 'MAIN') // true: MAIN is the one main on T1's secondary
 */
export function inSeriesAlone(network: Network, upstreamId: string, downstreamId: string): boolean {
  const upstream = network.devices.get(upstreamId);
  const downstream = network.devices.get(downstreamId);
  if (!upstream || !downstream || !network.buses.has(downstream.feeds)) return false;
  const feeder = network.feederOf.get(downstream.feeds);
  return feeder !== undefined && feeder.type !== 'switch' && feeder.item.id === upstream.feeds;
}
