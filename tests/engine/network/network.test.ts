import { describe, expect, it } from 'vitest';
import {
  locationBusOf,
  networkOf,
  pathTo,
  seriesPairs,
  transformersBetween,
  upstreamDeviceOf,
  type Network,
} from '../../../src/engine/network/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { radialStudy } from '../../../bench/radialStudy.ts';

/** The Harrowmere network (invented, the demo studies), kept here so the network tests do not move with the demo files. */
const demo: StudyInput = {
  discern: 1,
  name: 'Harrowmere network',
  source: { kind: 'utility', id: 'UTIL', bus: 'MV', max: { available: '250 MVA', xr: 12 } },
  buses: [
    { id: 'MV', voltage: '12.47 kV' },
    { id: 'SWBD', voltage: 480 },
    { id: 'MCC', voltage: 480 },
    { id: 'DOCK', voltage: 480 },
    { id: 'OFC-P', voltage: 480 },
    { id: 'OFC', voltage: 208 },
  ],
  transformers: [
    { id: 'T1', from: 'MV', to: 'SWBD', rating: 1500, primary: '12.47 kV', secondary: 480, impedance: 5.75, xr: 6 },
    { id: 'T2', from: 'OFC-P', to: 'OFC', rating: 112.5, primary: 480, secondary: 208, impedance: 3.5, xr: 2 },
  ],
  cables: [
    { id: 'C-MCC', from: 'SWBD', to: 'MCC', size: '500 kcmil', sets: 2, length: 100 },
    { id: 'C-DOCK', from: 'SWBD', to: 'DOCK', size: '500 kcmil', length: 150 },
    { id: 'C-OFC', from: 'SWBD', to: 'OFC-P', size: '1/0', length: 60 },
  ],
  motors: [
    { id: 'M-COMP1', bus: 'MCC', hp: 150 },
    { id: 'M-COMP2', bus: 'MCC', hp: 150 },
  ],
};

const network = networkOf(parseStudy(demo));

describe('networkOf', () => {
  it('has the expected defaults', () => {
    // Every bus indexed; the source bus has no feeder; branches keep study order.
    expect([...network.buses.keys()]).toEqual(['MV', 'SWBD', 'MCC', 'DOCK', 'OFC-P', 'OFC']);
    expect(network.feederOf.has('MV')).toBe(false);
    expect(network.branchesFrom.get('SWBD')!.map((b) => b.item.id)).toEqual(['C-MCC', 'C-DOCK', 'C-OFC']);
    expect(network.motorsOn.get('MCC')!.map((m) => m.id)).toEqual(['M-COMP1', 'M-COMP2']);
  });

  it('pathTo walks from the source bus down to a motor, alternating buses and branches', () => {
    expect(pathTo(network, 'M-COMP1')).toEqual(['MV', 'T1', 'SWBD', 'C-MCC', 'MCC', 'M-COMP1']);
    expect(pathTo(network, 'OFC')).toEqual(['MV', 'T1', 'SWBD', 'C-OFC', 'OFC-P', 'T2', 'OFC']);
    expect(pathTo(network, 'MV')).toEqual(['MV']);
    expect(pathTo(network, 'T2')).toEqual(['MV', 'T1', 'SWBD', 'C-OFC', 'OFC-P', 'T2']);
  });

  it('pathTo refuses an unknown element', () => {
    expect(() => pathTo(network, 'NOPE')).toThrow(/^no element "NOPE" in the network$/);
  });

  it('transformersBetween lists the transformers crossed, in order, either way', () => {
    expect(transformersBetween(network, 'OFC', 'MV').map((t) => t.id)).toEqual(['T2', 'T1']);
    expect(transformersBetween(network, 'MV', 'OFC').map((t) => t.id)).toEqual(['T1', 'T2']);
    expect(transformersBetween(network, 'MCC', 'DOCK')).toEqual([]);
    expect(transformersBetween(network, 'MCC', 'OFC').map((t) => t.id)).toEqual(['T2']);
    expect(() => transformersBetween(network, 'MCC', 'NOWHERE')).toThrow(/no bus "NOWHERE"/);
  });

  it('transformersBetween agrees with the two paths from the source on every pair of buses', () => {
    // The paths' reference: below their last shared element, up one path and down the other.
    const byPaths = (from: string, to: string) => {
      const up = pathTo(generatedNetwork, from);
      const down = pathTo(generatedNetwork, to);
      let common = 0;
      while (common < up.length && common < down.length && up[common] === down[common]) common++;
      return [...up.slice(common).reverse(), ...down.slice(common)].filter(
        (id) => generatedNetwork.elements.get(id)?.type === 'transformer',
      );
    };
    const generatedNetwork = networkOf(parseStudy(radialStudy(300)));
    const buses = [...generatedNetwork.buses.keys()];
    let crossing = 0;
    for (const from of buses)
      for (const to of buses) {
        const ids = transformersBetween(generatedNetwork, from, to).map((t) => t.id);
        expect(ids).toEqual(byPaths(from, to));
        if (ids.length > 1) crossing++;
      }
    expect(crossing).toBeGreaterThan(0);
  });
});

describe("the tree's facts, worked out once", () => {
  // The reference: the path from the source, walked for each element as the checks once did.
  const generatedNetwork = networkOf(parseStudy(radialStudy(300)));
  const byPath = (target: Network, elementId: string) => {
    const path = pathTo(target, elementId);
    const device = path.findLast((id) => target.deviceFeeding.has(id));
    return device === undefined ? undefined : target.deviceFeeding.get(device);
  };

  it('gives every element the protecting device and location bus its path from the source gives', () => {
    let elements = 0;
    for (const [id, element] of generatedNetwork.elements) {
      expect(generatedNetwork.protectors.get(id)).toBe(byPath(generatedNetwork, id)?.id);
      expect(generatedNetwork.protectors.has(id)).toBe(true);
      const bus = element.type === 'bus' ? id : element.type === 'motor' ? element.item.bus : element.item.from;
      expect(generatedNetwork.locations.get(id)!.id).toBe(bus);
      elements++;
    }
    expect(elements).toBeGreaterThan(300);
    for (const device of generatedNetwork.study.devices) {
      const path = pathTo(generatedNetwork, device.feeds);
      const above = path.slice(0, -1).findLast((id) => generatedNetwork.deviceFeeding.has(id));
      expect(upstreamDeviceOf(generatedNetwork, device)?.id).toBe(
        above === undefined ? undefined : generatedNetwork.deviceFeeding.get(above)!.id,
      );
    }
  });

  it('takes a part with a top bus of its own as a tree of its own, and leaves out a loop (studies the tree rules refuse)', () => {
    // An island: bus ISLAND fed from bus ISLAND-TOP, which nothing feeds.
    const study = parseStudy(demo);
    const islandTop = { ...study.buses[1], id: 'ISLAND-TOP' };
    const island = { ...study.buses[1], id: 'ISLAND' };
    const link = { ...study.cables[0], id: 'C-ISLAND', from: 'ISLAND-TOP', to: 'ISLAND' };
    const feeder = { ...study.devices[0], id: 'B-ISLAND', feeds: 'C-ISLAND' };
    const below = { ...study.devices[0], id: 'B-BELOW', feeds: 'ISLAND' };
    const withIsland = networkOf({
      ...study,
      buses: [...study.buses, islandTop, island],
      cables: [...study.cables, link],
      devices: [...study.devices, feeder, below],
    });
    // ISLAND-TOP has no feeder, so it tops a tree of its own, as the walkers climb it.
    expect(withIsland.depths.get('ISLAND')).toBe(1);
    expect(withIsland.protectors.get('C-ISLAND')).toBe('B-ISLAND');
    expect(withIsland.protectors.get('ISLAND')).toBe('B-BELOW');
    expect(byPath(withIsland, 'ISLAND')?.id).toBe('B-BELOW');
    expect(upstreamDeviceOf(withIsland, below)?.id).toBe('B-ISLAND');
    expect(locationBusOf(withIsland, below).id).toBe('ISLAND');
    expect(transformersBetween(withIsland, 'ISLAND', 'MV')).toEqual([]);
    // Two buses feeding each other top no tree: no fact is worked out for them.
    const loopA = { ...study.buses[1], id: 'LOOP-A' };
    const loopB = { ...study.buses[1], id: 'LOOP-B' };
    const withLoop = networkOf({
      ...study,
      buses: [...study.buses, loopA, loopB],
      cables: [
        ...study.cables,
        { ...study.cables[0], id: 'C-AB', from: 'LOOP-A', to: 'LOOP-B' },
        { ...study.cables[0], id: 'C-BA', from: 'LOOP-B', to: 'LOOP-A' },
      ],
    });
    expect(['LOOP-A', 'LOOP-B', 'C-AB', 'C-BA'].filter((id) => withLoop.protectors.has(id))).toEqual([]);
    expect(withLoop.depths.has('LOOP-A')).toBe(false);
    expect(withLoop.depths.get('MCC')).toBe(2);
  });
});

describe('series pairs', () => {
  const devices = [
    { id: 'R-MAIN', feeds: 'T1' },
    { id: 'B-MAIN', feeds: 'SWBD' },
    { id: 'B-MCC', feeds: 'C-MCC' },
    { id: 'B-OFC', feeds: 'C-OFC' },
    { id: 'B-OFC2', feeds: 'T2' },
    { id: 'OL-1', feeds: 'M-COMP1' },
  ];
  const fake = networkOf({ ...network.study, devices: devices as never });

  it('seriesPairs pairs each device with the nearest device above it', () => {
    const pairs = seriesPairs(fake).map(
      (p) => `${(p.upstream as { id: string }).id}>${(p.downstream as { id: string }).id}`,
    );
    expect(pairs).toEqual(['R-MAIN>B-MAIN', 'B-MAIN>B-MCC', 'B-MAIN>B-OFC', 'B-OFC>B-OFC2', 'B-MCC>OL-1']);
  });

  it('upstreamDeviceOf is undefined at the top, and locationBusOf is where the device sits', () => {
    expect(upstreamDeviceOf(fake, devices[0] as never)).toBeUndefined();
    expect(locationBusOf(fake, devices[0] as never).id).toBe('MV');
    expect(locationBusOf(fake, devices[1] as never).id).toBe('SWBD');
    expect(locationBusOf(fake, devices[5] as never).id).toBe('MCC');
  });
});
