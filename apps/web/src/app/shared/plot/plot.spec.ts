import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { describe, expect, it, vi } from 'vitest';
import { ThemeMode } from '../../core/layout/theme-mode';
import { PALETTE_DARK, PLOT_ROLES } from './palette';
import { Plot } from './plot';
import { PlotlyLoader } from './plotly-loader';

interface Drawn {
  data: Array<Record<string, unknown>>;
  layout: Record<string, Record<string, unknown>>;
  config: Record<string, unknown>;
}

@Component({
  imports: [Plot],
  template: `<p class="numbers">Ea = 0.55 eV</p>
    <rt-plot [data]="data()" [layout]="layout()" label="Resistivity against temperature" />`,
})
class Host {
  readonly data = signal<unknown[]>([]);
  readonly layout = signal<Record<string, unknown>>({ yaxis: { type: 'log' } });
}

function setup(dark = false) {
  const drawn: Drawn[] = [];
  const relayout = vi.fn(async () => undefined);
  const plotly = {
    react: async (
      _e: HTMLElement,
      data: Drawn['data'],
      layout: Drawn['layout'],
      config: object,
    ) => {
      drawn.push({ data, layout, config: config as Record<string, unknown> });
      return { on: () => undefined, layout };
    },
    relayout,
    purge: () => undefined,
  };
  TestBed.configureTestingModule({
    imports: [Host],
    providers: [
      {
        provide: PlotlyLoader,
        useValue: { load: () => Promise.resolve(plotly) },
      },
      { provide: ThemeMode, useValue: { dark: signal(dark) } },
    ],
  });
  const fixture = TestBed.createComponent(Host);
  return { fixture, drawn, relayout };
}

async function settle(fixture: { detectChanges(): void; whenStable(): Promise<unknown> }) {
  fixture.detectChanges();
  await fixture.whenStable();
  await new Promise((r) => setTimeout(r, 50));
  fixture.detectChanges();
}

const sweep = (n: number) => {
  const x = Array.from({ length: n }, (_, i) => 25 + (455 * i) / n);
  return {
    type: 'scatter',
    mode: 'markers',
    name: 'measured',
    x,
    y: x.map((t) => 1 / t),
    marker: { color: PLOT_ROLES.measured },
  };
};

describe('Plot', () => {
  it('replaces plotly’s mode bar with its own toolbar', async () => {
    const { fixture, drawn } = setup();
    fixture.componentInstance.data.set([sweep(10)]);
    await settle(fixture);
    expect(drawn.at(-1)!.config['displayModeBar']).toBe(false);
    const buttons = [...fixture.nativeElement.querySelectorAll('.toolbar button')].map((b) =>
      (b as HTMLElement).textContent!.trim(),
    );
    expect(buttons).toEqual(['Save image', 'Reset axes', 'Log y']);
  });

  it('thins a 100,000-point trace to at most 5,000 and says so under the plot', async () => {
    const { fixture, drawn } = setup();
    fixture.componentInstance.data.set([sweep(100_000)]);
    await settle(fixture);
    const trace = drawn.at(-1)!.data[0]!;
    expect((trace['x'] as number[]).length).toBeLessThanOrEqual(5000);
    const note = fixture.nativeElement.querySelector('[data-testid="plot-thinning"]');
    expect(note.textContent).toContain('100,000 points drawn as');
    expect(note.textContent).toContain('Fits, tables and exports use every point');
  });

  it('labels a log axis with whole values and toggles it to linear', async () => {
    const { fixture, drawn } = setup();
    fixture.componentInstance.data.set([sweep(200)]);
    await settle(fixture);
    const y = drawn.at(-1)!.layout['yaxis']!;
    expect(y['type']).toBe('log');
    expect(y['ticktext']).toContain('0.005');
    const toggle = fixture.nativeElement.querySelectorAll('.toolbar button')[2] as HTMLElement;
    expect(toggle.getAttribute('aria-pressed')).toBe('true');
    toggle.click();
    await settle(fixture);
    expect(drawn.at(-1)!.layout['yaxis']!['type']).toBe('linear');
    expect(toggle.getAttribute('aria-pressed')).toBe('false');
  });

  it('resets both axes to the data', async () => {
    const { fixture, relayout } = setup();
    fixture.componentInstance.data.set([sweep(20)]);
    await settle(fixture);
    (fixture.nativeElement.querySelectorAll('.toolbar button')[1] as HTMLElement).click();
    await settle(fixture);
    expect(relayout).toHaveBeenCalledWith(expect.anything(), {
      'xaxis.autorange': true,
      'yaxis.autorange': true,
    });
  });

  it('draws palette colours in their dark-scheme form', async () => {
    const { fixture, drawn } = setup(true);
    fixture.componentInstance.data.set([sweep(20)]);
    await settle(fixture);
    const marker = drawn.at(-1)!.data[0]!['marker'] as { color: string };
    expect(marker.color).toBe(PALETTE_DARK[0]);
  });

  it('shows the page’s numbers while plotly is still loading', async () => {
    TestBed.configureTestingModule({
      imports: [Host],
      providers: [
        {
          provide: PlotlyLoader,
          useValue: { load: () => new Promise(() => undefined) },
        },
        { provide: ThemeMode, useValue: { dark: signal(false) } },
      ],
    });
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.data.set([sweep(20)]);
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('.numbers').textContent).toContain('0.55 eV');
    expect(fixture.nativeElement.textContent).toContain('Drawing the plot…');
  });
});

@Component({
  imports: [Plot],
  template: `<rt-plot [data]="below()" label="Below the fold" />
    <rt-plot [data]="shown()" label="On screen" />`,
})
class TwoPlots {
  readonly below = signal<unknown[]>([sweep(30)]);
  readonly shown = signal<unknown[]>([sweep(20)]);
}

describe('Plot: what is drawn when', () => {
  it('redraws in idle time, so input on the page comes first', async () => {
    const { fixture, drawn } = setup();
    const idle = vi.fn((run: () => void) => setTimeout(run, 20));
    vi.stubGlobal('requestIdleCallback', idle);
    try {
      fixture.componentInstance.data.set([sweep(40)]);
      await settle(fixture);
      // The first draw of a plot on screen does not wait.
      expect(drawn).toHaveLength(1);
      expect(idle).not.toHaveBeenCalled();
      fixture.componentInstance.data.set([sweep(41)]);
      await settle(fixture);
      expect(idle).toHaveBeenCalledTimes(1);
      expect(drawn).toHaveLength(2);
    } finally {
      vi.unstubAllGlobals();
    }
  });

  it('drops a redraw still waiting for idle time when the page is left', async () => {
    const { fixture, drawn } = setup();
    fixture.componentInstance.data.set([sweep(40)]);
    await settle(fixture);
    const waiting: Array<() => void> = [];
    vi.stubGlobal('requestIdleCallback', (run: () => void) => waiting.push(run));
    try {
      fixture.componentInstance.data.set([sweep(41)]);
      await settle(fixture);
      expect(waiting).toHaveLength(1);
      fixture.destroy();
      waiting[0]!();
      await new Promise((r) => setTimeout(r, 20));
      expect(drawn).toHaveLength(1);
    } finally {
      vi.unstubAllGlobals();
    }
  });

  it('draws a figure equal to the one drawn once only', async () => {
    const { fixture, drawn } = setup();
    fixture.componentInstance.data.set([sweep(50)]);
    await settle(fixture);
    expect(drawn).toHaveLength(1);
    // Recomputed by the page (new arrays, same values): nothing to redraw.
    fixture.componentInstance.data.set([sweep(50)]);
    fixture.componentInstance.layout.set({ yaxis: { type: 'log' } });
    await settle(fixture);
    expect(drawn).toHaveLength(1);
    fixture.componentInstance.data.set([sweep(51)]);
    await settle(fixture);
    expect(drawn).toHaveLength(2);
  });

  it('draws the plot on screen before one below the fold, which waits for idle time', async () => {
    const order: string[] = [];
    const plotly = {
      react: async (element: HTMLElement, data: unknown[], layout: object) => {
        order.push(element.closest('figure')!.getAttribute('aria-label')!);
        return { on: () => undefined, layout, data };
      },
      purge: () => undefined,
    };
    TestBed.configureTestingModule({
      imports: [TwoPlots],
      providers: [
        { provide: PlotlyLoader, useValue: { load: () => Promise.resolve(plotly) } },
        { provide: ThemeMode, useValue: { dark: signal(false) } },
      ],
    });
    // The window is 768 px tall: the first plot is laid out far below it.
    const box = vi
      .spyOn(HTMLElement.prototype, 'getBoundingClientRect')
      .mockImplementation(function (this: HTMLElement) {
        const below = this.closest('figure')?.getAttribute('aria-label') === 'Below the fold';
        const top = below ? 5000 : 100;
        return DOMRect.fromRect({ x: 0, y: top, width: 600, height: 400 });
      });
    const idle = vi.fn((run: () => void) => setTimeout(run, 20));
    vi.stubGlobal('requestIdleCallback', idle);
    try {
      const fixture = TestBed.createComponent(TwoPlots);
      await settle(fixture);
      expect(order).toEqual(['On screen', 'Below the fold']);
      expect(idle).toHaveBeenCalledTimes(1);
    } finally {
      box.mockRestore();
      vi.unstubAllGlobals();
    }
  });
});
