import type { CoordinationSettings } from '../study/index.ts';

/** A device family as the margin tables see it (the `kind` of a characteristic). */
export type Family = 'relay' | 'trip-unit' | 'thermal-magnetic' | 'fuse' | string;

/** The required separation for one kind of pair, and where the number comes from. */
export interface MarginRule {
  /** Seconds the upstream earliest time must exceed the downstream clearing time by. */
  margin: number;
  /** Fraction of the upstream earliest time the downstream clearing must stay under (1 = plain margin). */
  timeRatio: number;
  /** Why, for the finding's basis line. */
  basis: string;
}

const LV_BREAKER = new Set(['trip-unit', 'thermal-magnetic']);

/**
 * Default margins by pair kind (IEEE 242 ch. 15). Every band already contains its own tolerance and
 * clearing time (a relay band's maxTime includes the breaker), so the margins below are what is left:
 * relay overtravel and setting error, not the downstream breaker time again.
 */
export function defaultMarginRule(up: Family, down: Family, fuseRatio = 0.75): MarginRule {
  if (up === 'relay' && down === 'relay') {
    return {
      margin: 0.12,
      timeRatio: 1,
      basis:
        '0.12 s relay over relay, downstream band includes its breaker time (IEEE 242 ch. 15 coordination time interval less the breaker time, digital relays; 0.22 s for electromechanical; a default to check against the edition you work to, set in coordination.margins)',
    };
  }
  if (up === 'relay') {
    return {
      margin: 0.2,
      timeRatio: 1,
      basis: `0.2 s relay over a ${down} band (IEEE 242 ch. 15, relay over fuse or LV breaker; a default to check against the edition you work to, set in coordination.margins)`,
    };
  }
  if (up === 'fuse' && down === 'fuse') {
    return {
      margin: 0,
      timeRatio: fuseRatio,
      basis: `downstream total clearing ≤ ${fuseRatio * 100} % of upstream minimum melting (common practice)`,
    };
  }
  // A fuse's minimum-melting curve is drawn at 25 °C with no load; a loaded fuse melts sooner. Above a
  // relay or a breaker its melting time is taken at the same fraction as for a fuse below it.
  const preload = `upstream minimum melting taken at ${fuseRatio * 100} % for preloading (common practice)`;
  if (up === 'fuse' && down === 'relay') {
    return {
      margin: 0.1,
      timeRatio: fuseRatio,
      basis: `0.1 s fuse minimum melting over relay plus breaker time, ${preload}`,
    };
  }
  if (up === 'fuse' && LV_BREAKER.has(down)) {
    return {
      margin: 0,
      timeRatio: fuseRatio,
      basis: `no overlap of the bands, the breaker's including tolerance and clearing time; ${preload}`,
    };
  }
  if (LV_BREAKER.has(up) && (LV_BREAKER.has(down) || down === 'fuse')) {
    return {
      margin: 0,
      timeRatio: 1,
      basis: 'no overlap of the bands: both include tolerance and clearing time (common practice)',
    };
  }
  return { margin: 0.1, timeRatio: 1, basis: '0.1 s (common practice)' };
}

/**
 * The margin rule for a pair: the study's `coordination.pairs` entry for exactly this pair first, then
 * a `margin` on the upstream device, then the study's `coordination.margins["up/down"]`, then the defaults.
 *
 * @example marginRuleOf('relay', 'fuse', settings, undefined) // { margin: 0.2, … }
 */
export function marginRuleOf(
  up: Family,
  down: Family,
  settings: CoordinationSettings,
  deviceMargin?: number,
  pair?: { upstream: string; downstream: string },
): MarginRule {
  const base = defaultMarginRule(up, down, settings.fuseRatio);
  // Rules are written out, not `{ ...base, margin }`: V8 gives each object made so a hidden class of its own.
  const { timeRatio } = base;
  const own = pair && settings.pairs.find((p) => p.upstream === pair.upstream && p.downstream === pair.downstream);
  if (own) return { margin: own.margin, timeRatio, basis: `${own.margin} s set in the study for this pair` };
  if (deviceMargin !== undefined)
    return { margin: deviceMargin, timeRatio, basis: `${deviceMargin} s set on the upstream device` };
  const studyMargin = settings.margins[`${up}/${down}`];
  if (studyMargin !== undefined)
    return { margin: studyMargin, timeRatio, basis: `${studyMargin} s set in the study for ${up}/${down} pairs` };
  return base;
}
