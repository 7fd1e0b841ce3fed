import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'rt-wafer-page',
  template: '<div class="rt-page"><h1 class="rt-page-title">WaferPage</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WaferPage {}
