import { scaleBand } from '../../src/engine/band.ts';
import { sheetOf } from '../../src/plot/sheet.ts';
import { svgOf } from '../../src/plot/svg.ts';
import { fixtureInput } from '../plot/fixtures.ts';

/** Named SVG sheets from the hand-built bands (IEEE C37.112 VI relay, I²t breaker line); each becomes `tests/output/<name>.svg`. */
export const fixturePlots: Record<string, () => string> = {
  'fixture-relay-breaker': () => svgOf(sheetOf(fixtureInput())),
  // The same devices on a 12.47 kV base: 480 V curves move left by 480 / 12 470 (voltage-ratio reflection, IEEE 242) and the
  // fault line reads 28.4 kA @ 480 V = 1.09 kA @ 12.47 kV (hand-worked per-unit case (1500 kVA, 12.47 kV–480 V)).
  'fixture-primary-base': () => {
    const base = fixtureInput();
    const k = 480 / 12_470;
    return svgOf(
      sheetOf({
        ...base,
        title: 'Same devices on the 12.47 kV base',
        referenceVolts: 12_470,
        bands: base.bands.map((b) => ({ ...b, band: scaleBand(b.band, k) })),
        withstand: base.withstand.map((w) => ({ ...w, scale: w.scale * k })),
        starting: base.starting.map((s) => ({ ...s, scale: s.scale * k })),
        markers: base.markers.map((m) => ({ ...m, scale: m.scale * k })),
        faultLines: base.faultLines.map((f) => ({ ...f, amps: f.ownAmps * k })),
        regions: base.regions.map((r) => ({ ...r, fromAmps: r.fromAmps * k, toAmps: r.toAmps * k })),
      }),
    );
  },
  'fixture-small-sheet': () =>
    svgOf(sheetOf(fixtureInput({ timeRange: [0.001, 1000] }), { width: 640, height: 480, fontSize: 9 })),
};
