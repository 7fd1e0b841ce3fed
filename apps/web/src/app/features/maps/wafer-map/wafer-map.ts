import {
  ChangeDetectionStrategy,
  Component,
  type ElementRef,
  computed,
  input,
  signal,
  viewChild,
} from '@angular/core';
import type { MapAtTemperatureDto, MapSiteDto, SweepMapInfo } from '@rhotrace/api-types';
import { formatValue } from '../../../shared/format';
import { type ColourRange, VIRIDIS_STOPS, scalePosition, viridis } from '../colour-scale';
import { outlinePath } from '../map-geometry';
import { surfaceCells } from '../map-surface';

/** Numbers the instances, so each map's clip path and gradient ids are its own. */
let instances = 0;

/** Words for one site, as the readout and the site's accessible name give them. */
export function siteWords(site: MapSiteDto, index: number): string {
  const name = site.label ? `Site ${site.label}` : `Site ${index + 1}`;
  const where = `x ${formatValue(site.xMm, 3)} mm, y ${formatValue(site.yMm, 3)} mm`;
  const sheet =
    site.sheetResistanceOhmSq === null ? '' : `, ${formatValue(site.sheetResistanceOhmSq)} Ω/sq`;
  const edge = site.edgeFactor === 1 ? '' : `, edge factor ${site.edgeFactor.toFixed(4)}`;
  const excluded = site.excluded ? ' (inside the edge exclusion, not counted)' : '';
  return `${name} (${where}): ${formatValue(site.resistivityOhmCm)} Ω·cm${sheet}${edge}${excluded}`;
}

/**
 * One wafer map drawn in SVG: the outline with its flat or notch, the interpolated surface
 * inside the edge exclusion, each site coloured on the viridis scale, and a labelled colour
 * bar. Sites are read by hovering or from the keyboard: the map is one tab stop, arrow keys
 * move from site to site, Home and End go to the first and last, and the readout below says
 * the site's value.
 */
@Component({
  selector: 'rt-wafer-map',
  templateUrl: './wafer-map.html',
  styleUrl: './wafer-map.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WaferMap {
  readonly map = input.required<MapAtTemperatureDto>();
  readonly info = input.required<SweepMapInfo>();
  readonly outline = input<'flat' | 'notch'>('flat');
  /** A shared scale (the lot view); by default the map's own counted sites. */
  readonly range = input<ColourRange | null>(null);
  /** Title drawn in the picture (kept in the PNG). */
  readonly caption = input('');
  /** Grid cells across the surface (fewer for small maps). */
  readonly cells = input(48);
  readonly showBar = input(true);

  /** Prefix of this map's element ids. */
  protected readonly uid = `rt-map-${++instances}`;
  private readonly svg = viewChild<ElementRef<SVGSVGElement>>('svg');
  protected readonly active = signal(0);
  protected readonly hovered = signal<number | null>(null);
  /** The bar's gradient from the top (highest value) down; SVG wants offsets increasing. */
  protected readonly stops = [...VIRIDIS_STOPS].reverse().map((c, i) => ({
    colour: c,
    offset: `${(100 * i) / (VIRIDIS_STOPS.length - 1)}%`,
  }));

  protected readonly radius = computed(() => this.info().diameterMm / 2);
  protected readonly usable = computed(() => this.radius() - this.info().edgeExclusionMm);
  protected readonly path = computed(() => outlinePath(this.info().diameterMm, this.outline()));
  /** The view box: the wafer, a margin, and room for the bar at the right. */
  protected readonly viewBox = computed(() => {
    const r = this.radius();
    const m = 0.12 * r;
    const bar = this.showBar() ? 0.75 * r : 0;
    return `${-r - m} ${-r - m - 0.12 * r} ${2 * (r + m) + bar} ${2 * (r + m) + 0.12 * r}`;
  });

  protected readonly scale = computed<ColourRange>(() => {
    const given = this.range();
    if (given) return given;
    const counted = this.map().sites.filter((s) => !s.excluded);
    const values = (counted.length ? counted : this.map().sites).map((s) => s.resistivityOhmCm);
    return { min: Math.min(...values), max: Math.max(...values) };
  });

  protected readonly cellsDrawn = computed(() =>
    surfaceCells(this.map().sites, this.usable(), this.cells(), this.scale()).map((c) => ({
      x: c.xMm - c.sizeMm / 2,
      y: -c.yMm - c.sizeMm / 2,
      // a hair over a cell, so anti-aliasing leaves no seams between cells
      size: c.sizeMm * 1.02,
      fill: viridis(scalePosition(c.value, this.scale())),
    })),
  );

  protected readonly sites = computed(() => {
    const r = this.radius();
    return this.map().sites.map((s, i) => ({
      site: s,
      cx: s.xMm,
      cy: -s.yMm,
      r: 0.035 * r,
      fill: viridis(scalePosition(s.resistivityOhmCm, this.scale())),
      words: siteWords(s, i),
    }));
  });

  /** The bar's ticks: min, middle, max of the scale. */
  protected readonly ticks = computed(() => {
    const { min, max } = this.scale();
    const r = this.radius();
    const top = -0.8 * r;
    const height = 1.6 * r;
    return [0, 0.5, 1].map((t) => ({
      y: top + (1 - t) * height,
      text: formatValue(min + t * (max - min)),
    }));
  });

  /** The readout: the hovered site, else the keyboard's site. */
  protected readonly readout = computed(() => {
    const i = this.hovered() ?? this.active();
    const s = this.sites()[i];
    return s ? s.words : 'No site';
  });

  /** Moves the keyboard's site with the arrow keys, Home and End. */
  protected onKey(event: KeyboardEvent): void {
    const n = this.sites().length;
    if (!n) return;
    const moves: Record<string, number> = {
      ArrowRight: this.active() + 1,
      ArrowDown: this.active() + 1,
      ArrowLeft: this.active() - 1,
      ArrowUp: this.active() - 1,
      Home: 0,
      End: n - 1,
    };
    const next = moves[event.key];
    if (next === undefined) return;
    event.preventDefault();
    this.hovered.set(null);
    this.active.set((next + n) % n);
    const circles = this.svg()?.nativeElement.querySelectorAll<SVGCircleElement>('circle.site');
    circles?.[this.active()]?.focus();
  }

  /** The drawn map as an SVG element (for the PNG export). */
  element(): SVGSVGElement | null {
    return this.svg()?.nativeElement ?? null;
  }

  protected focusSite(i: number): void {
    this.active.set(i);
  }
}
