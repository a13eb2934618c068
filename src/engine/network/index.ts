export {
  closedSwitchLinks,
  networkOf,
  pathTo,
  locationBusOf,
  upstreamDeviceOf,
  seriesPairs,
  transformersBetween,
} from './network.ts';
export type { Network, Branch, Element, SwitchLink } from './network.ts';
export { sameNetworkInputs } from './sameNetworkInputs.ts';
