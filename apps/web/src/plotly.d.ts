/** The few Plotly calls Rhotrace makes (the dist bundle ships no types). */
declare module 'plotly.js-dist-min' {
  export interface PlotlyHTMLElement extends HTMLElement {
    on(event: string, handler: (event: unknown) => void): void;
    removeAllListeners?(event: string): void;
    /** The layout as drawn (axes with their current type and range). */
    layout?: Record<string, { type?: string } | undefined>;
  }
  export function react(
    element: HTMLElement,
    data: unknown[],
    layout?: Record<string, unknown>,
    config?: Record<string, unknown>,
  ): Promise<PlotlyHTMLElement>;
  export function purge(element: HTMLElement): void;
  export function relayout(element: HTMLElement, update: Record<string, unknown>): Promise<unknown>;
  export function downloadImage(
    element: HTMLElement,
    options: { format: 'png' | 'svg'; filename: string; width?: number; height?: number },
  ): Promise<string>;
  export function toImage(
    element: HTMLElement,
    options: { format: 'png' | 'svg'; width?: number; height?: number },
  ): Promise<string>;
  export const Plots: { resize(element: HTMLElement): void };
  const Plotly: {
    react: typeof react;
    purge: typeof purge;
    relayout: typeof relayout;
    downloadImage: typeof downloadImage;
    toImage: typeof toImage;
    Plots: typeof Plots;
  };
  export default Plotly;
}
