import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatSliderModule } from '@angular/material/slider';
import { catchError, of } from 'rxjs';
import { FormatValuePipe } from '../../../shared/format-value';
import { MapsApi } from '../maps-api';
import { saveSvgAsPng } from '../map-png';
import { WaferMap } from '../wafer-map/wafer-map';
import { Downloader } from '../../../shared/download';

/** Words for each edge correction. */
const CORRECTION_WORDS: Record<string, string> = {
  'edge-images':
    'Four-point readings divided by the edge factor of the method of images (probe line ' +
    'pointing at the edge; Valdes 1954).',
  'dual-configuration':
    'Sheet resistance from both probe configurations (Rymaszewski 1969; SEMI MF1529), which ' +
    'corrects for the edge itself.',
  none: 'No edge correction: the method reads no collinear probe.',
};

/**
 * A map sweep's map: the picture at one temperature step with a slider over the steps, the
 * uniformity beside it, a table of every site, and PNG export. Shows nothing for a sweep that is
 * no map.
 */
@Component({
  selector: 'rt-map-view',
  imports: [WaferMap, MatSliderModule, MatButtonModule, FormatValuePipe],
  templateUrl: './map-view.html',
  styleUrl: './map-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MapView {
  private readonly api = inject(MapsApi);
  private readonly downloader = inject(Downloader);
  readonly sweepId = input.required<number>();

  protected readonly data = rxResource({
    params: () => this.sweepId(),
    stream: ({ params }) => this.api.sweepMap(params).pipe(catchError(() => of(null))),
  });
  /** Index of the temperature step shown; by default the one nearest 23 °C. */
  protected readonly chosen = signal<number | null>(null);
  protected readonly step = computed(() => {
    const d = this.data.value();
    if (!d?.maps.length) return 0;
    const picked = this.chosen();
    if (picked !== null && picked < d.maps.length) return picked;
    let best = 0;
    d.maps.forEach((m, i) => {
      if (Math.abs(m.temperatureK - 296.15) < Math.abs(d.maps[best]!.temperatureK - 296.15))
        best = i;
    });
    return best;
  });
  protected readonly shown = computed(() => this.data.value()?.maps[this.step()] ?? null);
  protected readonly showTable = signal(false);
  protected readonly correctionWords = computed(
    () => CORRECTION_WORDS[this.data.value()?.map.correction ?? 'none'] ?? '',
  );
  protected readonly caption = computed(() => {
    const m = this.shown();
    return m ? `Sweep ${this.sweepId()} · ${m.temperatureK.toFixed(1)} K` : '';
  });

  private readonly picture = viewChild(WaferMap);

  protected temperatureLabel = (index: number): string => {
    const t = this.data.value()?.maps[index]?.temperatureK;
    return t === undefined ? '' : `${Math.round(t)} K`;
  };

  /** Every site at every step, then each step's uniformity statistics (the API's CSV). */
  protected saveCsv(): void {
    const id = this.sweepId();
    void this.downloader.save(`/api/sweeps/${id}/map.csv`, `sweep-${id}-map.csv`);
  }

  protected async savePng(): Promise<void> {
    const svg = this.picture()?.element();
    const m = this.shown();
    if (!svg || !m) return;
    await saveSvgAsPng(svg, `sweep-${this.sweepId()}-map-${m.temperatureK.toFixed(0)}K.png`);
  }
}
