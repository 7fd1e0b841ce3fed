/**
 * Plot colours from Okabe & Ito (2008), "Color Universal Design (CUD): how to make figures and
 * presentations that are friendly to colorblind people" — distinguishable with the common forms
 * of colour-vision deficiency. Order chosen so the first pair (blue, vermillion) is the strongest.
 */
export const OKABE_ITO = [
  '#0072B2', // blue
  '#D55E00', // vermillion
  '#009E73', // bluish green
  '#CC79A7', // reddish purple
  '#E69F00', // orange
  '#56B4E9', // sky blue
  '#F0E442', // yellow
  '#000000', // black
] as const;

/** The colour of the n-th series, cycling through the palette. */
export function seriesColour(n: number): string {
  return OKABE_ITO[n % OKABE_ITO.length] ?? OKABE_ITO[0];
}

/** Roles of the colours in single-sweep plots. */
export const PLOT_ROLES = {
  measured: OKABE_ITO[0],
  model: OKABE_ITO[1],
  fit: OKABE_ITO[2],
  band: OKABE_ITO[5],
  window: OKABE_ITO[4],
} as const;
