/**
 * When a plot draws. A plotly draw is one long task (tens of milliseconds for a few hundred SVG
 * markers), so only the first draw of a plot on screen goes at once; plots off screen, and
 * redraws (a model curve come in, a unit changed), wait for the browser's idle time, where they
 * do not stand between the reader's input and the page.
 */

/** How long a draw waits for an idle moment before going anyway, ms. */
export const IDLE_DRAW_TIMEOUT_MS = 1000;

/** Resolves after the browser has painted what is on the page (the numbers before the plot). */
export function afterPaint(): Promise<void> {
  return new Promise((resolve) => {
    const frame = globalThis.requestAnimationFrame;
    if (typeof frame === 'function') frame(() => setTimeout(resolve));
    else setTimeout(resolve);
  });
}

/** Resolves in the browser's next idle moment (or after `timeoutMs` if none comes). */
export function whenIdle(timeoutMs = IDLE_DRAW_TIMEOUT_MS): Promise<void> {
  return new Promise((resolve) => {
    const idle = globalThis.requestIdleCallback;
    if (typeof idle === 'function') idle(() => resolve(), { timeout: timeoutMs });
    else setTimeout(resolve);
  });
}

/**
 * Whether any of the element shows in the window. An element with no size (not laid out, or in
 * a test's document) counts as shown: there is nothing to put before it.
 */
export function onScreen(element: HTMLElement): boolean {
  const box = element.getBoundingClientRect();
  if (box.width === 0 && box.height === 0) return true;
  const view = element.ownerDocument.defaultView;
  const height = view?.innerHeight ?? Infinity;
  const width = view?.innerWidth ?? Infinity;
  return box.bottom > 0 && box.top < height && box.right > 0 && box.left < width;
}

/**
 * Whether two plain values (numbers, strings, booleans, null, arrays and plain objects, as plot
 * figures are made of) are equal all the way down: a page that computes the same figure again
 * (a signal it reads changed something the figure does not show) is not redrawn.
 */
export function sameValue(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameValue(a[i], b[i])) return false;
    return true;
  }
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  if (ka.length !== kb.length) return false;
  const rb = b as Record<string, unknown>;
  const ra = a as Record<string, unknown>;
  return ka.every((k) => Object.prototype.hasOwnProperty.call(rb, k) && sameValue(ra[k], rb[k]));
}
