import { ChangeDetectionStrategy, Component } from '@angular/core';

@Component({
  selector: 'rt-sweep-study',
  template: '<div class="rt-page"><h1 class="rt-page-title">SweepStudy</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepStudy {}
