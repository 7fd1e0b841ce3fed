import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormatValuePipe } from '../../../shared/format-value';
import { MapsApi } from '../maps-api';
import { WaferMap } from '../wafer-map/wafer-map';

/**
 * Every map wafer of a lot side by side at the step nearest 23 °C, all on one colour scale, so
 * colours compare across wafers. Shows nothing for a lot without maps.
 */
@Component({
  selector: 'rt-lot-maps',
  imports: [WaferMap, FormatValuePipe],
  template: `
    @if (data.value(); as d) {
      @if (d.wafers.length && d.scale) {
        <section aria-labelledby="lot-maps-title">
          <h2 id="lot-maps-title" class="rt-section-title">Wafer maps</h2>
          <p class="rt-muted">
            Each wafer's newest map at the step nearest 23 °C, on one scale from
            {{ d.scale.minOhmCm | value }} to {{ d.scale.maxOhmCm | value }} Ω·cm (the counted sites
            of all wafers).
          </p>
          <div class="grid">
            @for (w of d.wafers; track w.waferId) {
              <rt-wafer-map
                [map]="w.atTemperature"
                [info]="w.map"
                [outline]="w.outline"
                [range]="range()"
                [cells]="28"
                [caption]="w.waferNumber + ' · ' + w.atTemperature.temperatureK.toFixed(1) + ' K'"
              />
            }
          </div>
        </section>
      }
    }
  `,
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(16rem, 1fr));
      gap: 1rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LotMaps {
  private readonly api = inject(MapsApi);
  readonly lotId = input.required<number>();
  protected readonly data = rxResource({
    params: () => this.lotId(),
    stream: ({ params }) => this.api.lotMaps(params),
  });
  protected readonly range = computed(() => {
    const s = this.data.value()?.scale;
    return s ? { min: s.minOhmCm, max: s.maxOhmCm } : null;
  });
}
