/**
 * Rhotrace's plot colours: six of our own for each scheme, chosen by a search that maximised the
 * smallest CIELAB colour difference between any two of them as seen with normal vision and with
 * simulated protanopia, deuteranopia and tritanopia (Machado, Oliveira & Fernandes, IEEE TVCG 15,
 * 1291 (2009), severity 1), keeping each at 3:1 contrast or more against its scheme's plot
 * background (WCAG 2.1, success criterion 1.4.11, non-text contrast). palette.spec.ts checks both
 * properties by those formulas; the dark set is lighter so it keeps the contrast on a dark page.
 * Roles: blue-black for what was measured, burnt orange for the model, sky blue for fits.
 */
export const PALETTE_LIGHT = [
  '#1B307F', // navy
  '#934011', // burnt orange
  '#2B8CC4', // sky blue
  '#3C0A27', // aubergine
  '#BD8D00', // ochre
  '#6D5549', // taupe
] as const;

/** The same six roles for the dark scheme, in the same order. */
export const PALETTE_DARK = [
  '#879AFC', // periwinkle
  '#E1711B', // orange
  '#9AF0DC', // mint
  '#B15D98', // mauve
  '#E8E06A', // straw
  '#A49B77', // khaki
] as const;

/** The plot backgrounds the palettes were checked against (the page surfaces). */
export const PLOT_BACKGROUND = { light: '#FFFFFF', dark: '#1B1B1F' } as const;

/** The colour of the n-th series (light scheme; the plot maps it for the dark one). */
export function seriesColour(n: number): string {
  return PALETTE_LIGHT[n % PALETTE_LIGHT.length] ?? PALETTE_LIGHT[0];
}

/** Roles of the colours in single-sweep plots. */
export const PLOT_ROLES = {
  measured: PALETTE_LIGHT[0],
  model: PALETTE_LIGHT[1],
  fit: PALETTE_LIGHT[2],
  window: PALETTE_LIGHT[4],
  band: PALETTE_LIGHT[5],
} as const;

const DARK_OF = new Map<string, string>(PALETTE_LIGHT.map((c, i) => [c, PALETTE_DARK[i]!]));

/** A palette colour as the given scheme draws it (other colours unchanged). */
export function schemeColour(colour: string, dark: boolean): string {
  return dark ? (DARK_OF.get(colour.toUpperCase()) ?? colour) : colour;
}
