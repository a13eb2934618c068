/**
 * NFPA 70 240.6(A) standard ampere ratings of fuses and inverse-time breakers, with the additional
 * fuse ratings 1, 3, 6, 10 and 601 A (NFPA 70 2023, 240.6(A)).
 */
export const STANDARD_RATINGS = [
  15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500, 600,
  700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
] as const;

/** Fuse-only standard ratings of 240.6(A). */
export const ADDITIONAL_FUSE_RATINGS = [1, 3, 6, 10, 601] as const;

/**
 * The smallest standard rating at or above `amps` (the "next higher standard rating" of NEC 450.3
 * note 1 and 240.4(B)); `amps` itself above 6000 A.
 *
 * @example nextStandardRating(1875.2) // 2000
 */
export function nextStandardRating(amps: number, fuse = false): number {
  const list = fuse ? [...STANDARD_RATINGS, ...ADDITIONAL_FUSE_RATINGS].sort((a, b) => a - b) : STANDARD_RATINGS;
  for (const rating of list) if (rating >= amps - 1e-9) return rating;
  return amps;
}

/**
 * E ratings of medium-voltage power fuses commonly available (common practice; ANSI C37.46 defines the
 * E rating, not the series): the "next higher commercially available rating" of NEC Table 450.3(A)
 * note 1 for an E-rated fuse above 1000 V. Pass another series to `nextERating` where the fuse
 * maker's list differs.
 */
export const E_RATINGS = [10, 15, 20, 25, 30, 40, 50, 65, 80, 100, 125, 150, 175, 200, 250, 300, 400] as const;

/**
 * The smallest E rating of `series` at or above `amps`, or undefined above the series' largest.
 *
 * @example nextERating(86.8) // 100 (100E)
 */
export function nextERating(amps: number, series: readonly number[] = E_RATINGS): number | undefined {
  return series.find((rating) => rating >= amps * (1 - 1e-12));
}
