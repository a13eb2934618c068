export { networkOf, pathTo, locationBusOf, upstreamDeviceOf, seriesPairs, transformersBetween } from './network.ts';
export type { Network, Branch, Element } from './network.ts';
