/**
 * Colour conventions for figures and maps (design rule: perceptually uniform
 * sequential maps for intensity/misfit, a diverging map centred on zero for
 * signed quantities, colour-blind-safe categories). Scheme names are those of
 * d3-scale-chromatic, which Observable Plot accepts directly.
 */
export const SEQUENTIAL_ACTIVITY = 'YlOrBr' as const; // warm, matches the storm amber
export const SEQUENTIAL_MISFIT = 'viridis' as const; // perceptually uniform (van der Walt & Smith 2015)
export const DIVERGING_SIGNED = 'PuOr' as const; // centred with `pivot: 0`

/** Okabe & Ito (2008) colour-blind-safe categorical palette. */
export const CATEGORICAL = ['#0072B2', '#E69F00', '#009E73', '#CC79A7', '#56B4E9', '#D55E00', '#F0E442', '#000000'] as const;

export function categoryColour(i: number): string {
  return CATEGORICAL[((i % CATEGORICAL.length) + CATEGORICAL.length) % CATEGORICAL.length];
}
