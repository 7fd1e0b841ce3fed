import { TestBed } from '@angular/core/testing';
import type { MapAtTemperatureDto, MapSiteDto, SweepMapInfo } from '@rhotrace/api-types';
import { WaferMap } from './wafer-map';

const site = (label: string, xMm: number, value: number, excluded = false): MapSiteDto => ({
  xMm,
  yMm: 0,
  label,
  sheetResistanceOhmSq: null,
  resistivityOhmCm: value,
  edgeFactor: 1,
  excluded,
  readingCount: 1,
});

const info: SweepMapInfo = {
  diameterMm: 100,
  edgeExclusionMm: 3,
  pattern: null,
  correction: 'none',
  probeSpacingMm: null,
};

const map: MapAtTemperatureDto = {
  temperatureK: 296.15,
  sites: [site('A', -20, 10), site('B', 0, 11), site('C', 48.5, 30, true)],
  statistics: null,
};

async function render() {
  const fixture = TestBed.createComponent(WaferMap);
  fixture.componentRef.setInput('map', map);
  fixture.componentRef.setInput('info', info);
  fixture.componentRef.setInput('caption', 'Test map');
  fixture.detectChanges();
  await fixture.whenStable();
  const host = fixture.nativeElement as HTMLElement;
  return {
    fixture,
    circles: () => [...host.querySelectorAll<SVGCircleElement>('circle.site')],
    readout: () => host.querySelector('figcaption')!.textContent!.trim(),
  };
}

describe('WaferMap', () => {
  it('is one tab stop whose arrow keys walk the sites and say each value', async () => {
    const { fixture, circles, readout } = await render();
    expect(circles().map((c) => c.getAttribute('tabindex'))).toEqual(['0', '-1', '-1']);
    expect(readout()).toMatch(/^Site A \(x -20 mm, y 0 mm\): 10 Ω·cm$/);
    circles()[0]!.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    fixture.detectChanges();
    expect(readout()).toMatch(/^Site B .*: 11 Ω·cm$/);
    expect(circles()[1]!.getAttribute('tabindex')).toBe('0');
    circles()[1]!.dispatchEvent(new KeyboardEvent('keydown', { key: 'End', bubbles: true }));
    fixture.detectChanges();
    expect(readout()).toMatch(/^Site C .*30 Ω·cm \(inside the edge exclusion, not counted\)$/);
  });

  it('colours by the counted sites, so an excluded edge site does not stretch the scale', async () => {
    const { circles } = await render();
    // Viridis ends (#440154 and #fde725): A is the lowest counted value, B the highest, and
    // C (30, excluded) is drawn at the top end.
    expect(circles()[0]!.getAttribute('fill')).toBe('rgb(68, 1, 84)');
    expect(circles()[1]!.getAttribute('fill')).toBe('rgb(253, 231, 37)');
    expect(circles()[2]!.getAttribute('fill')).toBe('rgb(253, 231, 37)');
    expect(circles()[2]!.getAttribute('stroke-dasharray')).not.toBeNull();
  });
});
