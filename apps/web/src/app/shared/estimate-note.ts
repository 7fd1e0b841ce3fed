import { ChangeDetectionStrategy, Component } from '@angular/core';

/** The standing note beside computed results. */
@Component({
  selector: 'rt-estimate-note',
  template: `<p class="note">
    Engineering estimate from the measured data and the stated model; not a certified value.
  </p>`,
  styles: `
    .note {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      margin: 6px 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EstimateNote {}
