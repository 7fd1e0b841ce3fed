import { describe, expect, it } from 'vitest';
import { onScreen, sameValue } from './draw-timing';

describe('sameValue', () => {
  it('compares figures all the way down', () => {
    const figure = () => ({
      data: [{ x: [1, 2, 3], y: [4, 5, 6], marker: { color: '#123456', size: 6 } }],
      layout: { yaxis: { type: 'log', range: [0, 1] }, shapes: [] },
    });
    expect(sameValue(figure(), figure())).toBe(true);
    const moved = figure();
    moved.data[0]!.y[2] = 6.0001;
    expect(sameValue(figure(), moved)).toBe(false);
    const renamed = { ...figure(), layout: { ...figure().layout, title: 'ρ(T)' } };
    expect(sameValue(figure(), renamed)).toBe(false);
    // An array is not an object with the same keys; a missing key is not an undefined one.
    expect(sameValue([1, 2], { 0: 1, 1: 2 })).toBe(false);
    expect(sameValue({ a: undefined }, { b: undefined })).toBe(false);
    expect(sameValue([NaN], [NaN])).toBe(true);
    expect(sameValue(null, {})).toBe(false);
  });
});

describe('onScreen', () => {
  const at = (top: number, height: number, width = 300) => {
    const element = document.createElement('div');
    element.getBoundingClientRect = () => DOMRect.fromRect({ x: 10, y: top, width, height });
    return element;
  };

  it('says whether any of an element is inside the window', () => {
    const below = window.innerHeight + 1;
    expect(onScreen(at(100, 200))).toBe(true);
    expect(onScreen(at(below - 50, 200))).toBe(true);
    expect(onScreen(at(below, 200))).toBe(false);
    expect(onScreen(at(-300, 200))).toBe(false);
    // Not laid out (no size): counted as shown, nothing is put before it.
    expect(onScreen(at(0, 0, 0))).toBe(true);
  });
});
